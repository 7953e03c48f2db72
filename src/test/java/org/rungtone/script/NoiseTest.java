package org.rungtone.script;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.util.Arrays;
import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.transform.DftNormalization;
import org.apache.commons.math3.transform.FastFourierTransformer;
import org.apache.commons.math3.transform.TransformType;
import org.junit.jupiter.api.Test;

/** Seeded noise: reproducible, with the specified moments and spectral slope. */
class NoiseTest {
    private static final int N = 200_000;

    @Test
    void sameSeedGivesIdenticalSamplesAndAnotherSeedDoesNot() {
        String expr = "white() + gauss(0.1) + pink(0.1)";
        double[] a = Scripts.clip("", expr, 1, 16000, 42);
        double[] b = Scripts.clip("", expr, 1, 16000, 42);
        double[] c = Scripts.clip("", expr, 1, 16000, 43);
        assertArrayEquals(a, b, 0);
        assertFalse(Arrays.equals(a, c));
    }

    @Test
    void twoNoiseSourcesInOneScriptAreIndependent() {
        double[] y = Scripts.clip("", "white() - white()", 1, 16000, 7);
        // Two independent uniform sources: the difference has variance 2/3, not 0.
        assertEquals(2.0 / 3, variance(y), 0.03);
    }

    @Test
    void uniformWhiteNoiseHasZeroMeanAndVarianceOneThirdOfLevelSquared() {
        // Uniform on [−a, a]: mean 0, variance a²/3, fourth central moment a⁴/5 (moments of the uniform
        // distribution, A. Papoulis, S. U. Pillai, Probability, Random Variables and Stochastic Processes,
        // 4th ed., 2002). Bounds are 5 standard errors: sqrt(σ²/N) for the mean, sqrt((μ4 − σ⁴)/N) for the
        // variance.
        double a = 0.5;
        double[] y = Scripts.clip("", "white(0.5)", N / 10000.0, 10000, 3);
        double var = a * a / 3;
        assertEquals(0, mean(y), 5 * Math.sqrt(var / N));
        assertEquals(var, variance(y), 5 * Math.sqrt((Math.pow(a, 4) / 5 - var * var) / N));
        assertEquals(a, Arrays.stream(y).map(Math::abs).max().orElse(0), 0.001);
    }

    @Test
    void gaussianWhiteNoiseHasTheRequestedStandardDeviation() {
        // Normal: standard error of the mean σ/√N, of the variance σ²·sqrt(2/N) (same source as above).
        double sigma = 0.25;
        double[] y = Scripts.clip("", "gauss(0.25)", N / 10000.0, 10000, 5);
        assertEquals(0, mean(y), 5 * sigma / Math.sqrt(N));
        assertEquals(sigma * sigma, variance(y), 5 * sigma * sigma * Math.sqrt(2.0 / N));
    }

    @Test
    void pinkNoiseFallsThreeDecibelsPerOctave() {
        // 1/f power: 10·log10(2) = 3.01 dB less power density per octave. Welch estimate (P. D. Welch,
        // IEEE Trans. Audio Electroacoust. 15(2), 1967; Hann window, 4096 points, half overlap) with the
        // Commons Math FFT, averaged in 12 log-spaced bands over 100 Hz to 5 kHz, then a least-squares line
        // of band level against octaves.
        double rate = 16000;
        double[] y = Scripts.clip("", "pink(0.2)", 8, rate, 11);
        double[] psd = welch(y, 4096);
        double binHz = rate / 4096;
        int bands = 12;
        double[] x = new double[bands];
        double[] level = new double[bands];
        for (int k = 0; k < bands; k++) {
            double lo = 100 * Math.pow(50, k / (double) bands);
            double hi = 100 * Math.pow(50, (k + 1) / (double) bands);
            double sum = 0;
            int count = 0;
            for (int bin = (int) Math.ceil(lo / binHz); bin * binHz < hi; bin++) {
                sum += psd[bin];
                count++;
            }
            x[k] = Math.log(Math.sqrt(lo * hi) / 100) / Math.log(2);
            level[k] = 10 * Math.log10(sum / count);
        }
        assertEquals(-3.01, slope(x, level), 1.0);
    }

    @Test
    void pinkNoiseHasRoughlyTheRequestedRms() {
        double[] y = Scripts.clip("", "pink(0.2)", 8, 16000, 13);
        assertEquals(0.2, Math.sqrt(variance(y)), 0.2 * 0.1);
    }

    private static double[] welch(double[] y, int size) {
        FastFourierTransformer fft = new FastFourierTransformer(DftNormalization.STANDARD);
        double[] window = new double[size];
        for (int i = 0; i < size; i++) {
            window[i] = 0.5 - 0.5 * Math.cos(2 * Math.PI * i / size);
        }
        double[] psd = new double[size / 2 + 1];
        int segments = 0;
        for (int start = 0; start + size <= y.length; start += size / 2) {
            double[] seg = new double[size];
            for (int i = 0; i < size; i++) {
                seg[i] = y[start + i] * window[i];
            }
            Complex[] spectrum = fft.transform(seg, TransformType.FORWARD);
            for (int k = 0; k < psd.length; k++) {
                double m = spectrum[k].abs();
                psd[k] += m * m;
            }
            segments++;
        }
        for (int k = 0; k < psd.length; k++) {
            psd[k] /= segments;
        }
        return psd;
    }

    private static double slope(double[] x, double[] y) {
        double mx = Arrays.stream(x).average().orElse(0);
        double my = Arrays.stream(y).average().orElse(0);
        double sxy = 0;
        double sxx = 0;
        for (int i = 0; i < x.length; i++) {
            sxy += (x[i] - mx) * (y[i] - my);
            sxx += (x[i] - mx) * (x[i] - mx);
        }
        return sxy / sxx;
    }

    private static double mean(double[] y) {
        return Arrays.stream(y).average().orElse(Double.NaN);
    }

    private static double variance(double[] y) {
        double m = mean(y);
        return Arrays.stream(y).map(v -> (v - m) * (v - m)).sum() / (y.length - 1);
    }
}
