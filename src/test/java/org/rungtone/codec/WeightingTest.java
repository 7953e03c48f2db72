package org.rungtone.codec;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class WeightingTest {
    private static double db(Weighting w, double hz, double rate) {
        return 20 * Math.log10(w.gain(hz / rate));
    }

    @Test
    void followsTheAWeightingWellBelowHalfTheRate() {
        // IEC 61672-1:2013, at the exact base-ten frequencies: 125 Hz -16.1, 250 Hz -8.6, 500 Hz -3.2,
        // 2 kHz +1.2, 4 kHz +1.0 dB; at 48 kHz the bilinear warp is small up to a few kilohertz
        Weighting a = Weighting.aWeighted(48_000, 24_000);
        assertEquals(0, db(a, 1000, 48_000), 1e-9);
        assertEquals(-16.1, db(a, 125.89, 48_000), 0.15);
        assertEquals(-8.6, db(a, 251.19, 48_000), 0.15);
        assertEquals(-3.2, db(a, 501.19, 48_000), 0.15);
        assertEquals(1.2, db(a, 1995.3, 48_000), 0.15);
        assertEquals(1.0, db(a, 3981.1, 48_000), 0.3);
    }

    @Test
    void addsALowPassWhenTheInBandFiguresStopBelowHalfTheRate() {
        Weighting a = Weighting.aWeighted(16_000, 8_000);
        Weighting cut = Weighting.aWeighted(16_000, 3_000);
        // second-order Butterworth: -3.01 dB at its cutoff (prewarped), relative to the plain A weighting
        assertEquals(-3.01, db(cut, 3000, 16_000) - db(a, 3000, 16_000), 0.05);
        assertEquals(0, db(cut, 1000, 16_000), 1e-9);
    }

    @Test
    void filtersAsItsGainSays() {
        // a 1 kHz sine through the filter settles to the gain at 1 kHz (0 dB): mean square 1/2
        Weighting a = Weighting.aWeighted(16_000, 8_000);
        double[] state = new double[a.stateSize()];
        double sum = 0;
        for (int i = 0; i < 16_000; i++) {
            double x = Math.sin(2 * Math.PI * 1000 * i / 16_000.0);
            double y = a.gain() * x + a.bias(state, 0);
            a.update(x, state, 0);
            if (i >= 8000) {
                sum += y * y;
            }
        }
        assertEquals(0.5, sum / 8000, 1e-3);
        assertEquals(0, Weighting.flat().stateSize());
    }
}
