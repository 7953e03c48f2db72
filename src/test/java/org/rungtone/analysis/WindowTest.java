package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class WindowTest {
    @Test
    void blackmanHarrisSidelobesLieBelowSixteenBitNoise() {
        // Sidelobes of the 7-term Blackman-Harris window are below -180 dB (Solomon, IEEE Trans. Instrum.
        // Meas. 43(2), 1994); checked here on an 8x zero-padded transform: everything beyond the +-7 bin
        // main lobe must stay below -170 dB relative to the peak.
        int n = 256;
        int m = 8 * n;
        double[] w = Window.BLACKMAN_HARRIS_7.values(n);
        double peak = Math.pow(sum(w), 2);
        double worst = 0;
        for (int k = 7 * 8 + 1; k <= m / 2; k++) {
            double re = 0;
            double im = 0;
            for (int i = 0; i < n; i++) {
                re += w[i] * Math.cos(2 * Math.PI * k * i / m);
                im -= w[i] * Math.sin(2 * Math.PI * k * i / m);
            }
            worst = Math.max(worst, re * re + im * im);
        }
        assertTrue(10 * Math.log10(worst / peak) < -170, "sidelobe " + 10 * Math.log10(worst / peak));
    }

    @Test
    void equivalentNoiseBandwidthsMatchTheirClosedForms() {
        // Hann ENBW = 1.5 bins exactly (Harris, Proc. IEEE 66(1), 1978); rectangular 1 bin.
        assertEquals(1.5, Window.HANN.enbwBins(1024), 1e-12);
        assertEquals(1.0, Window.RECTANGULAR.enbwBins(1024), 1e-12);
        // Periodic cosine-sum window: ENBW = (a0² + Σ_{k≥1} a_k²/2) / a0² bins; about 2.63 for the
        // 7-term Blackman-Harris (from memory).
        double[] a = {0.27105140069342, 0.43329793923448, 0.21812299954311, 0.06592544638803,
            0.01081174209837, 0.00077658482522, 0.00001388721735};
        double num = a[0] * a[0];
        for (int k = 1; k < a.length; k++) {
            num += a[k] * a[k] / 2;
        }
        double enbw = Window.BLACKMAN_HARRIS_7.enbwBins(4096);
        assertEquals(num / (a[0] * a[0]), enbw, 1e-12);
        assertEquals(2.63, enbw, 0.01);
    }

    private static double sum(double[] w) {
        double s = 0;
        for (double v : w) {
            s += v;
        }
        return s;
    }
}
