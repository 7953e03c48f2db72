package org.rungtone.ladder;

import java.util.Arrays;
import org.rungtone.internal.Checks;

/**
 * Static linearity of a DAC transfer after IEEE Std 1658-2011 (DAC terminology and test methods).
 *
 * <p>With levels L_k, k = 0 .. n−1, n = 2^N: the LSB size is the endpoint average step
 * {@code LSB = (L_{n−1} − L_0)/(n − 1)}; the differential non-linearity of the step into code k is
 * {@code DNL_k = (L_k − L_{k−1})/LSB − 1} (code 0 has no step below it; its entry is 0); the endpoint
 * integral non-linearity is {@code INL_k = (L_k − L_0 − k·LSB)/LSB}; the best-fit INL uses the least-squares
 * line {@code a + b·k} instead, {@code INL_k = (L_k − a − b·k)/b}. Offset error is {@code L_0} minus the
 * ideal code-0 level, gain error the full-span difference from the ideal, both also in ideal LSB.
 *
 * <p>The transfer is monotonic when every step rises, which is exactly DNL > −1 LSB at every step; a falling
 * step is an inverted step. A flat step (a level repeated, as clipping causes) also counts as not monotonic.
 */
public final class Linearity {
    private final double lsbVolts;
    private final double idealLsbVolts;
    private final double offsetErrorVolts;
    private final double gainErrorVolts;
    private final double idealSpanVolts;
    private final double bestFitOffsetVolts;
    private final double bestFitLsbVolts;
    private final double[] dnl;
    private final double[] inl;
    private final double[] inlBestFit;
    private final int[] invertedSteps;
    private final boolean monotonic;

    private Linearity(double[] levels, double[] ideal) {
        int n = levels.length;
        lsbVolts = (levels[n - 1] - levels[0]) / (n - 1);
        idealSpanVolts = ideal[n - 1] - ideal[0];
        idealLsbVolts = idealSpanVolts / (n - 1);
        offsetErrorVolts = levels[0] - ideal[0];
        gainErrorVolts = (levels[n - 1] - levels[0]) - idealSpanVolts;
        dnl = new double[n];
        inl = new double[n];
        inlBestFit = new double[n];
        int[] inverted = new int[n];
        int nInverted = 0;
        boolean rising = true;
        double sumK = 0;
        double sumL = 0;
        for (int k = 0; k < n; k++) {
            sumK += k;
            sumL += levels[k] - levels[0];
            if (k > 0) {
                double step = levels[k] - levels[k - 1];
                dnl[k] = step / lsbVolts - 1;
                rising &= step > 0;
                if (step < 0) {
                    inverted[nInverted++] = k;
                }
            }
        }
        double meanK = sumK / n;
        double meanL = sumL / n;
        double sxy = 0;
        double sxx = 0;
        for (int k = 0; k < n; k++) {
            sxy += (k - meanK) * (levels[k] - levels[0] - meanL);
            sxx += (k - meanK) * (k - meanK);
        }
        bestFitLsbVolts = sxy / sxx;
        bestFitOffsetVolts = levels[0] + meanL - bestFitLsbVolts * meanK;
        for (int k = 0; k < n; k++) {
            inl[k] = (levels[k] - levels[0] - k * lsbVolts) / lsbVolts;
            inlBestFit[k] = (levels[k] - bestFitOffsetVolts - k * bestFitLsbVolts) / bestFitLsbVolts;
        }
        invertedSteps = Arrays.copyOf(inverted, nInverted);
        monotonic = rising;
    }

    /**
     * The linearity of {@code actual} against the {@code ideal} transfer (for offset and gain error).
     *
     * @throws IllegalArgumentException when the bit depths differ, or the first and last levels of either
     *     table are equal (no span to measure an LSB against)
     */
    public static Linearity of(LevelTable actual, LevelTable ideal) {
        Checks.checkArgument(actual.bits() == ideal.bits(), "bit depths differ: %d and %d", actual.bits(),
                ideal.bits());
        int last = actual.size() - 1;
        Checks.checkArgument(actual.volts(last) != actual.volts(0) && ideal.volts(last) != ideal.volts(0),
                "the first and last levels are equal: no span");
        return new Linearity(actual.levels(), ideal.levels());
    }

    /** Number of codes. */
    public int size() {
        return dnl.length;
    }

    /** Measured LSB size, the endpoint average step, volts. */
    public double lsbVolts() {
        return lsbVolts;
    }

    /** Ideal LSB size of the topology, volts. */
    public double idealLsbVolts() {
        return idealLsbVolts;
    }

    /** Offset error: code-0 level minus the ideal code-0 level, volts. */
    public double offsetErrorVolts() {
        return offsetErrorVolts;
    }

    /** Offset error in ideal LSB. */
    public double offsetErrorLsb() {
        return offsetErrorVolts / idealLsbVolts;
    }

    /** Gain error: measured full span minus ideal full span, volts. */
    public double gainErrorVolts() {
        return gainErrorVolts;
    }

    /** Gain error in ideal LSB. */
    public double gainErrorLsb() {
        return gainErrorVolts / idealLsbVolts;
    }

    /** Gain error as a percentage of the ideal span. */
    public double gainErrorPercent() {
        return 100 * gainErrorVolts / idealSpanVolts;
    }

    /** Slope of the least-squares line, volts per code. */
    public double bestFitLsbVolts() {
        return bestFitLsbVolts;
    }

    /** Intercept of the least-squares line (its level at code 0), volts. */
    public double bestFitOffsetVolts() {
        return bestFitOffsetVolts;
    }

    /** DNL of every code in LSB, a copy (entry 0 is 0). */
    public double[] dnlLsb() {
        return dnl.clone();
    }

    /** Endpoint INL of every code in LSB, a copy. */
    public double[] inlLsb() {
        return inl.clone();
    }

    /** Best-fit INL of every code in LSB, a copy. */
    public double[] inlBestFitLsb() {
        return inlBestFit.clone();
    }

    /** DNL of one code (the step from code − 1), LSB. */
    public double dnlLsb(int code) {
        return dnl[code];
    }

    /** Endpoint INL of one code, LSB. */
    public double inlLsb(int code) {
        return inl[code];
    }

    /** Best-fit INL of one code, LSB. */
    public double inlBestFitLsb(int code) {
        return inlBestFit[code];
    }

    /** True when every step rises (DNL > −1 LSB everywhere). */
    public boolean isMonotonic() {
        return monotonic;
    }

    /** The codes whose level is below that of the code before, ascending, a copy. */
    public int[] invertedSteps() {
        return invertedSteps.clone();
    }

    /** The code with the largest |DNL| (the lowest such code). */
    public int worstDnlCode() {
        return argMaxAbs(dnl);
    }

    /** The code with the largest |endpoint INL|. */
    public int worstInlCode() {
        return argMaxAbs(inl);
    }

    /** The code with the largest |best-fit INL|. */
    public int worstInlBestFitCode() {
        return argMaxAbs(inlBestFit);
    }

    /** Largest |DNL| in LSB. */
    public double maxAbsDnlLsb() {
        return Math.abs(dnl[worstDnlCode()]);
    }

    /** Largest |endpoint INL| in LSB. */
    public double maxAbsInlLsb() {
        return Math.abs(inl[worstInlCode()]);
    }

    /** Largest |best-fit INL| in LSB. */
    public double maxAbsInlBestFitLsb() {
        return Math.abs(inlBestFit[worstInlBestFitCode()]);
    }

    private static int argMaxAbs(double[] v) {
        int best = 0;
        for (int i = 1; i < v.length; i++) {
            if (Math.abs(v[i]) > Math.abs(v[best])) {
                best = i;
            }
        }
        return best;
    }

    /**
     * The worst figures of a transfer without keeping the per-code arrays, for Monte Carlo and design loops;
     * the same definitions as {@link Linearity}. Mutable and reused by one thread.
     */
    static final class Worst {
        double maxAbsDnl;
        double maxAbsInl;
        double maxAbsInlBestFit;
        boolean monotonic;

        /** Fills the fields from levels indexed by code. */
        void of(double[] levels) {
            int n = levels.length;
            double l0 = levels[0];
            double lsb = (levels[n - 1] - l0) / (n - 1);
            double inv = 1 / lsb;
            double dMax = 0;
            boolean rising = true;
            double sumL = 0;
            double sumKL = 0;
            for (int k = 1; k < n; k++) {
                double step = levels[k] - levels[k - 1];
                rising &= step > 0;
                dMax = Math.max(dMax, Math.abs(step * inv - 1));
                double l = levels[k] - l0;
                sumL += l;
                sumKL += k * l;
            }
            double meanK = (n - 1) / 2.0;
            double meanL = sumL / n;
            double sxx = n * ((double) n * n - 1) / 12.0;
            double slope = (sumKL - n * meanK * meanL) / sxx;
            double intercept = meanL - slope * meanK;
            double invSlope = 1 / slope;
            double iMax = 0;
            double bMax = 0;
            for (int k = 0; k < n; k++) {
                double l = levels[k] - l0;
                iMax = Math.max(iMax, Math.abs((l - k * lsb) * inv));
                bMax = Math.max(bMax, Math.abs((l - intercept - k * slope) * invSlope));
            }
            maxAbsDnl = dMax;
            maxAbsInl = iMax;
            maxAbsInlBestFit = bMax;
            monotonic = rising;
        }
    }
}
