package org.rungtone.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;

import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import org.rungtone.ladder.LadderSpec;

/** A simulated board read at the plan's codes: one seed fixes the board and the meter noise. */
class BoardSimulationTest {
    private static final LadderSpec LADDER = LadderSpec.builder().bits(8).tolerance(0.05).build();

    private static BoardSimulation.Result run(long seed, int repeats) {
        return BoardSimulation.run(new BoardSimulation.Request(LADDER, new CodeChoice(false, OptionalInt.empty()),
                new SimulatedBoard.Meter(2e-4, 1e-3, repeats), seed));
    }

    @Test
    void oneSeedGivesTheSameBoardAndReadings() {
        BoardSimulation.Result a = run(3, 1);
        BoardSimulation.Result b = run(3, 1);
        assertEquals(a.board().levels(), b.board().levels());
        assertEquals(a.readingsCsv(), b.readingsCsv());
        assertNotEquals(a.readingsCsv(), run(4, 1).readingsCsv());
    }

    @Test
    void readsEveryPlannedCodeAsOftenAsTheMeterRepeats() {
        BoardSimulation.Result r = run(3, 2);
        Measurements m = MeasurementCsv.parse(r.readingsCsv(), "readings.csv", 8);
        assertEquals(r.plan().codes().size() * 2, m.readings().size());
        assertEquals(0, m.unmeasured().size());
        assertEquals(1e-3, m.resolutionVolts(), 1e-12, "the readings show the meter's 1 mV step");
    }
}
