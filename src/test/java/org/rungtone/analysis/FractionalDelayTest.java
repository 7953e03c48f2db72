package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;

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
}
