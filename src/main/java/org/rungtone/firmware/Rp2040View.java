package org.rungtone.firmware;

/**
 * Template values of the RP2040 player: the period its alarm moves on by at every tick, on the TIMER's
 * 1 MHz microsecond count, as whole microseconds and a fraction the interrupt carries over
 * ({@link AlarmPeriod}), so the ticks average the rate exactly.
 *
 * @param tickMicros whole microseconds per tick
 * @param fractional true when the period has a fraction of a microsecond (the accumulator is emitted)
 * @param tickFraction the fraction, in 1/tickFractionDen µs
 * @param tickFractionDen the fraction's denominator
 */
record Rp2040View(long tickMicros, boolean fractional, long tickFraction, long tickFractionDen) {
    /** The values of an rp2040 plan. */
    static Rp2040View of(EmitPlan p) {
        AlarmPeriod a = AlarmPeriod.of(p.timer.orElseThrow().requestedHz());
        return new Rp2040View(a.wholeMicros(), a.fractional(), a.fraction(), a.denominator());
    }
}
