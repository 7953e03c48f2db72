package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;

class ShapingGainTest {
    @Test
    void firstOrderGainMatchesTheClosedForm() {
        // |1 − e^−jω|² = 4·sin²(ω/2) = 2(1 − cos ω) (Gerzon & Craven 1989); its integral to π/4 is
        // 2(π/4 − sin(π/4)), so the in-band gain below rate/8 is 10·log10((π/4) / that) ≈ +7.0 dB.
        double expected = 10 * Math.log10((Math.PI / 4) / (2 * (Math.PI / 4 - Math.sin(Math.PI / 4))));
        assertEquals(expected, ShapingGain.inBandSnrGainDb(ErrorFilter.FIRST_ORDER, 8000, 1000), 1e-12);
        assertEquals(7.0, expected, 0.05);
    }

    @Test
    void wholeBandLosesTheNoisePowerOfTheFilter() {
        // Over 0..π the mean of |NTF|² is Σ g_m² (Parseval): 2 for first order (−3.01 dB, Gerzon & Craven
        // 1989), 1 + 4 + 1 = 6 for second order (−7.78 dB).
        assertEquals(-10 * Math.log10(2), ShapingGain.inBandSnrGainDb(ErrorFilter.FIRST_ORDER, 8000, 4000),
                1e-12);
        assertEquals(-10 * Math.log10(6), ShapingGain.inBandSnrGainDb(ErrorFilter.SECOND_ORDER, 8000, 9000),
                1e-12);
        assertEquals(0.0, ShapingGain.inBandSnrGainDb(ErrorFilter.NONE, 8000, 1234), 1e-12);
    }

    @Test
    void userFirFilterGainAgreesWithNumericIntegration() {
        ErrorFilter fir = ErrorFilter.fir(1.2, -0.5, 0.1);
        double wc = 2 * Math.PI * 1500 / 11025;
        int steps = 20000;
        double integral = 0;
        for (int i = 0; i <= steps; i++) {
            double w = i == 0 || i == steps ? 1 : i % 2 == 1 ? 4 : 2;
            double g = fir.noiseGain(wc * i / steps);
            integral += w * g * g;
        }
        integral *= wc / steps / 3;
        assertEquals(10 * Math.log10(wc / integral), ShapingGain.inBandSnrGainDb(fir, 11025, 1500), 1e-9);
    }

    @Test
    void measuredGainAgreesWithTheAnalyticOne() {
        // TPDF makes the quantizer error white, the assumption of the analytic form (Lipshitz, Wannamaker,
        // Vanderkooy 1992).
        ShapingGain.Measured m = ShapingGain.measure(TestSignals.sine(0.7, 310, 0, 16000, 1 << 16),
                LevelTable.ideal(8, 1.0), Dither.TPDF, ErrorFilter.FIRST_ORDER, 4, 2000);
        assertTrue(m.gainDb() > 0, "first-order shaping must win below rate/8: " + m.gainDb());
        assertEquals(ShapingGain.inBandSnrGainDb(ErrorFilter.FIRST_ORDER, 16000, 2000), m.gainDb(), 1.0);
        assertEquals(m.shapedInBandSnrDb() - m.flatInBandSnrDb(), m.gainDb(), 1e-12);
    }

    @Test
    void aWeightedGainOfNoShapingIsZero() {
        assertEquals(0.0, ShapingGain.aWeightedSnrGainDb(ErrorFilter.NONE, 16000), 1e-12);
        // First-order shaping at 8 kHz moves noise up to 2..4 kHz, where A(f) is highest: it loses.
        assertTrue(ShapingGain.aWeightedSnrGainDb(ErrorFilter.FIRST_ORDER, 8000) < 0);
    }
}
