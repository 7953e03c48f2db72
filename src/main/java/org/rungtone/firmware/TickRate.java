package org.rungtone.firmware;

import java.math.BigInteger;
import org.rungtone.internal.Checks;

/**
 * A tick rate as an exact fraction of hertz in lowest terms: a timer's clock over the clock cycles of one
 * period ({@code 16 MHz / 726}), or a rate given in hertz ({@code 22050 / 1}; to the millihertz when it is
 * not whole). The DDS setters and the initial tuning word are both computed from it, so they agree.
 *
 * @param numerator hertz times the denominator
 * @param denominator positive
 */
record TickRate(long numerator, long denominator) {
    /** Checks the fields. */
    TickRate {
        Checks.checkArgument(numerator > 0 && denominator > 0, "a tick rate is positive: %d / %d", numerator,
                denominator);
    }

    /** The rate a timer makes: {@code clockHz} over {@code cyclesPerTick}, the clock to the millihertz. */
    static TickRate ofTimer(double clockHz, long cyclesPerTick) {
        if (clockHz == Math.rint(clockHz)) {
            return reduced((long) clockHz, cyclesPerTick);
        }
        return reduced(Math.round(clockHz * 1000), Math.multiplyExact(cyclesPerTick, 1000L));
    }

    /** A rate in hertz, exact when whole, else to the millihertz. */
    static TickRate ofHz(double hz) {
        if (hz == Math.rint(hz)) {
            return reduced((long) hz, 1);
        }
        return reduced(Math.round(hz * 1000), 1000);
    }

    /** The rate of a solved timer: a microsecond alarm's average, or the clock over the cycles per tick. */
    static TickRate of(TimerSetting t) {
        return t.kind().microsecondAlarm() ? AlarmPeriod.of(t.requestedHz()).tickRate()
                : ofTimer(t.clockHz(), t.cyclesPerTick());
    }

    /** The rate in hertz, as near as a double gets. */
    double hz() {
        return (double) numerator / denominator;
    }

    /**
     * True when 1000 · numerator · max(denominator, 2) is below 2^64: the emitted DDS setter multiplies a rest
     * below 1000 · numerator by the denominator, and doubles it.
     */
    boolean fitsDdsArithmetic() {
        return BigInteger.valueOf(numerator).multiply(BigInteger.valueOf(Math.max(denominator, 2)))
                .multiply(BigInteger.valueOf(1000)).bitLength() <= 64;
    }

    /** The fraction {@code num / den} hertz in lowest terms. */
    static TickRate reduced(long num, long den) {
        long g = BigInteger.valueOf(num).gcd(BigInteger.valueOf(den)).longValueExact();
        return new TickRate(num / g, den / g);
    }
}
