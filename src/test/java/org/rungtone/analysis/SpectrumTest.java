package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class SpectrumTest {
    @Test
    void agreesWithADirectDftOnShortSignals() {
        // Reference: the DFT by its definition, X_k = Σ x_n w_n e^{-2πikn/M} (Commons Math 3.6.1 is the
        // library under test; the direct sum is the independent second computation).
        SplittableRandom r = new SplittableRandom(3);
        for (int n : new int[] {16, 37, 100}) {
            double[] x = new double[n];
            for (int i = 0; i < n; i++) {
                x[i] = r.nextDouble() - 0.5;
            }
            Spectrum s = Spectrum.of(x, 1000, Window.HANN);
            int m = s.fftLength();
            double[] w = Window.HANN.values(n);
            double sw2 = 0;
            for (double v : w) {
                sw2 += v * v;
            }
            for (int k = 0; k <= m / 2; k++) {
                double re = 0;
                double im = 0;
                for (int i = 0; i < n; i++) {
                    re += x[i] * w[i] * Math.cos(2 * Math.PI * k * i / m);
                    im -= x[i] * w[i] * Math.sin(2 * Math.PI * k * i / m);
                }
                double c = k == 0 || k == m / 2 ? 1 : 2;
                double expected = c * (re * re + im * im) / (m * sw2) / 0.5;
                assertEquals(expected, s.power(k), 1e-12 * Math.max(1, expected), "n=" + n + " k=" + k);
            }
        }
    }

    @Test
    void binsAddUpToThePowerOfTheSignal() {
        // Parseval: with a rectangular window the bins sum to the mean square exactly (relative to ½).
        SplittableRandom r = new SplittableRandom(5);
        double[] x = new double[1024];
        double ms = 0;
        for (int i = 0; i < x.length; i++) {
            x[i] = r.nextDouble() * 2 - 1;
            ms += x[i] * x[i];
        }
        ms /= x.length;
        assertEquals(ms / 0.5, Spectrum.of(x, 8000, Window.RECTANGULAR).totalPower(), 1e-12);
    }

    @Test
    void fullScaleToneReadsZeroDbfsBothWays() {
        double rate = 48000;
        int n = 4096;
        Spectrum s = Spectrum.of(TestSignals.sine(1, 64 * rate / n, 0.3, rate, n).unsafeSamples(), rate,
                Window.BLACKMAN_HARRIS_7);
        assertEquals(0.0, s.toneDbfs(64), 1e-9);
        assertEquals(0.0, 10 * Math.log10(s.bandPower(56 * s.binHz(), 72 * s.binHz())), 1e-9);
    }

    @Test
    void welchAveragesToTheNoisePower() {
        SplittableRandom r = new SplittableRandom(7);
        double[] x = new double[1 << 16];
        for (int i = 0; i < x.length; i++) {
            x[i] = r.nextDouble() - 0.5;
        }
        // Uniform noise of width 1 has variance 1/12; relative to a full-scale sine that is 1/6.
        assertEquals(1.0 / 6, Spectrum.welch(x, 8000, Window.HANN, 1024).totalPower(), 0.01 / 6);
    }

    @Test
    void rejectsLengthsThatAreNotPowersOfTwo() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Spectrum.of(new double[8], 8000, Window.HANN, 12));
        assertEquals("transform length must be a power of two: 12", e.getMessage());
    }

    @Test
    void welchWithPairedTransformsEqualsTheAverageOfEachSegmentsSpectrum() {
        // Welch (1967): the average of the segments' periodograms; 7 segments, so one is transformed alone
        SplittableRandom rnd = new SplittableRandom(7);
        double[] x = new double[256 * 4];
        for (int i = 0; i < x.length; i++) {
            x[i] = 0.3 + 0.5 * Math.sin(0.37 * i) + 0.1 * (rnd.nextDouble() - 0.5);
        }
        Spectrum w = Spectrum.welch(x, 0.3, 8000, Window.HANN, 256);
        double[] expected = new double[129];
        int segments = 7;
        for (int s = 0; s < segments; s++) {
            double[] seg = new double[256];
            for (int i = 0; i < 256; i++) {
                seg[i] = x[s * 128 + i] - 0.3;
            }
            Spectrum one = Spectrum.of(seg, 8000, Window.HANN, 256);
            for (int k = 0; k < expected.length; k++) {
                expected[k] += one.power(k) / segments;
            }
        }
        for (int k = 0; k < expected.length; k++) {
            assertEquals(expected[k], w.power(k), 1e-12 * (1 + expected[k]), "bin " + k);
        }
    }
}
