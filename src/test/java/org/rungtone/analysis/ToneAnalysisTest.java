package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.rungtone.source.Signal;

class ToneAnalysisTest {
    @ParameterizedTest
    @ValueSource(ints = {6, 7, 8, 9, 10, 11, 12, 13, 14, 15, 16})
    void idealQuantizerFftSinadFollowsBennett(int bits) {
        // Bennett 1948 / MT-001: 6.02·N + 1.76 dB for a textbook full-scale sine (see TestSignals).
        Signal q = TestSignals.quantizedFullScaleSine(bits);
        ToneReport r = ToneAnalysis.analyze(q);
        assertEquals(TestSignals.bennettDb(bits), r.fftSinadDb(), 0.2, "bits " + bits);
        assertEquals(TestSignals.bennettDb(bits), r.sinadDb(), 0.2, "bits " + bits);
        // ENOB recovers N (IEEE Std 1241-2010 definition).
        assertEquals(bits, r.enobBits(), 0.05);
        assertEquals(997, r.fundamentalHz(), 1e-4);
    }

    @Test
    void knownHarmonicsGiveTheAnalyticThdAndSfdr() {
        // A sine with 1 % second and 0.5 % third harmonic: THD = 10·log10(0.01² + 0.005²) = -39.03 dB,
        // SFDR = -20·log10(0.01) = 40 dB (definitions of IEEE Std 1241-2010; values analytic).
        double rate = 48000;
        int n = 1 << 15;
        double f = 1000.3;
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            double w = 2 * Math.PI * f * i / rate;
            x[i] = 0.9 * (Math.sin(w) + 0.01 * Math.sin(2 * w + 0.4) + 0.005 * Math.sin(3 * w + 1.1));
        }
        ToneReport r = ToneAnalysis.analyze(Signal.wrap(x, rate));
        assertEquals(10 * Math.log10(0.01 * 0.01 + 0.005 * 0.005), r.thdDb(), 0.05);
        assertEquals(40.0, r.sfdrDb(), 0.1);
        assertEquals(-40.0, r.harmonics().get(0).levelDbc(), 0.05);
        assertEquals(-46.02, r.harmonics().get(1).levelDbc(), 0.05);
        assertEquals(20 * Math.log10(0.9), r.amplitudeDbfs(), 1e-3);
        assertTrue(r.snrDb() > 150, "noise-free signal, SNR " + r.snrDb());
    }

    @Test
    void snrOfASineInWhiteNoiseIsTheirPowerRatio() {
        // Sine of amplitude 0.5 plus uniform noise of width w (variance w²/12): SNR = (0.5²/2)/(w²/12),
        // analytic; with no harmonics SINAD equals SNR and THD sits at the noise in the harmonic lobes.
        double rate = 48000;
        int n = 1 << 16;
        double w = 1e-3;
        SplittableRandom random = new SplittableRandom(2);
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = 0.5 * Math.sin(2 * Math.PI * 3001.1 * i / rate) + w * (random.nextDouble() - 0.5);
        }
        ToneReport r = ToneAnalysis.analyze(Signal.wrap(x, rate));
        double expected = 10 * Math.log10(0.125 / (w * w / 12));
        assertEquals(expected, r.snrDb(), 0.1);
        assertEquals(expected, r.fftSinadDb(), 0.1);
        assertEquals(expected, r.sinadDb(), 0.1);
        assertEquals(10 * Math.log10(w * w / 12 / 0.5), r.noiseFloorDbfs(), 0.1);
    }

    @Test
    void harmonicsAboveNyquistFoldBack() {
        // 3·7 kHz = 21 kHz at 16 kHz sampling folds to 21 − 16 = 5 kHz; 2·7 = 14 kHz folds to 16 − 14.
        assertEquals(5000.0, ToneAnalysis.foldedHz(7000, 3, 16000), 1e-9);
        assertEquals(2000.0, ToneAnalysis.foldedHz(7000, 2, 16000), 1e-9);
        double rate = 16000;
        int n = 1 << 14;
        double f = 7001.7;
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            double w = 2 * Math.PI * f * i / rate;
            x[i] = 0.5 * Math.sin(w) + 0.005 * Math.sin(3 * w);
        }
        ToneReport r = ToneAnalysis.analyze(Signal.wrap(x, rate));
        ToneReport.Harmonic third = r.harmonics().stream().filter(h -> h.order() == 3).findFirst().orElseThrow();
        assertEquals(3 * f - rate, third.frequencyHz(), 1e-4);
        assertEquals(-40.0, third.levelDbc(), 0.05);
    }
}
