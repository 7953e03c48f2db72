package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.SplittableRandom;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class FractionalDelayTest {
    @ParameterizedTest
    @CsvSource({"0.37, 1000", "-2.61, 7000", "3.5, 19900", "0, 15000", "12.25, 440"})
    void delaysASineByThatMuchUpToThePassEdge(double delay, double hz) {
        // A sampled sine delayed by d samples is sin(ω(n − d)) exactly (band-limited interpolation,
        // Oppenheim & Schafer); the sinc shortened by a Kaiser window designed for 100 dB holds that to
        // 2e-5 of the amplitude (-94 dB) at worst, a half-sample delay at the pass edge (Kaiser's length
        // formula is an approximation, good to a few dB).
        double rate = 44_100;
        int n = 4000;
        double w = 2 * Math.PI * hz / rate;
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = Math.sin(w * i + 0.3);
        }
        double[] y = new FractionalDelay(delay, rate, 20_000, 100).apply(x, n);
        // away from the ends, where the kernel reaches past the samples
        for (int i = 200; i < n - 200; i++) {
            assertEquals(Math.sin(w * (i - delay) + 0.3), y[i], 2e-5, "sample " + i);
        }
    }

    /**
     * The fast convolution and the direct sum that short runs take give {@code y[n] = Σ_k h[k]·x[n − first − k]}
     * (zero outside x) at every output, the ends included, over lengths shorter and longer than one block and
     * one chunk; apply takes the direct sum below its threshold.
     */
    @ParameterizedTest
    @CsvSource({"0.37, 100, 100", "-2.61, 3000, 2900", "3.5, 70000, 70000", "12.25, 131073, 140000",
        "-40.5, 2000, 2000"})
    void fastConvolutionIsTheDirectSum(double delay, int inputLength, int length) {
        SplittableRandom rnd = new SplittableRandom(11);
        double[] x = new double[inputLength];
        for (int i = 0; i < x.length; i++) {
            x[i] = rnd.nextDouble(-1, 1);
        }
        FractionalDelay d = new FractionalDelay(delay, 44_100, 20_000, 100);
        double[] fast = d.convolved(x, length);
        double[] summed = d.direct(x, length);
        double[] applied = d.apply(x, length);
        double[] h = d.kernel();
        for (int n = 0; n < length; n++) {
            double direct = 0;
            for (int k = 0; k < h.length; k++) {
                long m = (long) n - d.first() - k;
                if (m >= 0 && m < x.length) {
                    direct += h[k] * x[(int) m];
                }
            }
            // rounding of a 1024-point transform and back on values of order 1 (common practice, no source)
            assertEquals(direct, fast[n], 1e-12, "fast convolution, output " + n);
            assertEquals(direct, summed[n], 1e-13, "direct sum, output " + n);
            assertEquals(length < FractionalDelay.DIRECT_BELOW ? summed[n] : fast[n], applied[n], 0.0, "output " + n);
        }
    }
}
