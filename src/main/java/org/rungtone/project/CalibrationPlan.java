package org.rungtone.project;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import org.rungtone.calibrate.CodeChoice;
import org.rungtone.calibrate.MeasurementPlan;
import org.rungtone.calibrate.MeterAdvice;
import org.rungtone.calibrate.RecordingSweep;
import org.rungtone.firmware.EmitResult;
import org.rungtone.firmware.FirmwareEmitter;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.firmware.PlaybackEngine;
import org.rungtone.firmware.SweepSpec;
import org.rungtone.internal.Setting;
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
     * @param recording make the sweep for a sound card's recording ({@link RecordingSweep})
     */
    public record Request(LadderSpec ladder, CodeChoice codes, Optional<FirmwareRequest> firmware, String name,
            String toolVersion, double holdSeconds, Optional<String> buttonPin, Path out, boolean recording) {
        /**
         * Checks that every part is there.
         *
         * @throws org.rungtone.internal.SettingError for a recording stepped by a button
         */
        public Request {
            Objects.requireNonNull(ladder, "ladder");
            Objects.requireNonNull(codes, "codes");
            Objects.requireNonNull(firmware, "firmware");
            Objects.requireNonNull(buttonPin, "buttonPin");
            Objects.requireNonNull(out, "out");
            if (recording && buttonPin.isPresent()) {
                throw Setting.RECORDING.problem("%s needs the sweep's own timing; leave %s out",
                        Setting.RECORDING.ref(), Setting.BUTTON.ref());
            }
        }

        /** A plan for a meter. */
        public Request(LadderSpec ladder, CodeChoice codes, Optional<FirmwareRequest> firmware, String name,
                String toolVersion, double holdSeconds, Optional<String> buttonPin, Path out) {
            this(ladder, codes, firmware, name, toolVersion, holdSeconds, buttonPin, out, false);
        }

        /** The firmware settings of the sweep: those given, or the generic program when only a button is. */
        Optional<FirmwareRequest> sweepTarget() {
            return firmware.isEmpty() && buttonPin.isPresent() ? Optional.of(FirmwareRequest.builder().build())
                    : firmware;
        }
    }

    /** The sweep's hold per code unless told otherwise: 2 s for a meter, 40 ms for a recording. */
    public static double defaultHoldSeconds(boolean recording) {
        return recording ? RecordingSweep.DEFAULT_HOLD_SECONDS : 2;
    }

    /**
     * Refuses player settings a plan has no use for: a plan always emits the sweep program.
     *
     * @param engine the engine asked for, when one was
     * @param loopOrDds whether loop points or a DDS frequency were given
     * @throws org.rungtone.internal.SettingError for another engine, loop points or a DDS frequency
     */
    public static void checkSweepOptions(Optional<PlaybackEngine> engine, boolean loopOrDds) {
        if (engine.isPresent() && engine.get() != PlaybackEngine.SWEEP) {
            throw Setting.ENGINE.problem("%s %s: a measurement plan always emits the sweep program; leave %s out",
                    Setting.ENGINE.ref(), engine.get().name().toLowerCase(Locale.ROOT), Setting.ENGINE.ref());
        }
        if (loopOrDds) {
            throw Setting.LOOP.problem("%s and %s do not apply to the sweep program; leave them out",
                    Setting.LOOP.ref(), Setting.DDS_FREQUENCY.ref());
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
        MeasurementPlan plan = r.recording() ? r.codes().recordingPlan(model) : r.codes().plan(model);
        Optional<RecordingSweep> recording = r.recording() ? Optional.of(RecordingSweep.of(plan, r.holdSeconds()))
                : Optional.empty();
        double lsb = (model.maxVolts() - model.minVolts()) / (model.size() - 1);
        double maxAbs = Math.max(Math.abs(model.minVolts()), Math.abs(model.maxVolts()));
        List<MeterAdvice> advice = MeterAdvice.forLevels(maxAbs, lsb);
        Optional<EmitResult> sweep = r.sweepTarget().map(base -> FirmwareEmitter.emit(sweepRequest(base, plan,
                recording, r), r.out()));
        return new CalibrationReport.Plan(r.ladder(), plan, lsb, advice, sweep, r.holdSeconds(), r.buttonPin(),
                r.codes().meter(), recording);
    }

    private static FirmwareRequest sweepRequest(FirmwareRequest base, MeasurementPlan plan,
            Optional<RecordingSweep> recording, Request r) {
        SweepSpec sweep = recording.map(s -> SweepSpec.recording(plan.bits(), s.stepCodes(), s.holdTicks(),
                s.patternSteps(), RecordingSweep.PATTERN_TICKS)).orElseGet(() -> SweepSpec.of(plan.bits(),
                        plan.codeArray(), 1000 * r.holdSeconds(), r.buttonPin()));
        String what = recording.isPresent() ? "calibration sweep for a recording: a start pattern, the " : "calibration"
                + " sweep: the ";
        return base.toBuilder().name(r.name()).toolVersion(r.toolVersion())
                .setting(what + plan.codes().size() + " codes of plan.csv, in its order" + (recording.isPresent()
                        ? " with a return to code 0 before every " + RecordingSweep.RETURN_EVERY + "th, an end pattern"
                        : ""))
                .sweep(sweep).build();
    }
}
