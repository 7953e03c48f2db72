package org.rungtone.script;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.function.DoubleUnaryOperator;
import org.junit.jupiter.api.Test;

/** Phase-continuous oscillators against analytic phase and instantaneous frequency. */
class OscillatorTest {
    @Test
    void constantSineEqualsTheAnalyticSine() {
        // Reference sin(2π·f·n/fs) with the phase reduced exactly in integers: (f·n mod fs)/fs.
        double[] y = Scripts.clip("sine(440Hz)", 2, 48000);
        double worst = 0;
        for (int n = 0; n < y.length; n++) {
            double phase = (440L * n % 48000) / 48000.0;
            worst = Math.max(worst, Math.abs(y[n] - Math.sin(2 * Math.PI * phase)));
        }
        assertEquals(0, worst, 1e-12);
    }

    @Test
    void sineOfNonIntegerFrequencyEqualsTheAnalyticSine() {
        // 1234.5 Hz at 44.1 kHz: phase = (2469·n mod 88200)/88200 exactly.
        double[] y = Scripts.clip("sine(1234.5Hz)", 1, 44100);
        double worst = 0;
        for (int n = 0; n < y.length; n++) {
            double phase = (2469L * n % 88200) / 88200.0;
            worst = Math.max(worst, Math.abs(y[n] - Math.sin(2 * Math.PI * phase)));
        }
        assertEquals(0, worst, 1e-12);
    }

    @Test
    void linearSweepCrossesZeroAtTheInstantaneousFrequency() {
        double rate = 48000;
        double[] y = Scripts.clip("sine(linsweep(100Hz, 2kHz, 1s))", 1, rate);
        DoubleUnaryOperator f = t -> 100 + 1900 * t;
        assertEquals(0, worstRelativeError(y, rate, f, 0.0, 1.0), 0.005);
    }

    @Test
    void exponentialSweepCrossesZeroAtTheInstantaneousFrequency() {
        double rate = 48000;
        double[] y = Scripts.clip("sine(logsweep(20Hz, 20kHz, 2s))", 2, rate);
        DoubleUnaryOperator f = t -> 20 * Math.pow(1000, t / 2);
        // up to 6 kHz, where a half period still spans four samples
        assertEquals(0, worstRelativeError(y, rate, f, 0.0, 2 * Math.log(300) / Math.log(1000)), 0.005);
    }

    @Test
    void naiveSweepFormulaHasTheWrongFrequencyWhileTheOscillatorIsRight() {
        // sin(2π·f(t)·t) has instantaneous frequency d(f(t)·t)/dt = f(t) + t·f'(t): near t = 0.9 s that is
        // 100 + 2·1900·0.9 = 3520 Hz, not f(0.9) = 1810 Hz.
        double rate = 48000;
        DoubleUnaryOperator f = t -> 100 + 1900 * t;
        double[] integrated = Scripts.clip("sine(linsweep(100Hz, 2kHz, 1s))", 1, rate);
        double[] naive = Scripts.clip("sin(2 * pi * linsweep(100Hz, 2kHz, 1s) * t)", 1, rate);
        double good = worstRelativeError(integrated, rate, f, 0.85, 0.95);
        double bad = worstRelativeError(naive, rate, f, 0.85, 0.95);
        assertTrue(good < 0.005, "integrated phase error " + good);
        assertTrue(bad > 0.8, "naive formula error " + bad);
        double[] measured = crossingFrequencies(naive, rate, 0.89, 0.91);
        assertEquals(3520, measured[measured.length / 2], 3520 * 0.01);
    }

    @Test
    void frequencyStepKeepsThePhaseContinuous() {
        double rate = 48000;
        double[] y = Scripts.clip("sine(if t < 0.5 then 440Hz else 660Hz)", 1, rate);
        double maxStep = 0;
        for (int i = 1; i < y.length; i++) {
            maxStep = Math.max(maxStep, Math.abs(y[i] - y[i - 1]));
        }
        // A continuous sine moves at most 2π·f/fs per sample; a phase jump would show as a larger step.
        assertTrue(maxStep <= 2 * Math.PI * 660 / rate * 1.0001, "largest step " + maxStep);
    }

    @Test
    void waveformsHaveTheirShapesAtKnownPhases() {
        // 1 Hz at 8 samples per second: phases 0, 1/8, 2/8, ...
        assertArrayEquals(new double[] {0, 0.5, 1, 0.5, 0, -0.5, -1, -0.5}, Scripts.clip("triangle(1Hz)", 1, 8),
                1e-12);
        assertArrayEquals(new double[] {1, 1, -1, -1, -1, -1, -1, -1}, Scripts.clip("square(1Hz, 25%)", 1, 8), 0);
        assertArrayEquals(new double[] {1, 1, 1, 1, -1, -1, -1, -1}, Scripts.clip("square(1Hz)", 1, 8), 0);
        assertArrayEquals(new double[] {0, 0.25, 0.5, 0.75, -1, -0.75, -0.5, -0.25}, Scripts.clip("sawup(1Hz)", 1, 8),
                1e-12);
        assertArrayEquals(new double[] {0, -0.25, -0.5, -0.75, 1, 0.75, 0.5, 0.25},
                Scripts.clip("sawdown(1Hz)", 1, 8), 1e-12);
        assertArrayEquals(new double[] {1, 1, 0, 0, 0, 0, 0, 0}, Scripts.clip("pulse(1Hz, 250ms)", 1, 8), 0);
        double h = Math.sqrt(0.5);
        assertArrayEquals(new double[] {1, h, 0, -h, -1, -h, 0, h}, Scripts.clip("sine(1Hz, 0.25)", 1, 8), 1e-15);
    }

    @Test
    void oscillatorRestartsWithItsPart() {
        double rate = 48000;
        double[] y = Scripts.clip("sine(1234Hz) every 100ms", 0.3, rate);
        for (int i = 0; i < 4800; i++) {
            assertEquals(y[i], y[4800 + i], 1e-12, "sample " + i);
            assertEquals(y[i], y[9600 + i], 1e-12, "sample " + i);
        }
    }

    /** The worst |f_measured/f(t) − 1| over zero-crossing pairs whose midpoint lies in [from, to] seconds. */
    private static double worstRelativeError(double[] y, double rate, DoubleUnaryOperator f, double from,
            double to) {
        List<Double> crossings = crossings(y, rate);
        double worst = 0;
        for (int k = 1; k < crossings.size(); k++) {
            double mid = 0.5 * (crossings.get(k) + crossings.get(k - 1));
            if (mid >= from && mid <= to) {
                double measured = 0.5 / (crossings.get(k) - crossings.get(k - 1));
                worst = Math.max(worst, Math.abs(measured / f.applyAsDouble(mid) - 1));
            }
        }
        return worst;
    }

    private static double[] crossingFrequencies(double[] y, double rate, double from, double to) {
        List<Double> crossings = crossings(y, rate);
        List<Double> result = new ArrayList<>();
        for (int k = 1; k < crossings.size(); k++) {
            double mid = 0.5 * (crossings.get(k) + crossings.get(k - 1));
            if (mid >= from && mid <= to) {
                result.add(0.5 / (crossings.get(k) - crossings.get(k - 1)));
            }
        }
        return result.stream().mapToDouble(Double::doubleValue).toArray();
    }

    /** Times of sign changes, located by linear interpolation between the two samples around each. */
    private static List<Double> crossings(double[] y, double rate) {
        List<Double> times = new ArrayList<>();
        for (int i = 1; i < y.length; i++) {
            if ((y[i - 1] < 0) != (y[i] < 0) && y[i - 1] != y[i]) {
                double frac = y[i - 1] / (y[i - 1] - y[i]);
                times.add((i - 1 + frac) / rate);
            }
        }
        return times;
    }
}
