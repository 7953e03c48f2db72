package org.rungtone.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import org.rungtone.ladder.LevelTable;

/** The steps of a recording sweep: two patterns around the planned codes and their returns to code 0. */
class RecordingSweepTest {
    @Test
    void returnsToCodeZeroBeforeEverySixteenthPlannedCode() {
        RecordingSweep sweep = RecordingSweep.of(MeasurementPlan.everyCode(LevelTable.ideal(6, 5.0)), 0.030);
        int p = sweep.patternSteps();
        // 64 codes: returns before codes 16, 32 and 48
        assertEquals(3, sweep.returns());
        assertEquals(67, sweep.middleSteps());
        assertEquals(p + 67, sweep.endPatternStart());
        int[] steps = sweep.stepCodes();
        assertEquals(2 * p + 67, steps.length);
        int plan = 0;
        int returns = 0;
        for (int k = p; k < sweep.endPatternStart(); k++) {
            if (sweep.part(k) == RecordingSweep.Part.RETURN) {
                assertEquals(0, steps[k], "step " + k);
                assertEquals(16 * (returns + 1), plan, "a return comes before every 16th code");
                returns++;
            } else {
                assertEquals(RecordingSweep.Part.PLAN, sweep.part(k));
                assertEquals(plan, sweep.planIndex(k));
                assertEquals(k, sweep.planStep(plan));
                assertEquals(plan, steps[k]);
                plan++;
            }
        }
        assertEquals(64, plan);
        assertEquals(3, returns);
        assertEquals(RecordingSweep.Part.START, sweep.part(p - 1));
        assertEquals(RecordingSweep.Part.END, sweep.part(sweep.endPatternStart()));
        // the patterns' 62 steps of 20 ticks and the 67 middle steps of 30
        assertEquals((62 * 20 + 67 * 30) / 1000.0, sweep.durationSeconds(), 1e-12);
    }

    @Test
    void aShortPlanHasNoReturns() {
        RecordingSweep sweep = RecordingSweep.of(MeasurementPlan.everyCode(LevelTable.ideal(4, 5.0)), 0.040);
        assertEquals(0, sweep.returns());
        assertEquals(16, sweep.middleSteps());
    }
}
