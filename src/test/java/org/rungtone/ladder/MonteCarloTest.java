package org.rungtone.ladder;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.SplittableRandom;
import java.util.concurrent.ForkJoinPool;
import org.junit.jupiter.api.Test;
import org.rungtone.analysis.ErrorMetrics;

class MonteCarloTest {
    private static final LadderSpec R2R8 = LadderSpec.builder().topology(Topology.R2R).bits(8).build();

    @Test
    void sameSeedGivesIdenticalResultsWhateverTheThreadCount() {
        MonteCarlo mc = new MonteCarlo(300, 42, Spread.uniform());
        MonteCarloResult a = mc.run(R2R8);
        ForkJoinPool one = new ForkJoinPool(1);
        ForkJoinPool two = new ForkJoinPool(2);
        try {
            MonteCarloResult b = mc.run(Ladder.nominal(R2R8), one, n -> { });
            MonteCarloResult c = mc.run(Ladder.nominal(R2R8), two, n -> { });
            for (MonteCarloResult other : new MonteCarloResult[] {b, c}) {
                assertArrayEquals(a.worstDnlLsb(), other.worstDnlLsb(), 0);
                assertArrayEquals(a.worstInlLsb(), other.worstInlLsb(), 0);
                assertArrayEquals(a.sinadDb(), other.sinadDb(), 0);
                assertArrayEquals(a.monotonic(), other.monotonic());
            }
        } finally {
            one.shutdown();
            two.shutdown();
        }
        MonteCarloResult otherSeed = new MonteCarlo(300, 43, Spread.uniform()).run(R2R8);
        assertFalse(Arrays.equals(a.worstInlLsb(), otherSeed.worstInlLsb()));
    }

    @Test
    void zeroToleranceMakesEveryBoardTheNominalOne() {
        LadderSpec spec = R2R8.toBuilder().tolerance(0).build();
        Linearity nominal = Linearity.of(spec.levels(), spec.idealLevels());
        MonteCarloResult r = new MonteCarlo(100, 1, Spread.uniform()).run(spec);
        for (int b = 0; b < r.boards(); b++) {
            assertEquals(nominal.maxAbsDnlLsb(), r.worstDnlLsb()[b], 1e-12);
            assertEquals(nominal.maxAbsInlLsb(), r.worstInlLsb()[b], 1e-12);
            assertEquals(nominal.maxAbsInlBestFitLsb(), r.worstInlBestFitLsb()[b], 1e-12);
            assertEquals(r.nominalSinadDb(), r.sinadDb()[b], 0);
        }
        assertEquals(1.0, r.monotonicFraction());
        MonteCarloResult g = new MonteCarlo(20, 1, Spread.gaussian(0)).run(spec);
        assertEquals(r.nominalSinadDb(), g.sinadStats().min(), 0);
        assertEquals(r.nominalSinadDb(), g.sinadStats().max(), 0);
    }

    @Test
    void fivePercentPartsAreFarLessOftenMonotonicThanTenthPercentParts() {
        MonteCarlo mc = new MonteCarlo(400, 7, Spread.uniform());
        double loose = mc.run(R2R8.toBuilder().tolerance(0.05).build()).monotonicFraction();
        double tight = mc.run(R2R8.toBuilder().tolerance(0.001).build()).monotonicFraction();
        // IEEE Std 1658-2011 monotonicity; 0.1 % parts put the 8-bit mid-scale step well inside ±1 LSB.
        assertTrue(tight > 0.97, "0.1%: " + tight);
        assertTrue(loose < 0.5 * tight, "5%: " + loose + ", 0.1%: " + tight);
    }

    @Test
    void idealBoardReachesTheQuantizationLimit() {
        LadderSpec ideal = LadderSpec.builder().topology(Topology.R2R).bits(10).pinROhms(0).tolerance(0).build();
        MonteCarloResult r = new MonteCarlo(4, 3, Spread.uniform()).run(ideal);
        // Bennett 1948 / ADI MT-001: SNR = 6.02·N + 1.76 dB for an ideal N-bit quantizer and a full-scale sine.
        assertEquals(6.02 * 10 + 1.76, r.nominalSinadDb(), 0.3);
        assertEquals(10, r.enobStats().mean(), 0.05);
    }

    @Test
    void probeSinadEqualsTheAlignedErrorSnrOfTheWholeSignal() {
        LadderSpec spec = LadderSpec.builder().bits(9).pinROhmsHigh(40).loadOhms(50e3).build();
        double[] ohms = spec.ohms();
        SplittableRandom rnd = new SplittableRandom(9);
        for (int i = 0; i < ohms.length; i++) {
            ohms[i] *= 1 + 0.02 * (2 * rnd.nextDouble() - 1);
        }
        double[] levels = Ladder.of(spec, ohms).levels().levels();
        SineProbe probe = new SineProbe(9);
        double[] ref = probe.sine();
        int[] codes = probe.codes();
        double[] out = new double[ref.length];
        for (int n = 0; n < out.length; n++) {
            out[n] = levels[codes[n]];
        }
        assertEquals(ErrorMetrics.alignedSnrDb(ref, out), probe.sinadDb(levels), 1e-6);
    }

    @Test
    void spreadsDrawWithTheirStatedWidth() {
        SplittableRandom rnd = new SplittableRandom(1);
        double sumSq = 0;
        double maxAbs = 0;
        double sumSqG = 0;
        int n = 40000;
        for (int i = 0; i < n; i++) {
            double u = Spread.uniform().deviation(rnd, 0.05);
            sumSq += u * u;
            maxAbs = Math.max(maxAbs, Math.abs(u));
            double g = Spread.gaussian(0.01).deviation(rnd, 0.05);
            sumSqG += g * g;
        }
        // Uniform on [-t, t] has standard deviation t/sqrt(3).
        assertEquals(0.05 / Math.sqrt(3), Math.sqrt(sumSq / n), 0.0005);
        assertTrue(maxAbs <= 0.05);
        assertEquals(0.01, Math.sqrt(sumSqG / n), 0.0002);
    }

    @Test
    void statsUseNearestRankPercentiles() {
        double[] v = new double[100];
        for (int i = 0; i < 100; i++) {
            v[i] = 100 - i;
        }
        Stats s = Stats.of(v);
        assertEquals(50, s.p50());
        assertEquals(90, s.p90());
        assertEquals(99, s.p99());
        assertEquals(1, s.min());
        assertEquals(50.5, s.mean(), 1e-12);
        assertEquals(Math.sqrt(100 * 101 / 12.0), s.stdDev(), 1e-9);
    }
}
