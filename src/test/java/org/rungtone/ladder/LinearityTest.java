package org.rungtone.ladder;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class LinearityTest {
    @Test
    void idealTableHasNoErrors() {
        LevelTable ideal = LevelTable.ideal(8, 5.0);
        Linearity lin = Linearity.of(ideal, ideal);
        assertEquals(5.0 / 256, lin.lsbVolts(), 1e-15);
        assertEquals(0, lin.maxAbsDnlLsb(), 1e-9);
        assertEquals(0, lin.maxAbsInlLsb(), 1e-9);
        assertEquals(0, lin.maxAbsInlBestFitLsb(), 1e-9);
        assertEquals(0, lin.offsetErrorLsb(), 0);
        assertEquals(0, lin.gainErrorLsb(), 1e-9);
        assertTrue(lin.isMonotonic());
    }

    @Test
    void handWorkedTableFollowsTheDefinitions() {
        // IEEE Std 1658-2011 definitions, worked by hand: LSB = (3 - 0)/3 = 1.
        LevelTable t = LevelTable.of(2, new double[] {0, 0.9, 2.2, 3.0}, "test");
        LevelTable ideal = LevelTable.of(2, new double[] {0.1, 1.1, 2.1, 3.1}, "ideal");
        Linearity lin = Linearity.of(t, ideal);
        assertArrayEquals(new double[] {0, -0.1, 0.3, -0.2}, lin.dnlLsb(), 1e-12);
        assertArrayEquals(new double[] {0, -0.1, 0.2, 0}, lin.inlLsb(), 1e-12);
        // Least squares through (0,0) (1,0.9) (2,2.2) (3,3.0): slope 5.15/5 = 1.03, intercept 1.525 - 1.03·1.5 = -0.02.
        assertEquals(1.03, lin.bestFitLsbVolts(), 1e-12);
        assertEquals(-0.02, lin.bestFitOffsetVolts(), 1e-12);
        assertEquals((0.9 - (-0.02 + 1.03)) / 1.03, lin.inlBestFitLsb(1), 1e-12);
        assertEquals(-0.1, lin.offsetErrorVolts(), 1e-12);
        assertEquals(-0.1, lin.offsetErrorLsb(), 1e-12);
        assertEquals(0, lin.gainErrorLsb(), 1e-12);
        assertEquals(2, lin.worstDnlCode());
        assertEquals(2, lin.worstInlCode());
        assertTrue(lin.isMonotonic());
    }

    @Test
    void msbResistorThreePercentHighIsNotMonotonicAtMidScale() {
        for (Topology topology : new Topology[] {Topology.WEIGHTED, Topology.R2R}) {
            LadderSpec spec = LadderSpec.builder().topology(topology).bits(8).pinROhms(0).build();
            double[] ohms = spec.ohms();
            ohms[7] *= 1.03;
            Linearity lin = Linearity.of(Ladder.of(spec, ohms).levels(), spec.idealLevels());
            // IEEE Std 1658-2011: the mid-scale step shrinks by more than one LSB, the transfer falls there.
            assertFalse(lin.isMonotonic(), topology.key());
            assertTrue(lin.dnlLsb(128) < -1, topology.key() + " DNL at 128: " + lin.dnlLsb(128));
            assertArrayEquals(new int[] {128}, lin.invertedSteps(), topology.key());
            assertEquals(128, lin.worstDnlCode(), topology.key());
        }
    }

    @Test
    void dnlAboveMinusOneEverywhereIffMonotonicOnRandomNetworks() {
        // IEEE Std 1658-2011: DNL > -1 LSB at every step <=> monotonic.
        SplittableRandom rnd = new SplittableRandom(5);
        int monotonic = 0;
        int notMonotonic = 0;
        for (int trial = 0; trial < 300; trial++) {
            Topology topology = trial % 2 == 0 ? Topology.WEIGHTED : Topology.R2R;
            int bits = 2 + rnd.nextInt(8);
            LadderSpec spec = LadderSpec.builder().topology(topology).bits(bits).build();
            double[] ohms = spec.ohms();
            double spread = rnd.nextDouble() * 0.1;
            for (int i = 0; i < ohms.length; i++) {
                ohms[i] *= 1 + spread * (2 * rnd.nextDouble() - 1);
            }
            Linearity lin = Linearity.of(Ladder.of(spec, ohms).levels(), spec.idealLevels());
            double[] dnl = lin.dnlLsb();
            boolean allAbove = true;
            for (int k = 1; k < dnl.length; k++) {
                allAbove &= dnl[k] > -1;
            }
            assertEquals(allAbove, lin.isMonotonic(), "trial " + trial);
            assertEquals(lin.isMonotonic(), lin.invertedSteps().length == 0, "trial " + trial);
            Linearity.Worst worst = new Linearity.Worst();
            worst.of(Ladder.of(spec, ohms).levels().levels());
            assertEquals(lin.isMonotonic(), worst.monotonic);
            assertEquals(lin.maxAbsDnlLsb(), worst.maxAbsDnl, 1e-9);
            assertEquals(lin.maxAbsInlLsb(), worst.maxAbsInl, 1e-9);
            assertEquals(lin.maxAbsInlBestFitLsb(), worst.maxAbsInlBestFit, 1e-9);
            if (lin.isMonotonic()) {
                monotonic++;
            } else {
                notMonotonic++;
            }
        }
        assertTrue(monotonic > 30 && notMonotonic > 30, monotonic + " / " + notMonotonic);
    }

    @Test
    void clippedCodesBreakMonotonicity() {
        LadderSpec spec = LadderSpec.builder().topology(Topology.R2R).bits(4).pinROhms(0).outMaxVolts(4.0).build();
        Linearity lin = Linearity.of(spec.levels(), spec.idealLevels());
        assertFalse(lin.isMonotonic());
        assertEquals(0, lin.invertedSteps().length);
        assertEquals(-1, lin.dnlLsb(15), 1e-12);
    }
}
