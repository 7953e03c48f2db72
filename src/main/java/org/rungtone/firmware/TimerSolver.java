package org.rungtone.firmware;

import org.rungtone.internal.Checks;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;
import org.rungtone.internal.Units;

/**
 * Chooses the prescaler and reload value that bring a timer's interrupt rate closest to a requested sample
 * rate.
 *
 * <p>For a clock f_clk, prescaler p and reload r the interrupt rate is f = f_clk / (p · (r + 1)). For each
 * available p the best period is one of the two integers around f_clk / (p · f_req), clamped to
 * [2, 2^bits]; the solver keeps the setting with the smallest |error|, and among equal errors the smallest
 * prescaler (finest later adjustment). Error in ppm = (f − f_req) / f_req · 10^6. The microsecond alarm
 * ({@link TimerKind#RP2040_ALARM}) has no such choice: its period is 10^6 / f_req µs, carried to the
 * millihertz ({@link AlarmPeriod}).
 */
public final class TimerSolver {
    /** Default tolerance for the achieved rate: 1000 ppm (0.1 %, a pitch shift of 1.7 cents). */
    public static final double DEFAULT_TOLERANCE_PPM = 1000;

    private TimerSolver() {
    }

    /**
     * The best setting for {@code rateHz}.
     *
     * @param clockHz timer input clock in hertz
     * @param kind timer family
     * @param rateHz requested interrupt rate in hertz
     * @param tolerancePpm largest acceptable |error| in ppm
     * @throws InputError when the rate is outside what the timer can make from the clock, or no setting
     *     comes within the tolerance (the message names the closest setting)
     */
    public static TimerSetting solve(double clockHz, TimerKind kind, double rateHz, double tolerancePpm) {
        Setting.CPU_CLOCK.check(Double.isFinite(clockHz) && clockHz > 0, "must be a positive number: %s",
                Units.format(clockHz, ""));
        Setting.RATE.check(Double.isFinite(rateHz) && rateHz > 0, "must be a positive number: %s",
                Units.format(rateHz, ""));
        Setting.RATE_TOLERANCE.check(Double.isFinite(tolerancePpm) && tolerancePpm >= 0,
                "must be zero or positive: %s", tolerancePpm);
        if (kind.microsecondAlarm()) {
            return alarm(rateHz, tolerancePpm);
        }
        double fastest = clockHz / 2;
        double slowest = clockHz / ((double) kind.maxPrescaler() * (kind.maxReload() + 1));
        if (rateHz > fastest) {
            throw Setting.RATE.error("%s is too fast for %s at a %s clock: the fastest is %s; lower %s or raise %s",
                    Fmt.hz(rateHz), kind.describe(), Fmt.hz(clockHz), Fmt.hz(fastest), Setting.RATE.ref(),
                    Setting.CPU_CLOCK.ref());
        }
        if (rateHz < slowest * (1 - tolerancePpm * 1e-6)) {
            throw Setting.RATE.error("%s is too slow for %s at a %s clock: the slowest is %s; choose a wider %s"
                    + " or a higher %s", Fmt.hz(rateHz), kind.describe(), Fmt.hz(clockHz), Fmt.hz(slowest),
                    Setting.TIMER.ref(), Setting.RATE.ref());
        }
        TimerSetting best = closest(clockHz, kind, rateHz);
        if (Math.abs(best.errorPpm()) > tolerancePpm) {
            throw Setting.RATE.error("%s cannot be made within %s ppm by %s at a %s clock: the closest is %s (%s"
                    + " ppm, prescaler %d, %s = %d); use %s %s or raise %s", Fmt.hz(rateHz),
                    Fmt.plain(tolerancePpm, 1), kind.describe(), Fmt.hz(clockHz), Fmt.hz(best.achievedHz()),
                    Fmt.ppm(best.errorPpm()), best.prescaler(), kind.reloadRegister(), best.reload(),
                    Setting.RATE.ref(), Fmt.plain(best.achievedHz(), 3), Setting.RATE_TOLERANCE.ref());
        }
        return best;
    }

    /**
     * The setting with the smallest error, whatever its size.
     *
     * @throws IllegalArgumentException when the clock or rate is not positive
     */
    public static TimerSetting closest(double clockHz, TimerKind kind, double rateHz) {
        Checks.checkArgument(clockHz > 0 && rateHz > 0, "clock and rate must be positive: %s, %s", clockHz,
                rateHz);
        if (kind.microsecondAlarm()) {
            return alarm(rateHz, Double.POSITIVE_INFINITY);
        }
        long maxPeriod = kind.maxReload() + 1;
        int[] ps = kind.prescalers().toArray();
        TimerSetting best = null;
        double bestAbs = Double.POSITIVE_INFINITY;
        for (int p : ps) {
            double ideal = clockHz / (p * rateHz);
            long lo = clamp((long) Math.floor(ideal), maxPeriod);
            long hi = clamp((long) Math.ceil(ideal), maxPeriod);
            for (long period : lo == hi ? new long[] {lo} : new long[] {lo, hi}) {
                double achieved = clockHz / ((double) p * period);
                double ppm = (achieved - rateHz) / rateHz * 1e6;
                if (Math.abs(ppm) < bestAbs) {
                    bestAbs = Math.abs(ppm);
                    best = new TimerSetting(kind, clockHz, p, period - 1, rateHz, achieved, ppm);
                }
            }
        }
        return best;
    }

    /**
     * The microsecond alarm's setting: the clock is its 1 MHz count, the reload its whole microseconds less
     * one, the rate the average of its ticks (the requested rate to the millihertz).
     */
    private static TimerSetting alarm(double rateHz, double tolerancePpm) {
        TimerKind kind = TimerKind.RP2040_ALARM;
        double fastest = AlarmPeriod.COUNT_HZ / 2;
        if (rateHz > fastest) {
            throw Setting.RATE.error("%s is too fast for %s: the fastest is %s; lower %s", Fmt.hz(rateHz),
                    kind.describe(), Fmt.hz(fastest), Setting.RATE.ref());
        }
        Setting.RATE.check(rateHz >= 0.001, "%s is too slow for %s: the slowest is 1 mHz", Fmt.hz(rateHz),
                kind.describe());
        AlarmPeriod a = AlarmPeriod.of(rateHz);
        double ppm = (a.achievedHz() - rateHz) / rateHz * 1e6;
        Setting.RATE.check(Math.abs(ppm) <= tolerancePpm, "%s cannot be made within %s ppm by %s: the closest"
                + " is %s; use %s %s or raise %s", Fmt.hz(rateHz), Fmt.plain(tolerancePpm, 1), kind.describe(),
                Fmt.hz(a.achievedHz()), Setting.RATE.ref(), Fmt.plain(a.achievedHz(), 3),
                Setting.RATE_TOLERANCE.ref());
        return new TimerSetting(kind, AlarmPeriod.COUNT_HZ, 1, a.wholeMicros() - 1, rateHz, a.achievedHz(), ppm);
    }

    private static long clamp(long period, long maxPeriod) {
        return Math.max(2, Math.min(maxPeriod, period));
    }
}
