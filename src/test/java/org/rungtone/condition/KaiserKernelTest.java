package org.rungtone.condition;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The one Kaiser design: β and length from Kaiser's formulas (J. F. Kaiser, "Nonrecursive Digital Filter
 * Design Using the I0-sinh Window Function", Proc. IEEE ISCAS 1974), and a kernel that meets its attenuation
 * to within the accuracy of his empirical fit.
 */
class KaiserKernelTest {
    @ParameterizedTest
    @CsvSource({"100, 10.06126", "62, 5.87366", "40, 3.39532", "21, 0", "20, 0"})
    void betaFollowsKaisersFormula(double attenuationDb, double beta) {
        // 0.1102·(A − 8.7) above 50 dB, 0.5842·(A − 21)^0.4 + 0.07886·(A − 21) from 21 to 50 dB, 0 below
        assertEquals(beta, KaiserKernel.beta(attenuationDb), 1e-5);
    }

    @Test
    void lengthFollowsKaisersFormula() {
        // 44.1 kHz → 16 kHz at 62 dB, pass 7.2 kHz, stop 8 kHz: N = 54.05 / (14.36·800/44100) = 207.5,
        // so 208 taps, half-width 104 (the KaiserResampler's single-stage figure)
        assertEquals(104, KaiserKernel.halfWidth(44_100, 7_200, 8_000, 62));
        assertEquals(104, KaiserKernel.lowPass(44_100, 7_200, 8_000, 62).halfWidth());
        // N = 32.05 / 14.36 = 2.2 would give a half-width of 1: the window keeps at least four samples
        assertEquals(2, KaiserKernel.halfWidth(1_000, 0, 1_000, 40));
    }

    @Test
    void cutoffSitsMidwayBetweenTheEdges() {
        assertEquals(7_600.0 / 44_100, KaiserKernel.lowPass(44_100, 7_200, 8_000, 62).cutoff(), 1e-15);
    }

    @Test
    void isZeroOutsideTheWindowAndSymmetric() {
        KaiserKernel h = KaiserKernel.lowPass(64_000, 20_000, 24_100, 100);
        int half = h.halfWidth();
        assertEquals(0, h.at(half), 0);
        assertEquals(0, h.at(-half - 0.25), 0);
        for (double t : new double[] {0.3, 1.7, 12.5}) {
            assertEquals(h.at(t), h.at(-t), 1e-18);
        }
    }

    @ParameterizedTest
    @CsvSource({"64000, 20000, 24100, 100", "128000, 19999.35, 24100.65, 100", "44100, 7200, 8000, 62",
        "32000, 12000, 12320, 40", "1000, 200, 230, 50"})
    void meetsItsAttenuationAndPassesTheBand(double rateHz, double passHz, double stopHz, double attenuationDb) {
        KaiserKernel h = KaiserKernel.lowPass(rateHz, passHz, stopHz, attenuationDb);
        double ripple = Math.pow(10, -attenuationDb / 20);
        double worstPass = 0;
        double worstStop = 0;
        for (double f = 0; f <= rateHz / 2; f += rateHz / 4000) {
            double gain = gain(h, f / rateHz);
            if (f <= passHz) {
                worstPass = Math.max(worstPass, Math.abs(gain - 1));
            } else if (f >= stopHz) {
                worstStop = Math.max(worstStop, gain);
            }
        }
        // Kaiser's window has equal pass and stop ripple δ = 10^(−A/20); his fit holds to about 1 dB for
        // these transitions (wider ones, with short windows, fall a few dB short)
        assertTrue(worstStop < ripple * Math.pow(10, 1.0 / 20), "stopband " + 20 * Math.log10(worstStop) + " dB");
        assertTrue(worstPass < ripple * Math.pow(10, 1.0 / 20), "passband ripple " + worstPass);
    }

    /** |H(f)| of the kernel sampled at whole input samples, f in cycles per sample. */
    private static double gain(KaiserKernel h, double f) {
        double re = 0;
        double im = 0;
        for (int t = -h.halfWidth(); t <= h.halfWidth(); t++) {
            re += h.at(t) * Math.cos(2 * Math.PI * f * t);
            im -= h.at(t) * Math.sin(2 * Math.PI * f * t);
        }
        return Math.hypot(re, im);
    }
}
