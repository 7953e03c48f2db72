package org.rungtone.analysis;

import java.util.stream.IntStream;
import org.rungtone.internal.Checks;

/**
 * Welch's averaged auto and cross spectra of a reference r and an output o of the same rate (Hann window,
 * half-overlapping segments; P. D. Welch, IEEE Trans. Audio Electroacoust. 15(2), 1967): per bin k of the
 * segment transform, {@code P_rr = Σ|R_k|²}, {@code P_oo = Σ|O_k|²} and {@code S_or = Σ O_k·conj(R_k)}, summed
 * over segments with one common scale (only ratios of these are used). Both segments share one complex
 * transform: with {@code z = r + i·o}, {@code R_k = (Z_k + conj(Z_(M−k)))/2} and
 * {@code O_k = (Z_k − conj(Z_(M−k)))/(2i)}. Segments are summed in a fixed number of groups, so the result
 * does not depend on the number of cores.
 */
final class CrossSpectrum {
    private static final int GROUPS = 8;
    /** The cross-correlation is interpolated by this factor (zero-padding the cross spectrum). */
    private static final int UPSAMPLE = 16;

    private final double sampleRateHz;
    private final int segmentLength;
    private final double[] prr;
    private final double[] poo;
    private final double[] sre;
    private final double[] sim;

    private CrossSpectrum(double sampleRateHz, int segmentLength, double[][] sums) {
        this.sampleRateHz = sampleRateHz;
        this.segmentLength = segmentLength;
        this.prr = sums[0];
        this.poo = sums[1];
        this.sre = sums[2];
        this.sim = sums[3];
    }

    /**
     * The spectra of {@code r[rFrom ..]} and {@code o[0 ..]} over {@code n} samples each, their means
     * removed, in segments of {@code segmentLength} (a power of two, at most n).
     */
    static CrossSpectrum of(double[] r, int rFrom, double[] o, int n, double sampleRateHz, int segmentLength) {
        Checks.checkArgument(Integer.bitCount(segmentLength) == 1 && segmentLength >= 16 && segmentLength <= n,
                "segment length must be a power of two within the signal: %d of %d", segmentLength, n);
        double rMean = 0;
        double oMean = 0;
        for (int i = 0; i < n; i++) {
            rMean += r[rFrom + i];
            oMean += o[i];
        }
        rMean /= n;
        oMean /= n;
        double[] w = Window.HANN.values(segmentLength);
        int hop = segmentLength / 2;
        int segments = 1 + (n - segmentLength) / hop;
        int groups = Math.min(GROUPS, segments);
        int bins = segmentLength / 2 + 1;
        double[][][] partial = new double[groups][][];
        double rm = rMean;
        double om = oMean;
        IntStream.range(0, groups).parallel().forEach(g -> {
            double[][] acc = new double[4][bins];
            double[][] z = new double[2][segmentLength];
            for (int s = g * segments / groups; s < (g + 1) * segments / groups; s++) {
                int a = s * hop;
                for (int i = 0; i < segmentLength; i++) {
                    z[0][i] = (r[rFrom + a + i] - rm) * w[i];
                    z[1][i] = (o[a + i] - om) * w[i];
                }
                accumulate(z, acc);
            }
            partial[g] = acc;
        });
        double[][] sums = new double[4][bins];
        for (double[][] p : partial) {
            for (int q = 0; q < 4; q++) {
                for (int k = 0; k < bins; k++) {
                    sums[q][k] += p[q][k];
                }
            }
        }
        return new CrossSpectrum(sampleRateHz, segmentLength, sums);
    }

    private static void accumulate(double[][] z, double[][] acc) {
        Fft.forward(z[0], z[1]);
        int m = z[0].length;
        for (int k = 0; k <= m / 2; k++) {
            int mk = k == 0 ? 0 : m - k;
            double zr = z[0][k];
            double zi = z[1][k];
            double cr = z[0][mk];
            double ci = -z[1][mk];
            double rr = 0.5 * (zr + cr);
            double ri = 0.5 * (zi + ci);
            // (Z − conj Z(M−k)) / (2i): (a + ib)/(2i) = (b − ia)/2
            double or = 0.5 * (zi - ci);
            double oi = -0.5 * (zr - cr);
            acc[0][k] += rr * rr + ri * ri;
            acc[1][k] += or * or + oi * oi;
            acc[2][k] += or * rr + oi * ri;
            acc[3][k] += oi * rr - or * ri;
        }
    }

    /** Number of bins, M/2 + 1. */
    int bins() {
        return prr.length;
    }

    /** Centre of bin k in hertz. */
    double frequencyHz(int k) {
        return k * sampleRateHz / segmentLength;
    }

    /** The reference's power in bin k (common scale). */
    double referencePower(int k) {
        return prr[k];
    }

    /** The output's power in bin k (common scale). */
    double outputPower(int k) {
        return poo[k];
    }

    /** |S_or| in bin k: the output's power that is coherent with the reference, as an amplitude product. */
    double crossMagnitude(int k) {
        return Math.hypot(sre[k], sim[k]);
    }

    /**
     * The delay of the output behind the reference in samples (negative when it leads), from the peak of
     * their cross-correlation: the cross spectrum zero-padded {@value #UPSAMPLE} times and transformed
     * back, then a parabola through the peak and its neighbours. Only delays within ±segmentLength/2 are
     * found.
     *
     * <p>The zero-padded transform of length 16M is taken as 16 transforms of length M, one per fraction
     * r/16 of a sample: with j = 16n + r, {@code e^(2πi·kj/16M) = e^(2πi·kn/M)·e^(2πi·kr/16M)}, so
     * interpolated value j is the M-point inverse transform of the spectrum turned by {@code e^(2πi·kr/16M)}
     * at n (the Nyquist bin's two images meet in one bin). Same values to rounding, with the M-point
     * transform's tables instead of a 16M-point one.
     */
    double delaySamples() {
        int m = segmentLength;
        int half = m / 2;
        int fine = m * UPSAMPLE;
        double[] c = new double[fine];
        // the turn by one sixteenth, e^(2πi·k/16M), per bin; the turn by r/16 is its r-th power
        double[] stepRe = new double[half + 1];
        double[] stepIm = new double[half + 1];
        for (int k = 0; k <= half; k++) {
            double angle = 2 * Math.PI * k / fine;
            stepRe[k] = Math.cos(angle);
            stepIm[k] = Math.sin(angle);
        }
        double[] turnRe = new double[half + 1];
        double[] turnIm = new double[half + 1];
        java.util.Arrays.fill(turnRe, 1);
        double[] re = new double[m];
        double[] im = new double[m];
        for (int r = 0; r < UPSAMPLE; r++) {
            for (int k = 0; k <= half; k++) {
                // S(k)·turn at +k, and its conjugate at −k (M − k): the two-sided spectrum of real signals
                double a = sre[k] * turnRe[k] - sim[k] * turnIm[k];
                double b = sre[k] * turnIm[k] + sim[k] * turnRe[k];
                if (k == 0) {
                    re[0] = a;
                    im[0] = b;
                } else if (k == half) {
                    // the Nyquist bin, halved between its two images, which meet here
                    re[k] = a;
                    im[k] = 0;
                } else {
                    re[k] = a;
                    im[k] = b;
                    re[m - k] = a;
                    im[m - k] = -b;
                }
            }
            Fft.inverse(re, im);
            for (int n = 0; n < m; n++) {
                c[n * UPSAMPLE + r] = re[n] / UPSAMPLE;
            }
            for (int k = 0; k <= half; k++) {
                double a = turnRe[k] * stepRe[k] - turnIm[k] * stepIm[k];
                turnIm[k] = turnRe[k] * stepIm[k] + turnIm[k] * stepRe[k];
                turnRe[k] = a;
            }
        }
        int best = 0;
        int span = half * UPSAMPLE;
        for (int j = -span + 1; j < span; j++) {
            if (c[Math.floorMod(j, fine)] > c[Math.floorMod(best, fine)]) {
                best = j;
            }
        }
        double y0 = c[Math.floorMod(best - 1, fine)];
        double y1 = c[Math.floorMod(best, fine)];
        double y2 = c[Math.floorMod(best + 1, fine)];
        double denominator = y0 - 2 * y1 + y2;
        double vertex = denominator < 0 ? 0.5 * (y0 - y2) / denominator : 0;
        return (best + vertex) / UPSAMPLE;
    }
}
