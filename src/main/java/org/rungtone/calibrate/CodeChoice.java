package org.rungtone.calibrate;

import java.util.Objects;
import java.util.Optional;
import java.util.OptionalInt;
import org.rungtone.internal.Checks;
import org.rungtone.internal.Setting;
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
    /** Up to this many bits a recorded sweep holds every code unless told otherwise. */
    public static final int RECORDING_EVERY_CODE_MAX_BITS = 10;

    /**
     * Checks the choice.
     *
     * @throws org.rungtone.internal.SettingError when both every code and a verification count are asked for
     * @throws org.rungtone.internal.InputError when the verification count is negative
     */
    public CodeChoice {
        Objects.requireNonNull(verifyCount, "verifyCount");
        Objects.requireNonNull(meter, "meter");
        if (everyCode && verifyCount.isPresent()) {
            throw Setting.VERIFY.problem("%s and %s exclude each other; give one", Setting.EVERY_CODE.ref(),
                    Setting.VERIFY.ref());
        }
        Checks.checkInput(verifyCount.orElse(0) >= 0, "--verify must be 0 or more: %d", verifyCount.orElse(0));
    }

    /** A choice without a known meter. */
    public CodeChoice(boolean everyCode, OptionalInt verifyCount) {
        this(everyCode, verifyCount, Optional.empty());
    }

    /**
     * The plan of these codes for a recorded sweep: with neither every code nor a verification count asked
     * for, every code up to {@value #RECORDING_EVERY_CODE_MAX_BITS} bits (1024 codes held 40 ms take 41 s),
     * else {@link #plan}.
     */
    public MeasurementPlan recordingPlan(LevelTable expected) {
        if (!everyCode && verifyCount.isEmpty() && expected.bits() <= RECORDING_EVERY_CODE_MAX_BITS) {
            return MeasurementPlan.everyCode(expected);
        }
        return plan(expected);
    }

    /** The plan of these codes on a ladder with these modelled levels. */
    public MeasurementPlan plan(LevelTable expected) {
        if (everyCode) {
            return MeasurementPlan.everyCode(expected);
        }
        if (meter.isPresent() && expected.bits() > MeasurementPlan.EVERY_CODE_MAX_BITS) {
            int checks = verifyCount.orElse(MeasurementPlan.defaultVerifyCount(expected.bits()));
            return MeasurementPlan.of(expected, checks, meter);
        }
        return verifyCount.isPresent() ? MeasurementPlan.of(expected, verifyCount.getAsInt(), meter)
                : MeasurementPlan.of(expected);
    }
}
