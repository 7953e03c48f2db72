package org.rungtone.report;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.rungtone.calibrate.BoardSimulation;
import org.rungtone.calibrate.CodeResidual;
import org.rungtone.calibrate.FitReport;
import org.rungtone.calibrate.MeasurementPlan;
import org.rungtone.calibrate.RecordingCalibration;
import org.rungtone.calibrate.SimulatedBoard;
import org.rungtone.calibrate.UnitFit;
import org.rungtone.calibrate.UnitProfile;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.Setting;
import org.rungtone.internal.Units;
import org.rungtone.ladder.LevelTable;

/**
 * The files of the calibrate commands, written atomically into the output folder: the plan's CSV to fill in,
 * a simulated board's readings and true levels, a fitted board's unit profile and residuals (CSV with a
 * header row and {@code \n} records), and a recording's steps and plot.
 */
public final class CalibrationFiles {
    /** The plan to fill in. */
    public static final String PLAN_CSV = "plan.csv";
    /** A simulated board's filled-in plan. */
    public static final String READINGS_CSV = "readings.csv";
    /** A simulated board's true level per code. */
    public static final String TRUE_LEVELS_CSV = "true-levels.csv";
    /** Every code's residual of a fit. */
    public static final String RESIDUALS_CSV = "fit-residuals.csv";
    /** Every step of a recorded sweep: where it is, its level and its residual. */
    public static final String RECORDING_STEPS_CSV = "recording-steps.csv";
    /** The recording with the fitted model. */
    public static final String RECORDING_PNG = "recording.png";

    private CalibrationFiles() {
    }

    /**
     * Writes the plan's CSV; returns it, then the sweep program's files.
     *
     * @throws org.rungtone.internal.SettingError when a plan there already holds readings: they are never
     *     overwritten
     */
    public static List<Path> writePlan(CalibrationReport.Plan p, Path out) {
        Path csv = out.resolve(PLAN_CSV);
        if (java.nio.file.Files.exists(csv)) {
            int filled = org.rungtone.calibrate.MeasurementCsv.filledReadings(csv);
            if (filled != 0) {
                throw Setting.OUT.problem("%s: %s; rename it (e.g. to readings.csv) to keep it, or write the new"
                        + " plan elsewhere (%s)", csv, filled > 0 ? "already holds " + filled + " reading"
                        + (filled == 1 ? "" : "s") : "is not a fresh plan and may hold readings",
                        Setting.OUT.ref());
            }
        }
        AtomicFiles.writeString(csv, p.plan().csv());
        List<Path> files = new ArrayList<>();
        files.add(csv);
        p.sweep().ifPresent(e -> files.addAll(e.files()));
        return files;
    }

    /** Writes a simulated board's readings and true levels; returns them in that order. */
    public static List<Path> writeSimulation(BoardSimulation.Result r, Path out) {
        Path readings = out.resolve(READINGS_CSV);
        Path truth = out.resolve(TRUE_LEVELS_CSV);
        AtomicFiles.writeString(readings, readingsHeader(r.request()) + r.readingsCsv());
        AtomicFiles.writeString(truth, levelsCsv(r.board().levels()));
        return List.of(readings, truth);
    }

    /** Writes a fitted board's unit profile and its residuals; returns them in that order. */
    public static List<Path> writeProfile(UnitFit.Result r, Path out) {
        return writeProfile(r.fit(), r.profile(), out);
    }

    /** Writes a unit profile and the residuals of its fit; returns them in that order. */
    static List<Path> writeProfile(FitReport fit, UnitProfile unit, Path out) {
        Path profile = out.resolve(profileFileName(unit.board()));
        Path residuals = out.resolve(RESIDUALS_CSV);
        AtomicFiles.writeString(profile, unit.toToml());
        AtomicFiles.writeString(residuals, residualCsv(fit));
        return List.of(profile, residuals);
    }

    /**
     * Writes what a recording's fit made: the unit profile, the residuals of its board fit, every step of the
     * recording ({@value #RECORDING_STEPS_CSV}) and the plot of the recording with the fit
     * ({@value #RECORDING_PNG}); returns them in that order.
     */
    public static List<Path> writeRecording(RecordingCalibration.Result r, Path out) {
        List<Path> files = new ArrayList<>(writeProfile(r.fit(), r.profile(), out));
        Path steps = out.resolve(RECORDING_STEPS_CSV);
        Path png = out.resolve(RECORDING_PNG);
        AtomicFiles.writeString(steps, RecordingReport.stepsCsv(r.recording()));
        Plots.write(png, RecordingReport.chart(r.recording()));
        files.add(steps);
        files.add(png);
        return files;
    }

    /** The profile's file name: the board name with letters, digits, '.', '-' and '_' kept, anything else a '-'. */
    static String profileFileName(String board) {
        String f = board.replaceAll("[^A-Za-z0-9._-]", "-");
        return (f.startsWith(".") ? "board" + f : f) + ".unit.toml";
    }

    /** The comment line that says how a simulated board was drawn and read. */
    static String readingsHeader(BoardSimulation.Request q) {
        SimulatedBoard.Meter meter = q.meter();
        return String.format(Locale.ROOT, "# Simulated board: %s drawn with seed %d; meter noise %s rms, step %s,"
                + " %d reading%s per code.\n", q.ladder().describe(), q.seed(), Units.format(meter.noiseVolts(), "V"),
                Units.format(meter.stepVolts(), "V"), meter.repeats(), meter.repeats() == 1 ? "" : "s");
    }

    /** Every code's level: code, volts. */
    static String levelsCsv(LevelTable t) {
        StringBuilder sb = new StringBuilder();
        try (CSVPrinter p = new CSVPrinter(sb, format("code", "volts"))) {
            for (int k = 0; k < t.size(); k++) {
                p.printRecord(k, f9(t.volts(k)));
            }
        } catch (IOException e) {
            throw new IllegalStateException("CSV to memory failed", e);
        }
        return sb.toString();
    }

    /** Every code's residual: readings, mean, spread, model, residual, score and verdict. */
    static String residualCsv(FitReport fit) {
        StringBuilder sb = new StringBuilder();
        CSVFormat format = format("code", "binary", "readings", "mean_volts", "spread_volts", "model_volts",
                "residual_volts", "score", "verdict");
        try (CSVPrinter p = new CSVPrinter(sb, format)) {
            for (CodeResidual r : fit.residuals()) {
                p.printRecord(r.code(), MeasurementPlan.binary(r.code(), fit.bits()), r.readings(),
                        f9(r.meanVolts()), f9(r.spreadVolts()), f9(r.modelVolts()), f9(r.residualVolts()),
                        String.format(Locale.ROOT, "%.3f", r.score()), r.status().word());
            }
        } catch (IOException e) {
            throw new IllegalStateException("CSV to memory failed", e);
        }
        return sb.toString();
    }

    /** The files as the text reports list them. */
    static String joined(List<Path> files) {
        return String.join(", ", names(files));
    }

    /** The files as the JSON reports list them. */
    static List<String> names(List<Path> files) {
        return files.stream().map(Path::toString).toList();
    }

    private static CSVFormat format(String... header) {
        return CSVFormat.DEFAULT.builder().setRecordSeparator("\n").setHeader(header).build();
    }

    private static String f9(double v) {
        return String.format(Locale.ROOT, "%.9f", v);
    }
}
