package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;
import java.util.stream.IntStream;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;

/**
 * A hardware timer family that raises the sample-rate interrupt: its counter width, the prescalers it
 * offers and the register that holds the reload value. In every family one interrupt period is
 * {@code prescaler × (reload + 1)} clock cycles.
 *
 * <p>Prescaler sets and register names are those of the datasheets: ATmega328P Timer/Counter0/1/2 in CTC
 * mode (Microchip ATmega328P datasheet, clock select bits CSn2:0); the ARMv7-M SysTick (24-bit, reload in
 * SYST_RVR, clocked by the processor clock; ARMv7-M Architecture Reference Manual, B3.3); a general-purpose
 * timer with a 16-bit prescaler register (PSC = prescaler − 1) and a 16- or 32-bit auto-reload register ARR,
 * as on STM32 TIMx. The option names say what is driven ({@code general16}: a general-purpose timer with a
 * 16-bit counter), not which vendor peripheral the template defaults to.
 *
 * <p>{@link #RP2040_ALARM} is different: the RP2040's TIMER counts microseconds from its own 1 MHz tick
 * whatever the CPU clock, and the player moves alarm 0 on by the period at each interrupt, carrying the
 * fraction of a microsecond over ({@link AlarmPeriod}); it has no prescaler and no reload.
 */
public enum TimerKind {
    /** AVR 8-bit Timer/Counter0, CTC on OCR0A. */
    AVR_TIMER0("timer0", 8, new int[] {1, 8, 64, 256, 1024}, "OCR0A"),
    /** AVR 16-bit Timer/Counter1, CTC on OCR1A. */
    AVR_TIMER1("timer1", 16, new int[] {1, 8, 64, 256, 1024}, "OCR1A"),
    /** AVR 8-bit Timer/Counter2 (asynchronous-capable), CTC on OCR2A. */
    AVR_TIMER2("timer2", 8, new int[] {1, 8, 32, 64, 128, 256, 1024}, "OCR2A"),
    /** Cortex-M SysTick: 24-bit down counter, no prescaler. */
    SYSTICK("systick", 24, new int[] {1}, "SYST_RVR"),
    /** General-purpose timer, 16-bit counter, prescaler 1..65536 (TIM3 of an STM32F4 by default). */
    GENERAL16("general16", 16, null, "ARR"),
    /** General-purpose timer, 32-bit counter, prescaler 1..65536 (TIM2 of an STM32F4 by default). */
    GENERAL32("general32", 32, null, "ARR"),
    /** RP2040 TIMER alarm 0 over the 1 MHz microsecond count, moved on by the period at every tick. */
    RP2040_ALARM("alarm", 32, new int[] {1}, "ALARM0");

    private static final int GENERAL_MAX_PRESCALER = 65536;

    private final String optionName;
    private final int counterBits;
    private final int[] prescalers;
    private final String reloadRegister;

    TimerKind(String optionName, int counterBits, int[] prescalers, String reloadRegister) {
        this.optionName = optionName;
        this.counterBits = counterBits;
        this.prescalers = prescalers;
        this.reloadRegister = reloadRegister;
    }

    /** The option spelling, e.g. {@code timer1}, {@code systick}, {@code general16}. */
    public String optionName() {
        return optionName;
    }

    /** Counter width in bits. */
    public int counterBits() {
        return counterBits;
    }

    /** The largest reload value: 2^bits − 1. */
    public long maxReload() {
        return (1L << counterBits) - 1;
    }

    /** Name of the reload register as the datasheet writes it. */
    public String reloadRegister() {
        return reloadRegister;
    }

    /** True for the microsecond alarm, whose period is not prescaler × (reload + 1) clock cycles. */
    public boolean microsecondAlarm() {
        return this == RP2040_ALARM;
    }

    /** True for a free prescaler 1..65536 rather than a fixed set. */
    public boolean continuousPrescaler() {
        return prescalers == null;
    }

    /** The available prescalers in ascending order. */
    public IntStream prescalers() {
        return prescalers == null ? IntStream.rangeClosed(1, GENERAL_MAX_PRESCALER) : IntStream.of(prescalers);
    }

    /** The largest prescaler. */
    public int maxPrescaler() {
        return prescalers == null ? GENERAL_MAX_PRESCALER : prescalers[prescalers.length - 1];
    }

    /** A short description: {@code timer1 (16-bit, prescalers 1/8/64/256/1024)}. */
    public String describe() {
        if (microsecondAlarm()) {
            return optionName + " (a 32-bit alarm on the 1 MHz microsecond count)";
        }
        String p;
        if (prescalers == null) {
            p = "prescaler 1..65536";
        } else if (prescalers.length == 1) {
            p = "no prescaler";
        } else {
            p = "prescalers " + IntStream.of(prescalers).mapToObj(Integer::toString)
                    .collect(Collectors.joining("/"));
        }
        return optionName + " (" + counterBits + "-bit, " + p + ")";
    }

    /**
     * Parses the option spelling.
     *
     * @throws InputError when the text names no timer, or names one by its former spelling (the message
     *     gives the new one)
     */
    public static TimerKind parse(String text) {
        String t = text == null ? "" : text.trim().toLowerCase(Locale.ROOT);
        List<String> names = new ArrayList<>();
        for (TimerKind k : values()) {
            if (k.optionName.equals(t)) {
                return k;
            }
            names.add(k.optionName);
        }
        // the spellings before the general-purpose timers were named for what they are
        if (t.equals("tim16") || t.equals("tim32")) {
            throw Setting.TIMER.error("'%s' is now called general%s (a general-purpose timer with a %s-bit"
                    + " counter)", text, t.substring(3), t.substring(3));
        }
        throw Setting.TIMER.error("'%s' is unknown; use one of %s", text, String.join(", ", names));
    }
}
