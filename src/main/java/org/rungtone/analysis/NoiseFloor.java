package org.rungtone.analysis;

/**
 * The local noise of a spectrum, for telling spurs from noise: the mean power per bin of the bins no
 * component owns, taken within a fixed number of bins either side of a frequency.
 *
 * <p>A spur stands out when one of its bins exceeds the local mean by {@value #SPUR_MARGIN_DB} dB. In a
 * periodogram each bin of noise is exponentially distributed about its mean (chi-square with two degrees of
 * freedom: the standard periodogram statistics, e.g. S. M. Kay, Modern Spectral Estimation, 1988), so a
 * noise bin passes 13 dB (a factor 19.95) with probability {@code e^−19.95 ≈ 2·10^−9}: among the 2^19 bins of
 * the longest record Rungtone analyses, a noise peak is taken for a spur with a probability of about
 * 10^−3. A spur whose peak bin reads less than that cannot be told from the noise.
 */
final class NoiseFloor {
    /** How far a bin must rise above the local noise to count as a spur. */
    static final double SPUR_MARGIN_DB = 13;
    /** {@link #SPUR_MARGIN_DB} as a power ratio. */
    static final double SPUR_MARGIN = Math.pow(10, SPUR_MARGIN_DB / 10);

    private final double[] freeSum;
    private final int[] freeCount;
    private final int halfWidth;
    private final double globalDensity;

    /**
     * The noise of {@code s} from the bins where {@code free[k]} is true, averaged over ±{@code halfWidth}
     * bins.
     */
    NoiseFloor(Spectrum s, boolean[] free, int halfWidth) {
        int bins = s.bins();
        freeSum = new double[bins + 1];
        freeCount = new int[bins + 1];
        for (int k = 0; k < bins; k++) {
            boolean f = free[k];
            freeSum[k + 1] = freeSum[k] + (f ? s.power(k) : 0);
            freeCount[k + 1] = freeCount[k] + (f ? 1 : 0);
        }
        this.halfWidth = halfWidth;
        globalDensity = freeCount[bins] > 0 ? freeSum[bins] / freeCount[bins] : 0;
    }

    /** Mean power per free bin over the whole spectrum (0 when no bin is free). */
    double globalDensity() {
        return globalDensity;
    }

    /** Mean power per free bin within ±halfWidth bins of {@code bin}; the global mean when none is free there. */
    double densityAt(int bin) {
        int last = freeSum.length - 2;
        int lo = Math.max(0, Math.min(last, bin) - halfWidth);
        int hi = Math.min(last, Math.max(0, bin) + halfWidth);
        int count = freeCount[hi + 1] - freeCount[lo];
        return count > 0 ? (freeSum[hi + 1] - freeSum[lo]) / count : globalDensity;
    }

    /** True when a bin of power {@code power} near {@code bin} stands out of the noise by the margin. */
    boolean standsOut(double power, int bin) {
        return power > SPUR_MARGIN * densityAt(bin);
    }
}
