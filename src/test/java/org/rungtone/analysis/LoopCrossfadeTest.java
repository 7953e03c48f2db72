package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.rungtone.source.Signal;

class LoopCrossfadeTest {
    /** A ramp: every sample tells where it came from. */
    private static double[] ramp(int n) {
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = i / 1000.0;
        }
        return x;
    }

    @Test
    void theLastSampleOfTheLoopIsTheOneBeforeItsStart() {
        double[] x = ramp(200);
        SeamlessLoop loop = new SeamlessLoop(40, 120, 10, -50, 8);
        double[] y = LoopCrossfade.bake(Signal.wrap(x, 8000), loop, 200).samples();
        // jumping from y[119] to y[40] continues as x[39] -> x[40] does
        assertEquals(x[39], y[119], 1e-15);
        // linear weights (i+1)/8: y[112 + i] = (1 − w)·x[112 + i] + w·x[32 + i]
        for (int i = 0; i < 8; i++) {
            double w = (i + 1) / 8.0;
            assertEquals((1 - w) * x[112 + i] + w * x[32 + i], y[112 + i], 1e-15);
        }
        assertEquals(x[111], y[111], 0, "nothing before the crossfade changes");
        assertEquals(x[40], y[40], 0, "the loop start is the sound's own");
    }

    @Test
    void leavingTheLoopIsAsSmoothAsRepeatingIt() {
        double[] x = ramp(200);
        SeamlessLoop loop = new SeamlessLoop(40, 120, 10, -50, 8);
        double[] y = LoopCrossfade.bake(Signal.wrap(x, 8000), loop, 200).samples();
        // after y[119] (= x[39]) a released loop plays y[120] = x[40], then fades back into the tail
        for (int i = 0; i < 8; i++) {
            double v = i / 8.0;
            assertEquals((1 - v) * x[40 + i] + v * x[120 + i], y[120 + i], 1e-15);
        }
        assertEquals(x[128], y[128], 0);
    }

    @Test
    void keepingOnlyAttackAndLoopCutsAtTheLoopEnd() {
        SeamlessLoop loop = new SeamlessLoop(40, 120, 10, -50, 8);
        Signal y = LoopCrossfade.bake(Signal.wrap(ramp(200), 8000), loop, 120);
        assertEquals(120, y.length());
        assertThrows(IllegalArgumentException.class, () -> LoopCrossfade.bake(Signal.wrap(ramp(200), 8000), loop,
                119));
    }

    @Test
    void seamLevelOfAStepIsTheWeightedStepOverTheSignal() {
        // the stretch before the end stands 0.1 above the stretch before the start: the residual is
        // (1 − wᵢ)·0.1 with wᵢ = (i+1)/C, whose mean square is 0.01·(C−1)(2C−1)/(6C²) (sum of squares 0..C−1)
        int c = 16;
        double[] x = new double[100];
        for (int i = 60 - c; i < 60; i++) {
            x[i] = 0.1;
        }
        double meanSquare = 0.01 * (c - 1) * (2 * c - 1) / (6.0 * c * c);
        double rms = 0.5;
        assertEquals(10 * Math.log10(meanSquare / (rms * rms)), LoopCrossfade.seamLevelDb(x, 30, 60, c, rms), 1e-12);
    }

    @Test
    void aSeamThatLeavesNothingReadsTheFloor() {
        double[] x = new double[100];
        assertEquals(LoopCrossfade.FLOOR_DB, LoopCrossfade.seamLevelDb(x, 30, 60, 16, 0.5));
    }

    @Test
    void aLoopNeedsRoomForItsCrossfadeBeforeItsStart() {
        assertThrows(IllegalArgumentException.class, () -> new SeamlessLoop(4, 120, 10, -50, 8));
        assertThrows(IllegalArgumentException.class, () -> new SeamlessLoop(40, 44, 2, -50, 8));
    }
}
