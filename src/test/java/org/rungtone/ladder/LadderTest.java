package org.rungtone.ladder;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class LadderTest {
    private static LadderSpec idealR2r(int bits, double r) {
        return LadderSpec.builder().topology(Topology.R2R).bits(bits).baseROhms(r).pinROhms(0).build();
    }

    @ParameterizedTest
    @ValueSource(ints = {1, 2, 3, 6, 10, 12})
    void idealR2rGivesVrefTimesCodeOverTwoToTheN(int bits) {
        LevelTable t = idealR2r(bits, 10e3).levels();
        int n = 1 << bits;
        for (int k = 0; k < n; k++) {
            // Horowitz & Hill, The Art of Electronics 3rd ed.: ideal R-2R output = Vref·k/2^N.
            assertEquals(5.0 * k / n, t.volts(k), 1e-12, "code " + k);
        }
    }

    @Test
    void idealR2rOutputResistanceIsRForEveryCode() {
        Ladder ladder = Ladder.nominal(idealR2r(6, 4.7e3));
        for (int k = 0; k < 64; k++) {
            // Horowitz & Hill: the Thévenin resistance at the output of an R-2R ladder is R for every code.
            assertEquals(4.7e3, ladder.outputOhms(k), 1e-8, "code " + k);
        }
    }

    @Test
    void r2rOfTheLargestAllowedPartsSolvesByNodalAnalysis() {
        // 500 GOhm rungs, 1 TOhm legs: pivots near 1e-12 S, below Commons Math's default absolute threshold
        // of 1e-11, which called such a network singular. Output resistance R for every code (Horowitz & Hill).
        Ladder ladder = Ladder.nominal(idealR2r(6, 500e9));
        for (int k = 0; k < 64; k++) {
            assertEquals(500e9, ladder.outputOhms(k), 500e9 * 1e-9, "code " + k);
            assertEquals(5.0 * k / 64, ladder.nodeVolts(k)[5], 1e-9, "code " + k);
        }
    }

    @Test
    void r2rWithAHeavyLoadStaysSolvable() {
        // Conductances from 10 S (a 0.1 ohm load) to 1 pS (1 TOhm legs): the widest mix the limits allow.
        LadderSpec spec = LadderSpec.builder().topology(Topology.R2R).bits(4).baseROhms(500e9).pinROhms(0)
                .loadOhms(0.1).build();
        Ladder ladder = Ladder.nominal(spec);
        // Millman at the output: the ladder's Thevenin source (R = 500 GOhm, Vref·k/16) into 0.1 ohm.
        assertEquals(0.1 * 500e9 / (0.1 + 500e9), ladder.outputOhms(15), 1e-12);
        assertEquals(5.0 * 15 / 16 * 0.1 / (0.1 + 500e9), ladder.nodeVolts(15)[3], 1e-20);
    }

    @Test
    void summingNodeFollowsMillmanWithPinResistancesAndLoad() {
        double[] r = {100e3, 47e3, 24e3, 12e3};
        LadderSpec spec = LadderSpec.builder().topology(Topology.CUSTOM).resistors(r).pinROhmsHigh(40)
                .pinROhmsLow(18).loadOhms(33e3).logicHighVolts(3.3).build();
        Ladder ladder = Ladder.nominal(spec);
        for (int k = 0; k < 16; k++) {
            // Millman's theorem (Hayt & Kemmerly, Engineering Circuit Analysis): V = Σ(Vi/Ri) / Σ(1/Ri),
            // the load being a source of 0 V.
            double num = 0;
            double den = 1 / 33e3;
            for (int i = 0; i < 4; i++) {
                boolean high = ((k >> i) & 1) == 1;
                double ri = r[i] + (high ? 40 : 18);
                num += (high ? 3.3 : 0) / ri;
                den += 1 / ri;
            }
            assertEquals(num / den, spec.levels().volts(k), 1e-12, "code " + k);
            assertEquals(num / den, ladder.nodeVolts(k)[0], 1e-12, "nodal, code " + k);
        }
    }

    @Test
    void benchWeightedLadderGivesItsKnownSteps() {
        // Bench fact (common practice, no source): 8.2k, 15k, 33k, 68k (MSB first) from 5 V logic into a
        // unity buffer give single-bit steps of about 2.6, 1.4, 0.6 and 0.3 V and span 0..5 V.
        LadderSpec spec = LadderSpec.builder().bits(4).resistors(68e3, 33e3, 15e3, 8.2e3).build();
        LevelTable t = spec.levels();
        assertEquals(0.3, t.volts(1), 0.1);
        assertEquals(0.6, t.volts(2), 0.1);
        assertEquals(1.4, t.volts(4), 0.1);
        assertEquals(2.6, t.volts(8), 0.1);
        assertEquals(0.0, t.volts(0), 0.1);
        assertEquals(5.0, t.volts(15), 0.1);
    }

    @ParameterizedTest
    @ValueSource(strings = {"weighted", "r2r"})
    void fastSolutionAgreesWithNodalAnalysis(String topology) {
        SplittableRandom rnd = new SplittableRandom(11);
        for (double[] pins : List.of(new double[] {25, 20}, new double[] {30, 30}, new double[] {0, 0})) {
            LadderSpec spec = LadderSpec.builder().topology(Topology.parse(topology)).bits(7)
                    .pinROhmsHigh(pins[0]).pinROhmsLow(pins[1]).loadOhms(22e3).logicLowVolts(0.1).build();
            double[] ohms = spec.ohms();
            for (int i = 0; i < ohms.length; i++) {
                ohms[i] *= 1 + 0.2 * (rnd.nextDouble() - 0.5);
            }
            Ladder ladder = Ladder.of(spec, ohms);
            double[] fast = ladder.ladderVolts();
            for (int k = 0; k < fast.length; k++) {
                double[] nodes = ladder.nodeVolts(k);
                assertEquals(nodes[nodes.length - 1], fast[k], 1e-12, "code " + k + " pins " + pins[0]);
            }
        }
    }

    @Test
    void pinCurrentsOfAWeightedLadderPeakAtTheFarthestNodeVoltage() {
        LadderSpec spec = LadderSpec.builder().bits(4).resistors(68e3, 33e3, 15e3, 8.2e3).pinROhms(0).build();
        List<PinCurrent> pins = Ladder.nominal(spec).pinCurrents();
        // Ohm's law: the MSB pin sources most when it alone is high, (5 V − node)/8.2k.
        double node = spec.levels().volts(8);
        assertEquals((5 - node) / 8.2e3, pins.get(3).sourceAmps(), 1e-15);
        assertEquals(8, pins.get(3).sourceCode());
        // and sinks most when every other pin is high: node/8.2k.
        assertEquals(spec.levels().volts(7) / 8.2e3, pins.get(3).sinkAmps(), 1e-15);
        assertEquals(7, pins.get(3).sinkCode());
    }

    @Test
    void r2rPinCurrentsMatchNodalAnalysis() {
        LadderSpec spec = LadderSpec.builder().topology(Topology.R2R).bits(5).baseROhms(1e3).build();
        Ladder ladder = Ladder.nominal(spec);
        PinCurrent msb = ladder.pinCurrents().get(4);
        double best = 0;
        for (int k = 16; k < 32; k++) {
            best = Math.max(best, ladder.pinAmps(k)[4]);
        }
        assertEquals(best, msb.sourceAmps(), 0);
        assertTrue(msb.sourceAmps() > 0.5 * 5 / 4e3 && msb.sourceAmps() < 5 / 2e3, "" + msb.sourceAmps());
    }
}
