package org.rungtone.analysis;

import java.util.function.DoubleUnaryOperator;
import org.rungtone.internal.Checks;

/**
 * A single-sided power spectrum, calibrated so that the bins add up to the signal's power.
 *
 * <p>With window {@code w} over the {@code n} analysed samples and a transform of length {@code M ≥ n}
 * (zero-padded; longer input is trimmed to its first M samples), bin k holds
 * {@code P_k = c_k·|X_k|² / (M·Σw²) / ½}, {@code c_k = 2} for 0 &lt; k &lt; M/2 and 1 at DC and M/2. By
 * Parseval ({@code Σ|X_k|² = M·Σ|x·w|²}) the bins sum to the mean square of the signal, here expressed
 * relative to the power of a full-scale sine (½), so a full-scale sine adds up to 1 (0 dBFS). This is the
 * noise-calibrated form: sums over bins give band powers. A pure tone's peak bin reads lower by the
 * window's equivalent noise bandwidth {@code ENBW = M·Σw²/(Σw)²} bins; {@link #toneDbfs} adds it back for
 * tone-calibrated displays. Welch's method averages such spectra over half-overlapping segments (P. D.
 * Welch, IEEE Trans. Audio Electroacoust. 15(2), 1967). Transforms are {@link Fft}'s.
 */
public final class Spectrum {
    private static final double FULL_SCALE_SINE_POWER = 0.5;

    private final double sampleRateHz;
    private final int fftLength;
    private final int analysedLength;
    private final Window window;
    private final double enbwBins;
    private final double[] power;

    private Spectrum(double sampleRateHz, int fftLength, int analysedLength, Window window, double enbwBins,
            double[] power) {
        this.sampleRateHz = sampleRateHz;
        this.fftLength = fftLength;
        this.analysedLength = analysedLength;
        this.window = window;
        this.enbwBins = enbwBins;
        this.power = power;
    }

    /**
     * The spectrum of all of {@code samples}, zero-padded to the next power of two.
     *
     * @throws IllegalArgumentException when there are fewer than two samples or the rate is not positive
     */
    public static Spectrum of(double[] samples, double sampleRateHz, Window window) {
        return of(samples, sampleRateHz, window, nextPowerOfTwo(Math.max(2, samples.length)));
    }

    /**
     * The spectrum with a transform of {@code fftLength} points: shorter input is zero-padded, longer input is
     * trimmed to its first {@code fftLength} samples.
     *
     * @throws IllegalArgumentException when {@code fftLength} is not a power of two of at least 2, there are
     *     fewer than two samples, or the rate is not positive
     */
    public static Spectrum of(double[] samples, double sampleRateHz, Window window, int fftLength) {
        checkCommon(samples, sampleRateHz, fftLength);
        int n = Math.min(samples.length, fftLength);
        double[] w = window.values(n);
        double[][] ri = new double[2][fftLength];
        double sw = 0;
        double sw2 = 0;
        for (int i = 0; i < n; i++) {
            ri[0][i] = samples[i] * w[i];
            sw += w[i];
            sw2 += w[i] * w[i];
        }
        double[] p = new double[fftLength / 2 + 1];
        accumulate(ri, p, 1.0 / (fftLength * sw2));
        return new Spectrum(sampleRateHz, fftLength, n, window, fftLength * sw2 / (sw * sw), p);
    }

    /** Welch segments are summed in this many groups (fixed, so results do not depend on core count). */
    private static final int WELCH_GROUPS = 8;

    /**
     * Welch's averaged spectrum over half-overlapping segments of {@code segmentLength} samples (a power of
     * two); a signal shorter than one segment is analysed whole, zero-padded to the segment length. The last
     * partial hop (fewer than segmentLength/2 samples) is left out.
     *
     * @throws IllegalArgumentException when the segment length is not a power of two of at least 2, there
     *     are fewer than two samples, or the rate is not positive
     */
    public static Spectrum welch(double[] samples, double sampleRateHz, Window window, int segmentLength) {
        return welch(samples, 0, sampleRateHz, window, segmentLength);
    }

    /**
     * Welch's spectrum of {@code samples − offset} (the offset is subtracted as the segments are read, so a
     * long signal's mean can be removed without a second array).
     *
     * <p>Two real segments share one complex transform: with {@code z = x1 + i·x2}, {@code |X1_k|² + |X2_k|² =
     * (|Z_k|² + |Z_(M−k)|²)/2} because both real spectra are Hermitian, which halves the transforms and gives
     * the same sum as transforming each segment alone (to rounding).
     */
    public static Spectrum welch(double[] samples, double offset, double sampleRateHz, Window window,
            int segmentLength) {
        return welch((from, dst, count) -> {
            for (int i = 0; i < count; i++) {
                dst[i] = samples[from + i] - offset;
            }
        }, samples.length, sampleRateHz, window, segmentLength);
    }

    /** Samples read by range, for signals computed as they are needed rather than stored. */
    @FunctionalInterface
    public interface Samples {
        /** Writes samples {@code from .. from + count − 1} into {@code dst[0 ..]}. */
        void read(int from, double[] dst, int count);
    }

    /**
     * Welch's spectrum of a signal read segment by segment ({@code length} samples), for signals computed
     * on the fly (an aligned error) rather than stored. {@code samples} is called from several threads.
     */
    public static Spectrum welch(Samples samples, int length, double sampleRateHz, Window window,
            int segmentLength) {
        Checks.checkArgument(length >= 2, "a spectrum needs at least two samples: %d", length);
        checkCommon(new double[2], sampleRateHz, segmentLength);
        if (length <= segmentLength) {
            double[] x = new double[length];
            samples.read(0, x, length);
            return of(x, sampleRateHz, window, segmentLength);
        }
        double[] w = window.values(segmentLength);
        double sw = 0;
        double sw2 = 0;
        for (double v : w) {
            sw += v;
            sw2 += v * v;
        }
        int hop = segmentLength / 2;
        int segments = 1 + (length - segmentLength) / hop;
        double scale = 1.0 / (segmentLength * sw2 * segments);
        // Segments are summed in a fixed number of groups, in parallel, then the groups in order: the result
        // does not depend on how many cores there are.
        int groups = Math.min(WELCH_GROUPS, segments);
        double[][] partial = new double[groups][];
        java.util.stream.IntStream.range(0, groups).parallel().forEach(g -> {
            double[] acc = new double[segmentLength / 2 + 1];
            double[][] ri = new double[2][segmentLength];
            int end = (g + 1) * segments / groups;
            for (int s = g * segments / groups; s < end; s += 2) {
                int a = s * hop;
                boolean pair = s + 1 < end;
                int b = pair ? a + hop : 0;
                samples.read(a, ri[0], segmentLength);
                if (pair) {
                    samples.read(b, ri[1], segmentLength);
                } else {
                    java.util.Arrays.fill(ri[1], 0);
                }
                for (int i = 0; i < segmentLength; i++) {
                    ri[0][i] *= w[i];
                    ri[1][i] *= w[i];
                }
                if (pair) {
                    accumulatePair(ri, acc, scale);
                } else {
                    accumulate(ri, acc, scale);
                }
            }
            partial[g] = acc;
        });
        double[] p = new double[segmentLength / 2 + 1];
        for (double[] acc : partial) {
            for (int k = 0; k < p.length; k++) {
                p[k] += acc[k];
            }
        }
        return new Spectrum(sampleRateHz, segmentLength, segmentLength, window, segmentLength * sw2 / (sw * sw),
                p);
    }

    /** Transforms two real segments packed as re/im and adds both their single-sided powers into {@code p}. */
    private static void accumulatePair(double[][] ri, double[] p, double scale) {
        Fft.forward(ri[0], ri[1]);
        int m = ri[0].length;
        int half = m / 2;
        double toFullScale = scale / FULL_SCALE_SINE_POWER;
        for (int k = 0; k <= half; k++) {
            int mk = k == 0 ? 0 : m - k;
            double both = 0.5 * (ri[0][k] * ri[0][k] + ri[1][k] * ri[1][k] + ri[0][mk] * ri[0][mk]
                    + ri[1][mk] * ri[1][mk]);
            double c = k == 0 || k == half ? 1 : 2;
            p[k] += c * both * toFullScale;
        }
    }

    private static void checkCommon(double[] samples, double sampleRateHz, int fftLength) {
        Checks.checkArgument(samples.length >= 2, "a spectrum needs at least two samples: %d", samples.length);
        Checks.checkArgument(Double.isFinite(sampleRateHz) && sampleRateHz > 0,
                "sample rate must be positive: %s", sampleRateHz);
        Checks.checkArgument(fftLength >= 2 && Integer.bitCount(fftLength) == 1,
                "transform length must be a power of two: %d", fftLength);
    }

    /** Transforms {@code ri} in place and adds its scaled single-sided power into {@code p}. */
    private static void accumulate(double[][] ri, double[] p, double scale) {
        Fft.forward(ri[0], ri[1]);
        int m = ri[0].length;
        int half = m / 2;
        double toFullScale = scale / FULL_SCALE_SINE_POWER;
        for (int k = 0; k <= half; k++) {
            double re = ri[0][k];
            double im = ri[1][k];
            double c = k == 0 || k == half ? 1 : 2;
            p[k] += c * (re * re + im * im) * toFullScale;
        }
    }

    /** The smallest power of two at least {@code n} (n ≤ 2^30). */
    public static int nextPowerOfTwo(int n) {
        Checks.checkArgument(n >= 1 && n <= 1 << 30, "length out of range: %d", n);
        return n == 1 ? 1 : Integer.highestOneBit(n - 1) << 1;
    }

    /** Sample rate of the analysed signal in hertz. */
    public double sampleRateHz() {
        return sampleRateHz;
    }

    /** Transform length M. */
    public int fftLength() {
        return fftLength;
    }

    /** Number of samples under the window (per segment for Welch spectra). */
    public int analysedLength() {
        return analysedLength;
    }

    /** The window used. */
    public Window window() {
        return window;
    }

    /** Equivalent noise bandwidth of the window in bins of this transform. */
    public double enbwBins() {
        return enbwBins;
    }

    /** Half-width in bins of a tone's main lobe, allowing for zero-padding, plus one bin of margin. */
    public int mainLobeHalfWidthBins() {
        return (int) Math.ceil(window.mainLobeHalfWidthBins() * (double) fftLength / analysedLength) + 1;
    }

    /** Number of bins, M/2 + 1 (DC to Nyquist). */
    public int bins() {
        return power.length;
    }

    /** Bin spacing in hertz, rate/M. */
    public double binHz() {
        return sampleRateHz / fftLength;
    }

    /** Centre frequency of bin {@code k} in hertz. */
    public double frequencyHz(int k) {
        return k * binHz();
    }

    /** Power of bin {@code k} relative to a full-scale sine (noise-calibrated; linear). */
    public double power(int k) {
        return power[k];
    }

    /** A copy of all bin powers (linear, relative to a full-scale sine). */
    public double[] powers() {
        return power.clone();
    }

    /** Bin {@code k} in dBFS (noise-calibrated). */
    public double powerDbfs(int k) {
        return 10 * Math.log10(power[k]);
    }

    /** Bin {@code k} in dBFS as a tone reads it: the noise-calibrated value plus the ENBW in dB. */
    public double toneDbfs(int k) {
        return 10 * Math.log10(power[k] * enbwBins);
    }

    /** Sum of all bins: the signal's mean square relative to a full-scale sine. */
    public double totalPower() {
        double s = 0;
        for (double v : power) {
            s += v;
        }
        return s;
    }

    /** Sum of the bins whose centre lies in [lowHz, highHz]. */
    public double bandPower(double lowHz, double highHz) {
        double bin = binHz();
        int k0 = Math.max(0, (int) Math.ceil(lowHz / bin - 1e-9));
        int k1 = Math.min(power.length - 1, (int) Math.floor(highHz / bin + 1e-9));
        double s = 0;
        for (int k = k0; k <= k1; k++) {
            s += power[k];
        }
        return s;
    }

    /** Sum of the bins weighted by a power gain of frequency, {@code Σ P_k·g(f_k)}. */
    public double weightedPower(DoubleUnaryOperator powerGainOfHz) {
        double s = 0;
        double bin = binHz();
        for (int k = 0; k < power.length; k++) {
            s += power[k] * powerGainOfHz.applyAsDouble(k * bin);
        }
        return s;
    }
}
