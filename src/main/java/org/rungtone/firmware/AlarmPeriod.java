package org.rungtone.firmware;

import java.math.BigInteger;
import java.util.Locale;
import org.rungtone.internal.Checks;

/**
 * The tick of a timer that counts microseconds (1 MHz) and interrupts when its count reaches an alarm value,
 * as the RP2040's TIMER does: each interrupt moves the alarm on by one period, 10^6 / f µs, as whole
 * microseconds plus a fraction that an accumulator carries over. Ticks then come {@code wholeMicros} or
 * {@code wholeMicros + 1} µs apart and average the period exactly; the rate is taken to the millihertz.
 *
 * @param wholeMicros whole microseconds per tick
 * @param fraction the rest of the period, in 1/denominator µs
 * @param denominator the fraction's denominator (1 when the period is whole)
 * @param rateMilliHz the rate the ticks average, exactly, in millihertz
 */
record AlarmPeriod(long wholeMicros, long fraction, long denominator, long rateMilliHz) {
    /** The count rate of the timer: 1 MHz. */
    static final double COUNT_HZ = 1e6;
    private static final long MICRO_MILLIHERTZ = 1_000_000_000L;

    /** Checks the fields. */
    AlarmPeriod {
        Checks.checkArgument(wholeMicros >= 0 && fraction >= 0 && fraction < denominator && rateMilliHz > 0,
                "not an alarm period: %d %d/%d us, %d mHz", wholeMicros, fraction, denominator, rateMilliHz);
    }

    /**
     * The period of {@code rateHz}, taken to the millihertz: 10^9 / (millihertz) µs in lowest terms.
     *
     * @throws IllegalArgumentException when the rate is below half a millihertz
     */
    static AlarmPeriod of(double rateHz) {
        long milli = Math.round(rateHz * 1000);
        Checks.checkArgument(milli >= 1, "rate must be at least 1 mHz: %s", rateHz);
        long g = BigInteger.valueOf(MICRO_MILLIHERTZ).gcd(BigInteger.valueOf(milli)).longValueExact();
        long num = MICRO_MILLIHERTZ / g;
        long den = milli / g;
        return new AlarmPeriod(num / den, num % den, den, milli);
    }

    /** True when the period is not a whole number of microseconds. */
    boolean fractional() {
        return fraction != 0;
    }

    /** The average rate in hertz. */
    double achievedHz() {
        return rateMilliHz / 1000.0;
    }

    /** The average rate as an exact fraction. */
    TickRate tickRate() {
        return TickRate.reduced(rateMilliHz, 1000);
    }

    /** The period in words: {@code 45 155/441 µs (45 or 46 µs apart)} or {@code 125 µs}. */
    String describe() {
        return fractional() ? String.format(Locale.ROOT, "%d %d/%d µs (%d or %d µs apart)", wholeMicros, fraction,
                denominator, wholeMicros, wholeMicros + 1) : wholeMicros + " µs";
    }
}
