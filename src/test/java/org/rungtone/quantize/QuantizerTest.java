package org.rungtone.quantize;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.rungtone.ladder.LevelTable;
import org.rungtone.source.Signal;

class QuantizerTest {
    static final int N = 1 << 16;
    /** A prime number of cycles in N samples: coherent, and every phase visits different codes. */
    static final int CYCLES = 1031;

    static Signal fullScaleSine() {
        double[] x = new double[N];
        for (int i = 0; i < N; i++) {
            x[i] = Math.sin(2 * Math.PI * CYCLES * i / N);
        }
        return Signal.wrap(x, 48_000);
    }

    /** Error power in LSB² of the output against the exact target (no alignment: the mapping is known). */
    static double errorPowerLsb2(Quantizer q, Signal s) {
        Codes c = q.apply(s).codes();
        double lsb = q.lsbVolts();
        double acc = 0;
        for (int i = 0; i < s.length(); i++) {
            double e = (q.table().volts(c.code(i)) - q.targetVolts(s.sample(i))) / lsb;
            acc += e * e;
        }
        return acc / s.length();
    }

    static IntStream bitDepths() {
        return IntStream.rangeClosed(6, 16);
    }

    @ParameterizedTest
    @MethodSource("bitDepths")
    void idealQuantizerMeetsTheBennettFormula(int bits) {
        LevelTable t = LevelTable.ideal(bits, 5.0);
        Quantizer q = new Quantizer(t, Dither.NONE, 1);
        Signal s = fullScaleSine();
        double noise = errorPowerLsb2(q, s);
        // Signal: the sine spans the table's lowest to highest level, (2^N - 1) LSB peak to peak.
        double amplitude = ((1 << bits) - 1) / 2.0;
        double snr = 10 * Math.log10(amplitude * amplitude / 2 / noise);
        // W. R. Bennett, "Spectra of Quantized Signals", BSTJ 27, 1948: SNR = 6.02 N + 1.76 dB for a sine
        // of 2^N LSB peak to peak; ours is (2^N - 1) LSB, which lowers it by 20 log10(1 - 2^-N).
        double expected = 6.02 * bits + 1.76 + 20 * Math.log10(1 - Math.pow(2, -bits));
        assertEquals(expected, snr, 0.2, "bits " + bits);
        assertEquals(6.02 * bits + 1.76, snr, 0.2, "textbook figure, bits " + bits);
    }

    @Test
    void ditherRaisesNoiseByTheTheoreticalAmounts() {
        // Lipshitz, Wannamaker, Vanderkooy, "Quantization and Dither: A Theoretical Survey", JAES 40(5),
        // 1992: RPDF of 1 LSB p-p adds LSB²/12 (+3.01 dB), TPDF of 2 LSB p-p adds LSB²/6 (+4.77 dB).
        LevelTable t = LevelTable.ideal(8, 5.0);
        Signal s = fullScaleSine();
        double plain = errorPowerLsb2(new Quantizer(t, Dither.NONE, 7), s);
        double rpdf = errorPowerLsb2(new Quantizer(t, Dither.RPDF, 7), s);
        double tpdf = errorPowerLsb2(new Quantizer(t, Dither.TPDF, 7), s);
        assertEquals(1.0 / 12, plain, 0.002);
        assertEquals(3.01, 10 * Math.log10(rpdf / plain), 0.3);
        assertEquals(4.77, 10 * Math.log10(tpdf / plain), 0.3);
    }

    @Test
    void sameSeedSameCodesOtherSeedOtherCodes() {
        LevelTable t = LevelTable.ideal(6, 5.0);
        Signal s = fullScaleSine();
        int[] a = new Quantizer(t, Dither.TPDF, 42).apply(s).codes().codes();
        int[] b = new Quantizer(t, Dither.TPDF, 42).apply(s).codes().codes();
        int[] c = new Quantizer(t, Dither.TPDF, 43).apply(s).codes().codes();
        assertArrayEquals(a, b);
        assertTrue(!java.util.Arrays.equals(a, c));
    }

    @Test
    void picksNearestLevelOfANonMonotonicTable() {
        // codes 0..3 at 0, 2, 1, 3 V: the sorted order is code 0, 2, 1, 3
        LevelTable t = LevelTable.of(2, new double[] {0, 2, 1, 3}, "test");
        Quantizer q = new Quantizer(t, Dither.NONE, 1);
        assertEquals(0, q.nearestCode(0.4));
        assertEquals(2, q.nearestCode(0.9));
        assertEquals(2, q.nearestCode(1.4));
        assertEquals(1, q.nearestCode(1.6));
        assertEquals(3, q.nearestCode(9));
        assertEquals(0, q.nearestCode(-9));
    }

    @Test
    void countsClippedSamplesAndKeepsCodesInRange() {
        LevelTable t = LevelTable.ideal(4, 5.0);
        Signal s = Signal.of(new double[] {0, 1.5, -2, 0.99, 1.0, -1.0001}, 8000);
        Quantizer.Quantized q = new Quantizer(t, Dither.TPDF, 3).apply(s);
        assertEquals(3, q.clippedSamples());
        for (int c : q.codes().codes()) {
            assertTrue(c >= 0 && c <= 15);
        }
        assertEquals(15, q.codes().code(1));
        assertEquals(0, q.codes().code(2));
    }

    @Test
    void evenlySpacedTablesPickTheSameLevelsAsAFullSearch() {
        LevelTable t = LevelTable.ideal(5, 3.3);
        Quantizer q = new Quantizer(t, Dither.NONE, 1);
        java.util.SplittableRandom r = new java.util.SplittableRandom(5);
        double step = 3.3 / 32;
        for (int i = 0; i < 20_000; i++) {
            // random volts, and every exact midpoint between two levels (ties go to the lower level)
            double v = i < 31 ? (i + 0.5) * step : r.nextDouble(-1, 4.3);
            int best = 0;
            for (int c = 1; c < 32; c++) {
                if (Math.abs(t.volts(c) - v) < Math.abs(t.volts(best) - v)) {
                    best = c;
                }
            }
            assertEquals(best, q.nearestCode(v), "volts " + v);
        }
    }

    @Test
    void ditheredCodesDoNotDependOnTheNumberOfThreads() throws Exception {
        // Blocks draw from their own random streams, so one thread and many give the same codes.
        double[] x = new double[5 * Quantizer.BLOCK + 123];
        for (int i = 0; i < x.length; i++) {
            x[i] = 0.9 * Math.sin(0.001 * i);
        }
        Quantizer q = new Quantizer(LevelTable.ideal(8, 3.3), Dither.TPDF, 42);
        Signal s = Signal.wrap(x, 16000);
        int[] one = new java.util.concurrent.ForkJoinPool(1).submit(() -> q.apply(s).codes().codes()).get();
        int[] four = new java.util.concurrent.ForkJoinPool(4).submit(() -> q.apply(s).codes().codes()).get();
        assertArrayEquals(one, four);
        assertArrayEquals(one, q.apply(s).codes().codes());
        // and a different seed gives different dither
        int[] other = new Quantizer(LevelTable.ideal(8, 3.3), Dither.TPDF, 43).apply(s).codes().codes();
        assertTrue(!java.util.Arrays.equals(one, other));
    }
}
