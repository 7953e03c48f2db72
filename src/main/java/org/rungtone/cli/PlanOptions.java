package org.rungtone.cli;

import org.rungtone.calibrate.MeasurementPlan;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LadderSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/** The ladder and the choice of codes to measure, shared by 'calibrate plan' and 'calibrate simulate'. */
public final class PlanOptions {
    @Option(names = "--bits", paramLabel = "N", description = "Bit depth 1..16 (default: the ladder's, else 8).")
    int bits;

    @Mixin
    LadderOptions ladder;

    @Option(names = "--verify", paramLabel = "K",
            description = "Check codes on top of the basis (default: every code up to 6 bits, else 2·N).")
    Integer verify;

    @Option(names = "--every-code", description = "Measure every code; the readings then are the profile.")
    boolean everyCode;

    /** Checks that the code choices do not contradict each other. */
    void check() {
        if (everyCode && verify != null) {
            throw new InputError("--every-code and --verify exclude each other; give one");
        }
    }

    /** The described ladder. */
    LadderSpec spec() {
        return ladder.spec(bits);
    }

    /** The codes to measure on a ladder with these modelled levels. */
    MeasurementPlan plan(LadderSpec spec) {
        return everyCode ? MeasurementPlan.everyCode(spec.levels())
                : verify != null ? MeasurementPlan.of(spec.levels(), verify) : MeasurementPlan.of(spec.levels());
    }
}
