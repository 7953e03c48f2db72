package org.rungtone.calibrate;

import java.util.ArrayList;
import java.util.List;

/**
 * Which DC-volts range a meter of a given count needs for the highest expected level, and how fine its
 * steps are against one LSB of the ladder. A meter of C counts shows at most C − 1 steps; its ranges are C
 * steps of 10 µV, 100 µV, 1 mV, 10 mV or 100 mV (2000 counts: 200 mV, 2 V, 20 V, 200 V). The smallest range
 * holding the highest level with 5 % headroom is proposed (common practice, no source).
 *
 * @param counts the meter's count (2000 for a 3½-digit meter)
 * @param rangeVolts the proposed range, volts
 * @param stepVolts the meter's resolution on that range, volts
 * @param stepsPerLsb how many meter steps one average LSB of the ladder spans
 */
public record MeterAdvice(int counts, double rangeVolts, double stepVolts, double stepsPerLsb) {
    /** The meter counts advised for: 3½, 3⅚, 4½ and 4¾ digits. */
    public static final int[] COUNTS = {2000, 6000, 20000, 60000};
    private static final double HEADROOM = 1.05;

    /**
     * Advice for each meter class of {@link #COUNTS}.
     *
     * @param maxAbsVolts the largest expected level magnitude
     * @param lsbVolts the ladder's average step
     */
    public static List<MeterAdvice> forLevels(double maxAbsVolts, double lsbVolts) {
        List<MeterAdvice> out = new ArrayList<>();
        for (int counts : COUNTS) {
            double step = 1e-5;
            while (counts * step < HEADROOM * maxAbsVolts && step < 10) {
                step *= 10;
            }
            out.add(new MeterAdvice(counts, counts * step, step, lsbVolts / step));
        }
        return out;
    }

    /** A short name of the meter class: "2000-count (3½-digit)". */
    public String meterName() {
        switch (counts) {
            case 2000:
                return "2000-count (3½-digit)";
            case 20000:
                return "20000-count (4½-digit)";
            default:
                return counts + "-count";
        }
    }

    /** True when the meter's step is at most a quarter LSB, fine enough for the fit (common practice). */
    public boolean fineEnough() {
        return stepsPerLsb >= 4;
    }
}
