package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;
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
        // ENOB recovers N (IEEE Std 1241-2010 definition); at full scale both ENOBs agree.
        assertEquals(bits, r.enobSignalBits(), 0.05);
        assertEquals(bits, r.enobFullScaleBits(), 0.05);
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
        assertTrue(r.harmonics().get(0).standsOut() && r.harmonics().get(1).standsOut());
        assertFalse(r.thdBelowNoise());
        assertFalse(r.sfdrLimitedByNoise());
        assertEquals(20 * Math.log10(0.9), r.amplitudeDbfs(), 1e-3);
        assertTrue(r.snrDb() > 150, "noise-free signal, SNR " + r.snrDb());
    }

    @Test
    void snrOfASineInWhiteNoiseIsTheirPowerRatio() {
        // Sine of amplitude 0.5 plus uniform noise of width w (variance w²/12): SNR = (0.5²/2)/(w²/12),
        // analytic; with no harmonics SINAD equals SNR, and neither a harmonic nor another spur stands out.
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
        assertTrue(r.thdBelowNoise());
        assertTrue(r.sfdrLimitedByNoise());
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

    @Test
    void ditheredEightBitToneHasNoThdButTheNoise() {
        // An ideal 8-bit quantizer with TPDF dither: the error is independent of the signal (Lipshitz,
        // Wannamaker, Vanderkooy, JAES 40(5), 1992), so there are no harmonics, only noise at
        // 6.02·8 + 1.76 − 4.77 = 45.0 dB below a full-scale tone (Bennett 1948 plus the TPDF penalty; this
        // tone is 0.09 dB below, so that the dither never reaches past the end levels and clips). IEEE Std
        // 1241-2010 removes the noise in the harmonics' bins: THD must come out far below the noise, and
        // flagged as below it, not as the noise's share of those bins.
        Signal q = TestSignals.quantized(TestSignals.sine(0.99, 997, 0.2, 48000, 1 << 16), 8, Dither.TPDF,
                ErrorFilter.NONE, 3);
        ToneReport r = ToneAnalysis.analyze(q);
        assertEquals(6.02 * 8 + 1.76 - 4.77 - 0.09, r.snrDb(), 0.3);
        assertTrue(r.thdBelowNoise());
        assertTrue(r.thdDb() < -70, "THD limit " + r.thdDb());
        assertTrue(r.harmonics().stream().noneMatch(ToneReport.Harmonic::standsOut));
        assertTrue(r.sfdrLimitedByNoise());
        // the noise's own largest peaks, read as tones, lie far below the total noise
        assertTrue(r.sfdrDb() > r.snrDb() + 15, "SFDR " + r.sfdrDb());
    }

    @Test
    void thirdHarmonicInWhiteNoiseGivesItsOwnThdAndSfdr() {
        // A 3rd harmonic at −50 dBc and white noise 30 dB below the tone (uniform, variance w²/12). The
        // noise in the nine harmonic lobes alone is about −53 dBc, so counting it would read THD near
        // −48.3 dB; with it removed (IEEE Std 1241-2010) THD and SFDR are the harmonic's −50 dBc. One record
        // of 2^16 samples measures a −50 dBc tone in this noise to about ±0.5 dB (the cross term of tone and
        // noise in its bins, 2·√(P·N_bin)), so each record is held to ±1.5 dB and the power mean of eight
        // records to ±0.5 dB.
        double thd = 0;
        double spur = 0;
        int records = 8;
        for (int seed = 1; seed <= records; seed++) {
            ToneReport r = ToneAnalysis.analyze(toneWithThirdHarmonicInNoise(seed));
            assertEquals(30, r.snrDb(), 0.3);
            assertEquals(-50, r.thdDb(), 1.5);
            assertEquals(50, r.sfdrDb(), 1.5);
            assertFalse(r.thdBelowNoise());
            assertFalse(r.sfdrLimitedByNoise());
            ToneReport.Harmonic third = r.harmonics().get(1);
            assertEquals(3, third.order());
            assertTrue(third.standsOut());
            thd += Math.pow(10, r.thdDb() / 10) / records;
            spur += Math.pow(10, -r.sfdrDb() / 10) / records;
        }
        assertEquals(-50, 10 * Math.log10(thd), 0.5);
        assertEquals(50, -10 * Math.log10(spur), 0.5);
    }

    /** 0.9·sin(ωt) + (−50 dBc)·sin(3ωt + 0.3) + uniform noise 30 dB below the tone, 2^16 samples. */
    private static Signal toneWithThirdHarmonicInNoise(long seed) {
        double rate = 48000;
        int n = 1 << 16;
        double a = 0.9;
        double h3 = a * Math.pow(10, -50 / 20.0);
        double w = Math.sqrt(12 * a * a / 2 / 1000);
        SplittableRandom random = new SplittableRandom(seed);
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            double ph = 2 * Math.PI * 1000.7 * i / rate;
            x[i] = a * Math.sin(ph) + h3 * Math.sin(3 * ph + 0.3) + w * (random.nextDouble() - 0.5);
        }
        return Signal.wrap(x, rate);
    }

    @Test
    void aSpurBetweenTheHarmonicsSetsSfdr() {
        // A non-harmonic spur at −60 dBc (1.37 times the tone's frequency) over white noise 50 dB down:
        // SFDR = 60 dB (IEEE Std 1241-2010 definition; values analytic).
        double rate = 48000;
        int n = 1 << 16;
        double w = Math.sqrt(12 * 0.5 / 1e5);
        SplittableRandom random = new SplittableRandom(5);
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            double t = (double) i / rate;
            x[i] = Math.sin(2 * Math.PI * 1500.3 * t) + 1e-3 * Math.sin(2 * Math.PI * 1500.3 * 1.37 * t)
                    + w * (random.nextDouble() - 0.5);
        }
        ToneReport r = ToneAnalysis.analyze(Signal.wrap(x, rate));
        assertEquals(60, r.sfdrDb(), 0.2);
        assertFalse(r.sfdrLimitedByNoise());
        assertTrue(r.thdBelowNoise());
    }

    @Test
    void enobReFullScaleAddsTheLevelBelowFullScale() {
        // Half of the textbook full scale through an ideal 10-bit quantizer: the error stays q²/12 (Bennett
        // 1948), so SINAD falls by 6.02 dB and ENOB re signal by one bit; IEEE Std 1241-2010 refers ENOB to
        // a full-scale sine, which adds the 6.02 dB back: 10 bits.
        Signal q = TestSignals.quantized(TestSignals.sine(TestSignals.textbookFullScale(10) / 2, 997, 0.2, 48000,
                1 << 16), 10, Dither.NONE, ErrorFilter.NONE, 1);
        ToneReport r = ToneAnalysis.analyze(q);
        assertEquals(9, r.enobSignalBits(), 0.05);
        assertEquals(10, r.enobFullScaleBits(), 0.05);
    }

    @Test
    void aTinySpurInTheQuietBandOfShapedNoiseDoesNotSetSfdr() {
        // Second-order shaping leaves almost no noise near DC and much near rate/2 (|1 − z^−1|², Gerzon and
        // Craven 1989). A −110 dBc spur at 123 Hz stands out of the quiet noise there, but a spur a thousand
        // times larger could hide in the loud noise higher up: SFDR is a lower limit set by that noise.
        double rate = 16000;
        int n = 1 << 16;
        double spur = 0.8 * Math.pow(10, -110 / 20.0);
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            double t = i / rate;
            x[i] = 0.8 * Math.sin(2 * Math.PI * 523.3 * t) + spur * Math.sin(2 * Math.PI * 123.1 * t);
        }
        Signal q = TestSignals.quantized(Signal.wrap(x, rate), 8, Dither.TPDF, ErrorFilter.SECOND_ORDER, 2);
        ToneReport r = ToneAnalysis.analyze(q);
        assertTrue(r.sfdrLimitedByNoise());
        assertTrue(r.sfdrDb() < 80, "SFDR " + r.sfdrDb());
    }
}
