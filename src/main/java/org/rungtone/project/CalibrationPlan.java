package org.rungtone.project;

import java.nio.file.Path;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.rungtone.calibrate.CodeChoice;
import org.rungtone.calibrate.MeasurementPlan;
import org.rungtone.calibrate.MeterAdvice;
import org.rungtone.firmware.EmitResult;
import org.rungtone.firmware.FirmwareEmitter;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.firmware.SweepSpec;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;
import org.rungtone.report.CalibrationReport;

/**
 * The work of {@code calibrate plan}: the codes to measure on a built board with the levels the ladder model
 * expects, advice on the meter, and the sweep program that puts each code on the pins in turn.
 */
public final class CalibrationPlan {
    private CalibrationPlan() {
    }

    /**
     * What to plan.
     *
     * @param ladder the described ladder
     * @param codes which codes to measure
     * @param firmware the sweep program's target settings (family, pins, clock, ...), empty for no program
     * @param name C symbol prefix of the sweep program
     * @param toolVersion Rungtone version written into the program's files
     * @param holdSeconds how long the sweep holds each code
     * @param buttonPin the pin of a button (to ground) that steps to the next code instead, when given
     * @param out the folder the sweep program is written into
     */
    public record Request(LadderSpec ladder, CodeChoice codes, Optional<FirmwareRequest> firmware, String name,
            String toolVersion, double holdSeconds, Optional<String> buttonPin, Path out) {
        /** Checks that every part is there. */
        public Request {
            Objects.requireNonNull(ladder, "ladder");
            Objects.requireNonNull(codes, "codes");
            Objects.requireNonNull(firmware, "firmware");
            Objects.requireNonNull(buttonPin, "buttonPin");
            Objects.requireNonNull(out, "out");
        }
    }

    /**
     * Chooses the codes, advises on meters and, when asked for, writes the sweep program.
     *
     * @throws org.rungtone.internal.InputError for a sweep program the target settings cannot make (nothing
     *         is written then)
     */
    public static CalibrationReport.Plan run(Request r) {
        LevelTable model = r.ladder().levels();
        MeasurementPlan plan = r.codes().plan(model);
        double lsb = (model.maxVolts() - model.minVolts()) / (model.size() - 1);
        double maxAbs = Math.max(Math.abs(model.minVolts()), Math.abs(model.maxVolts()));
        List<MeterAdvice> advice = MeterAdvice.forLevels(maxAbs, lsb);
        Optional<EmitResult> sweep = r.firmware().map(base -> FirmwareEmitter.emit(sweepRequest(base, plan, r),
                r.out()));
        return new CalibrationReport.Plan(r.ladder(), plan, lsb, advice, sweep, r.holdSeconds(), r.buttonPin());
    }

    private static FirmwareRequest sweepRequest(FirmwareRequest base, MeasurementPlan plan, Request r) {
        SweepSpec sweep = SweepSpec.of(plan.bits(), plan.codeArray(), 1000 * r.holdSeconds(), r.buttonPin());
        return base.toBuilder().name(r.name()).toolVersion(r.toolVersion())
                .setting("calibration sweep: the " + plan.codes().size() + " codes of plan.csv, in its order")
                .sweep(sweep).build();
    }
}
