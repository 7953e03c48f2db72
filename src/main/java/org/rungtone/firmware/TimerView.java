package org.rungtone.firmware;

/**
 * Template values of the tick: its rate and, where one was solved, the timer setting that makes it.
 *
 * @param own true when the emitted code programs the timer itself (avr, cortexm, rp2040)
 * @param tickRateHz the requested tick rate in whole hertz
 * @param note what the programmed timer makes, e.g. {@code the timer makes 22038.567 Hz}, or null
 * @param text the timer setting in words, or null without a solved timer
 * @param reload the reload register's value, or null
 * @param prescaler the prescaler, or null
 * @param cyclesPerTick clock cycles between ticks (whole microseconds for rp2040's alarm), or null
 */
record TimerView(boolean own, long tickRateHz, String note, String text, Long reload, Integer prescaler,
        Long cyclesPerTick) {
    /** The values of the plan's tick and timer. */
    static TimerView of(EmitPlan p) {
        boolean own = !p.family.timers().isEmpty();
        long rate = Math.round(p.requestedRateHz);
        if (p.timer.isEmpty()) {
            return new TimerView(own, rate, null, null, null, null, null);
        }
        TimerSetting t = p.timer.get();
        String makes = t.kind().microsecondAlarm() ? "the alarm averages " : "the timer makes ";
        return new TimerView(own, rate, own ? makes + Fmt.plain(t.achievedHz(), 3) + " Hz" : null,
                t.describe(), t.reload(), t.prescaler(), t.cyclesPerTick());
    }
}
