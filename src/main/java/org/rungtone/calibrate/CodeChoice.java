package org.rungtone.calibrate;

import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;
import org.rungtone.internal.Checks;
import org.rungtone.ladder.LevelTable;

/**
 * Which codes a measurement plan holds: every code, the basis plus a given count of verification codes, or
 * neither given, the default for the bit depth ({@link MeasurementPlan#of(LevelTable)}); with a meter, the
 * verification codes are chosen for its ranges ({@link MeterDesign}), as many as by default unless a count is given.
 *
 * @param everyCode measure every code
 * @param verifyCount verification codes on top of the basis, when given
 * @param meter the meter that will read them, when known
 */
public record CodeChoice(boolean everyCode, OptionalInt verifyCount, Optional<MeterRanges> meter) {
    /**
     * Checks the choice.
     *
     * @throws IllegalArgumentException when both every code and a verification count are asked for
     * @throws org.rungtone.internal.InputError when the verification count is negative
     */
    public CodeChoice {
        Objects.requireNonNull(verifyCount, "verifyCount");
        Objects.requireNonNull(meter, "meter");
        Checks.checkArgument(!(everyCode && verifyCount.isPresent()),
                "every code and a verification count exclude each other");
        Checks.checkInput(verifyCount.orElse(0) >= 0, "--verify must be 0 or more: %d", verifyCount.orElse(0));
    }

    /** A choice without a known meter. */
    public CodeChoice(boolean everyCode, OptionalInt verifyCount) {
        this(everyCode, verifyCount, Optional.empty());
    }

    /** The plan of these codes on a ladder with these modelled levels. */
    public MeasurementPlan plan(LevelTable expected) {
        if (everyCode) {
            return MeasurementPlan.everyCode(expected);
        }
        if (meter.isPresent() && expected.bits() > MeasurementPlan.EVERY_CODE_MAX_BITS) {
            return MeasurementPlan.of(expected, verifyCount.orElse(MeasurementPlan.defaultVerifyCount(expected.bits())), meter);
        }
        return verifyCount.isPresent() ? MeasurementPlan.of(expected, verifyCount.getAsInt(), meter)
                : MeasurementPlan.of(expected);
    }
}
