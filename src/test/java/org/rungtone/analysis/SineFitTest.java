package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.fitting.HarmonicCurveFitter;
import org.apache.commons.math3.fitting.WeightedObservedPoint;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.rungtone.source.Signal;

class SineFitTest {
    @Test
    void agreesWithCommonsMathHarmonicCurveFitterOnNoiselessData() {
        // Reference: Apache Commons Math 3.6.1 HarmonicCurveFitter, model a·cos(ω·x + φ).
        double rate = 8000;
        int n = 2000;
        double a = 0.7;
        double hz = 441.3;
        double phase = 0.9;
        double[] y = new double[n];
        List<WeightedObservedPoint> points = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            y[i] = a * Math.cos(2 * Math.PI * hz * i / rate + phase);
            points.add(new WeightedObservedPoint(1, i, y[i]));
        }
        // Its own guesser needs many samples per cycle, so it starts from a rough point instead.
        double[] ref = HarmonicCurveFitter.create()
                .withStartPoint(new double[] {0.5, 2 * Math.PI * 441.0 / rate, 0.5}).fit(points);
        SineFit.Result fit = SineFit.fit(y, rate);
        assertEquals(ref[0], fit.amplitude(), 1e-9);
        assertEquals(ref[1] * rate / (2 * Math.PI), fit.frequencyHz(), 1e-7);
        assertEquals(Math.IEEEremainder(ref[2], 2 * Math.PI), fit.phaseRad(), 1e-7);
        assertEquals(0.0, fit.offset(), 1e-12);
        assertEquals(0.0, fit.residualRms(), 1e-10);
    }

    @Test
    void findsTheFrequencyFromASeedOffByAFractionOfABin() {
        double rate = 48000;
        int n = 4096;
        double hz = 1234.5;
        double[] y = TestSignals.sine(0.5, hz, 1.0, rate, n).samples();
        for (int i = 0; i < n; i++) {
            y[i] += 0.25;
        }
        SineFit.Result fit = SineFit.fit(y, rate, hz + 0.3 * rate / n);
        assertEquals(hz, fit.frequencyHz(), 1e-8);
        assertEquals(0.5, fit.amplitude(), 1e-12);
        assertEquals(0.25, fit.offset(), 1e-12);
    }

    @ParameterizedTest
    @ValueSource(ints = {6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 16})
    void idealQuantizerSinadFollowsBennett(int bits) {
        // SNR = 6.02·N + 1.76 dB for a full-scale sine through an ideal N-bit quantizer (W. R. Bennett,
        // "Spectra of Quantized Signals", BSTJ 27, 1948; Analog Devices MT-001); the input is scaled to the
        // textbook full scale (see TestSignals). ENOB = (SINAD − 1.76)/6.02 (IEEE Std 1241-2010).
        Signal q = TestSignals.quantizedFullScaleSine(bits);
        SineFit.Result fit = SineFit.fit(q.unsafeSamples(), q.sampleRateHz());
        assertEquals(TestSignals.bennettDb(bits), fit.sinadDb(), 0.2, "bits " + bits);
        assertEquals(bits, fit.enobBits(), 0.05);
    }

    @Test
    void rejectsTooShortSignals() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> SineFit.fit(new double[8], 8000));
        assertEquals("a sine fit needs at least 16 samples: 8", e.getMessage());
    }
}
