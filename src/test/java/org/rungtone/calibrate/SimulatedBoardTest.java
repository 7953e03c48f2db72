package org.rungtone.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import org.rungtone.ladder.Ladder;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.Spread;

/** The stand-in board: reproducible draws within the tolerance, meter noise and rounding. */
class SimulatedBoardTest {
    /** A simulated board around a given network (package access for tests). */
    static SimulatedBoard wrap(Ladder ladder) {
        return SimulatedBoard.of(ladder);
    }

    @Test
    void drawsWithinToleranceReproducibly() {
        LadderSpec spec = LadderSpec.builder().bits(6).tolerance(0.05).build();
        SimulatedBoard a = SimulatedBoard.draw(spec, Spread.uniform(), 7);
        SimulatedBoard b = SimulatedBoard.draw(spec, Spread.uniform(), 7);
        assertEquals(a.levels(), b.levels());
        double[] nominal = spec.ohms();
        double[] drawn = a.ladder().ohms();
        for (int i = 0; i < nominal.length; i++) {
            assertEquals(1, drawn[i] / nominal[i], 0.05 + 1e-12);
        }
    }
}
