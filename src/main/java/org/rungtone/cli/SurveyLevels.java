package org.rungtone.cli;

import java.util.function.IntFunction;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;

/**
 * The level table the survey uses at each bit depth, from the ladder and unit options: the one place where a
 * modelled or measured ladder plugs into the survey.
 */
final class SurveyLevels {
    /** Reference voltage of the ideal ladder the survey models when no ladder is given. */
    static final double IDEAL_FULL_SCALE_VOLTS = 5.0;

    private SurveyLevels() {
    }

    /**
     * The level table for each bit depth: a unit profile's measured table (at its own depth only), a modelled
     * ladder's at any depth (only at its own when it lists its resistors), else the ideal table with a
     * {@value #IDEAL_FULL_SCALE_VOLTS} V reference.
     *
     * @throws InputError when the profile or ladder cannot be read, or (from the function) when a depth is one
     *     the board cannot have
     */
    static IntFunction<LevelTable> of(UnitOptions unit, LadderOptions ladder) {
        if (unit.given()) {
            LevelTable measured = unit.resolve(0, ladder, false).levels().orElseThrow();
            return b -> {
                if (b != measured.bits()) {
                    throw new InputError("the unit profile has " + measured.bits() + " bits; survey it with"
                            + " --bits-list " + measured.bits());
                }
                return measured;
            };
        }
        if (!ladder.given()) {
            return b -> LevelTable.ideal(b, IDEAL_FULL_SCALE_VOLTS);
        }
        LadderSpec base = ladder.toSpec(0);
        return b -> {
            if (b != base.bits() && !base.resistors().isEmpty()) {
                throw new InputError("the ladder lists " + base.resistors().size() + " resistors, so it can only"
                        + " be surveyed at " + base.bits() + " bits; give base_r instead of resistors to survey"
                        + " other depths");
            }
            LadderSpec s = b == base.bits() ? base : base.toBuilder().bits(b).build();
            // one description for every depth, so the report names the ladder once
            return s.levels().withOrigin("modelled " + s.describe().replaceFirst(" \\d+-bit", ""));
        };
    }
}
