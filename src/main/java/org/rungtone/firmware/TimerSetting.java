package org.rungtone.firmware;

import java.util.Locale;

/**
 * A solved timer configuration: the interrupt fires every {@code prescaler × (reload + 1)} cycles of
 * {@code clockHz}, giving {@code achievedHz}; {@code errorPpm} = (achieved − requested) / requested · 10^6.
 * For the microsecond alarm ({@link TimerKind#microsecondAlarm()}) the clock is its 1 MHz count, reload + 1
 * the whole microseconds of the period, and {@code achievedHz} the average of ticks that carry the fraction
 * of a microsecond over ({@link AlarmPeriod}).
 *
 * @param kind timer family
 * @param clockHz timer input clock (the CPU clock)
 * @param prescaler clock divider
 * @param reload value of the reload register (period − 1)
 * @param requestedHz requested interrupt rate
 * @param achievedHz rate the setting gives
 * @param errorPpm relative error in parts per million
 */
public record TimerSetting(TimerKind kind, double clockHz, int prescaler, long reload, double requestedHz,
        double achievedHz, double errorPpm) {
    /** Clock cycles between interrupts (whole microseconds for the microsecond alarm). */
    public long cyclesPerTick() {
        return prescaler * (reload + 1);
    }

    /** One-line description for reports and header comments. */
    public String describe() {
        if (kind.microsecondAlarm()) {
            return String.format(Locale.ROOT, "%s on the 1 MHz microsecond count: %s += %s per tick, %s on"
                    + " average (%s ppm)", kind.optionName(), kind.reloadRegister(),
                    AlarmPeriod.of(requestedHz).describe(), Fmt.hz(achievedHz), Fmt.ppm(errorPpm));
        }
        String pre = kind.continuousPrescaler() ? String.format(Locale.ROOT, "prescaler %d (PSC = %d)",
                prescaler, prescaler - 1) : kind.prescalers().count() == 1 ? "no prescaler"
                : "prescaler " + prescaler;
        return String.format(Locale.ROOT, "%s at %s: %s, %s = %d (%d cycles per tick), %s (%s ppm)",
                kind.optionName(), Fmt.hz(clockHz), pre, kind.reloadRegister(), reload, cyclesPerTick(),
                Fmt.hz(achievedHz), Fmt.ppm(errorPpm));
    }
}
