package org.rungtone.firmware;

import java.util.List;
import java.util.Locale;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;

/**
 * A family of target parts with its own template folder: how ports are written, where tables live and
 * which timers can raise the sample interrupt.
 */
public enum TargetFamily {
    /** Portable C99: the user supplies the port write and calls the tick from a timer interrupt. */
    GENERIC("generic", List.of(8, 16, 32), 8, List.of(), null),
    /** 8-bit AVR-class parts (register names of the ATmega328P): PORTx/DDRx, CTC timers, PROGMEM tables. */
    AVR("avr", List.of(8), 8, List.of(TimerKind.AVR_TIMER1, TimerKind.AVR_TIMER0, TimerKind.AVR_TIMER2),
            TimerKind.AVR_TIMER1),
    /** 32-bit Cortex-M-class parts: GPIO with a BSRR set/reset register, SysTick or a general-purpose timer. */
    CORTEXM("cortexm", List.of(16), 16, List.of(TimerKind.SYSTICK, TimerKind.GENERAL16, TimerKind.GENERAL32),
            TimerKind.SYSTICK),
    /**
     * RP2040-class parts (Cortex-M0+): pins GPIO0..GPIO29 of one bank written through the single-cycle IO
     * block's GPIO_OUT_XOR, the tick from TIMER alarm 0 on its 1 MHz microsecond count.
     */
    RP2040("rp2040", List.of(32), 32, List.of(TimerKind.RP2040_ALARM), TimerKind.RP2040_ALARM);

    /** The highest GPIO of an RP2040: GPIO0..GPIO29 (RP2040 datasheet: SIO's GPIO registers have 30 bits). */
    private static final int RP2040_LAST_GPIO = 29;

    private final String folder;
    private final List<Integer> portWidths;
    private final int defaultPortWidth;
    private final List<TimerKind> timers;
    private final TimerKind defaultTimer;

    TargetFamily(String folder, List<Integer> portWidths, int defaultPortWidth, List<TimerKind> timers,
            TimerKind defaultTimer) {
        this.folder = folder;
        this.portWidths = portWidths;
        this.defaultPortWidth = defaultPortWidth;
        this.timers = timers;
        this.defaultTimer = defaultTimer;
    }

    /** The option spelling and template folder name. */
    public String folder() {
        return folder;
    }

    /** Port register widths the family's templates handle. */
    public List<Integer> portWidths() {
        return portWidths;
    }

    /** The port width used when the user gives none. */
    public int defaultPortWidth() {
        return defaultPortWidth;
    }

    /** Timers the templates can program; empty for {@link #GENERIC}, whose user owns the timer. */
    public List<TimerKind> timers() {
        return timers;
    }

    /** The timer used when the user gives none; null for {@link #GENERIC}. */
    public TimerKind defaultTimer() {
        return defaultTimer;
    }

    /** True when port names must be letters (PORTB, GPIOB). */
    public boolean letterPortsOnly() {
        return this == AVR || this == CORTEXM;
    }

    /** True when every pin must be one of the GPIO bank ({@code GPIO3}), as the RP2040 names them. */
    public boolean gpioBankOnly() {
        return this == RP2040;
    }

    /** The highest GPIO number of the bank ({@link #gpioBankOnly()}); 31 where the port width is the limit. */
    public int lastGpio() {
        return this == RP2040 ? RP2040_LAST_GPIO : 31;
    }

    /** True when the timer's rate depends on the CPU clock, which must then be given. */
    public boolean needsCpuClock() {
        return this == AVR || this == CORTEXM;
    }

    /** Flash bytes the family's part can address with its table reads; {@code Long.MAX_VALUE} if no limit. */
    public long maxTableBytes() {
        return this == AVR ? 65536 : Long.MAX_VALUE;
    }

    /**
     * Parses the option spelling.
     *
     * @throws InputError naming the known families when the text names none
     */
    public static TargetFamily parse(String text) {
        String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT);
        for (TargetFamily f : values()) {
            if (f.folder.equals(t)) {
                return f;
            }
        }
        throw Setting.FAMILY.error("'%s' is unknown; known target families: %s", text, knownNames());
    }

    /** The known families as the option spells them: {@code generic, avr, cortexm, rp2040}. */
    public static String knownNames() {
        StringBuilder b = new StringBuilder();
        for (TargetFamily f : values()) {
            if (b.length() > 0) {
                b.append(", ");
            }
            b.append(f.folder);
        }
        return b.toString();
    }
}
