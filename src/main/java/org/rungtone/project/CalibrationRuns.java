package org.rungtone.project;

import java.nio.file.Path;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.List;
import java.util.Optional;
import java.util.function.Supplier;
import org.rungtone.calibrate.BoardSimulation;
import org.rungtone.calibrate.RecordingCalibration;
import org.rungtone.calibrate.UnitFit;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.OutputFolder;
import org.rungtone.internal.Setting;
import org.rungtone.report.CalibrationFiles;
import org.rungtone.report.CalibrationReport;

/**
 * The calibrate commands' runs that write: each checks the output folder, does the work, and writes its files
 * into the folder as a whole ({@link OutputFolder} with the command's role), returning the result and the
 * files in the order the reports list them.
 */
public final class CalibrationRuns {
    private CalibrationRuns() {
    }

    /**
     * A result and the files written for it.
     *
     * @param result what the run made
     * @param files the files written
     * @param <T> the result's type
     */
    public record Written<T>(T result, List<Path> files) {
        /** Copies the list. */
        public Written {
            files = List.copyOf(files);
        }
    }

    /** {@code calibrate plan}: the plan, its CSV and, when asked for, its sweep program. */
    public static Written<CalibrationReport.Plan> plan(CalibrationPlan.Request r) {
        AtomicFiles.checkFolderUsable(r.out());
        try (OutputFolder folder = OutputFolder.open(r.out(), "plan")) {
            CalibrationReport.Plan plan = CalibrationPlan.run(r);
            List<Path> files = CalibrationFiles.writePlan(plan, r.out());
            folder.commit();
            return new Written<>(plan, files);
        }
    }

    /** {@code calibrate simulate}: a drawn board's readings and true levels. */
    public static Written<BoardSimulation.Result> simulate(BoardSimulation.Request r, Path out) {
        AtomicFiles.checkFolderUsable(out);
        BoardSimulation.Result result = BoardSimulation.run(r);
        return written(out, "simulate", result, () -> CalibrationFiles.writeSimulation(result, out));
    }

    /** {@code calibrate fit}: a board's unit profile from readings, and their residuals. */
    public static Written<UnitFit.Result> fit(UnitFit.Request r, Path out) {
        AtomicFiles.checkFolderUsable(out);
        UnitFit.Result result = UnitFit.run(r);
        return written(out, "fit", result, () -> CalibrationFiles.writeProfile(result, out));
    }

    /** {@code calibrate listen}: a board's unit profile from a recorded sweep, its steps and a plot. */
    public static Written<RecordingCalibration.Result> listen(RecordingCalibration.Request r, Path out) {
        AtomicFiles.checkFolderUsable(out);
        RecordingCalibration.Result result = RecordingCalibration.run(r);
        return written(out, "listen", result, () -> CalibrationFiles.writeRecording(result, out));
    }

    /** {@code result} with the files {@code write} puts into {@code out}, which is replaced as a whole. */
    private static <T> Written<T> written(Path out, String what, T result, Supplier<List<Path>> write) {
        try (OutputFolder folder = OutputFolder.open(out, what)) {
            List<Path> files = write.get();
            folder.commit();
            return new Written<>(result, files);
        }
    }

    /**
     * The day of a measurement as written ({@code 2026-05-01}), or today when not given.
     *
     * @throws org.rungtone.internal.SettingError for anything else
     */
    public static LocalDate day(Optional<String> text) {
        if (text.isEmpty()) {
            return LocalDate.now();
        }
        try {
            return LocalDate.parse(text.get().trim());
        } catch (DateTimeParseException e) {
            throw Setting.DATE.error("must look like 2026-05-01: %s", text.get());
        }
    }
}
