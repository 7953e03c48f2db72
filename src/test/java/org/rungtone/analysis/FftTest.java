package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.apache.commons.math3.transform.DftNormalization;
import org.apache.commons.math3.transform.FastFourierTransformer;
import org.apache.commons.math3.transform.TransformType;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/** The transform against its definition, a known pair, its inverse and Commons Math's. */
class FftTest {
    /**
     * Every length from 1 to 2^10 (odd and even numbers of stages) against the sum that defines the DFT,
     * {@code X_k = Σ x_n·e^(−2πi·nk/N)} (A. V. Oppenheim and R. W. Schafer, Discrete-Time Signal Processing,
     * 3rd ed., ch. 8), evaluated with the angle reduced mod N so that it is accurate to rounding.
     */
    @ParameterizedTest
    @ValueSource(ints = {1, 2, 4, 8, 16, 32, 64, 128, 256, 512, 1024})
    void forwardIsTheDefiningSum(int n) {
        double[] xr = noise(n, n);
        double[] xi = noise(n, n + 1);
        double[] re = xr.clone();
        double[] im = xi.clone();
        Fft.forward(re, im);
        double worst = 0;
        for (int k = 0; k < n; k++) {
            double sr = 0;
            double si = 0;
            for (int j = 0; j < n; j++) {
                double angle = -2 * Math.PI * (((long) j * k) % n) / n;
                sr += xr[j] * Math.cos(angle) - xi[j] * Math.sin(angle);
                si += xr[j] * Math.sin(angle) + xi[j] * Math.cos(angle);
            }
            worst = Math.max(worst, Math.hypot(re[k] - sr, im[k] - si));
        }
        // |X_k| is about √N for unit-variance input; rounding in log2 N stages stays far below 1e-13·√N
        assertTrue(worst < 1e-13 * Math.sqrt(n) + 1e-15, "worst error " + worst + " at N = " + n);
    }

    /** A cosine of k0 cycles in N samples transforms to N/2 at bins k0 and N − k0 and zero elsewhere. */
    @Test
    void aCosineLandsInItsTwoBins() {
        int n = 4096;
        int k0 = 37;
        double[] re = new double[n];
        double[] im = new double[n];
        for (int i = 0; i < n; i++) {
            re[i] = Math.cos(2 * Math.PI * k0 * i / n);
        }
        Fft.forward(re, im);
        for (int k = 0; k < n; k++) {
            double expected = k == k0 || k == n - k0 ? n / 2.0 : 0;
            assertEquals(expected, re[k], 1e-9, "re at bin " + k);
            assertEquals(0, im[k], 1e-9, "im at bin " + k);
        }
    }

    @ParameterizedTest
    @ValueSource(ints = {2, 8, 512, 8192, 131072})
    void inverseUndoesForwardAndAgreesWithCommonsMath(int n) {
        double[] xr = noise(n, 7);
        double[] xi = noise(n, 8);
        double[] re = xr.clone();
        double[] im = xi.clone();
        Fft.forward(re, im);
        double[][] theirs = {xr.clone(), xi.clone()};
        FastFourierTransformer.transformInPlace(theirs, DftNormalization.STANDARD, TransformType.FORWARD);
        double scale = Math.sqrt(n);
        for (int k = 0; k < n; k++) {
            // Commons Math makes its twiddles by recurrence: its own error grows to about 1e-12 at 2^17
            assertEquals(theirs[0][k], re[k], 1e-11 * scale, "re at bin " + k);
            assertEquals(theirs[1][k], im[k], 1e-11 * scale, "im at bin " + k);
        }
        Fft.inverse(re, im);
        for (int i = 0; i < n; i++) {
            assertEquals(xr[i], re[i], 1e-14, "re at " + i);
            assertEquals(xi[i], im[i], 1e-14, "im at " + i);
        }
    }

    @Test
    void lengthsMustBeOnePowerOfTwo() {
        assertThrows(IllegalArgumentException.class, () -> Fft.forward(new double[12], new double[12]));
        assertThrows(IllegalArgumentException.class, () -> Fft.forward(new double[16], new double[8]));
    }

    /** n samples uniform in [−1, 1) from the given seed. */
    private static double[] noise(int n, long seed) {
        SplittableRandom rnd = new SplittableRandom(seed);
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = rnd.nextDouble(-1, 1);
        }
        return x;
    }
}
