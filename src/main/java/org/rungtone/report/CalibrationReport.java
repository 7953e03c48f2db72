package org.rungtone.report;

import static org.rungtone.report.TextLines.line;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import org.rungtone.calibrate.BoardSimulation;
import org.rungtone.calibrate.MeasurementPlan;
import org.rungtone.calibrate.MeterAdvice;
import org.rungtone.calibrate.MeterRanges;
import org.rungtone.calibrate.PlannedCode;
import org.rungtone.calibrate.RecordingSweep;
import org.rungtone.firmware.EmitResult;
import org.rungtone.internal.Units;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;
import org.rungtone.ladder.Part;

/**
 * Renders a calibration plan (the checklist, meter advice, safety notes and the sweep program) as text for
 * people and as JSON for machines, and the summary of a simulated board. {@link UnitFitReport} renders fits.
 */
public final class CalibrationReport {
    private CalibrationReport() {
    }

    /**
     * A measurement plan as the reports show it.
     *
     * @param ladder the described ladder
     * @param plan the codes to measure, in sweep order
     * @param lsbVolts the model's average step
     * @param meters advice per meter class
     * @param sweep the sweep program written, when one was asked for
     * @param holdSeconds how long the sweep holds each code (unless it steps on a button)
     * @param buttonPin the pin of the button that steps the sweep, when given
     * @param meter the meter the codes were chosen for, when given
     * @param recording the sweep for a sound card's recording, when the plan is for one
     */
    public record Plan(LadderSpec ladder, MeasurementPlan plan, double lsbVolts, List<MeterAdvice> meters,
            Optional<EmitResult> sweep, double holdSeconds, Optional<String> buttonPin, Optional<MeterRanges> meter,
            Optional<RecordingSweep> recording) {
        /** Copies the list. */
        public Plan {
            Objects.requireNonNull(ladder, "ladder");
            Objects.requireNonNull(plan, "plan");
            meters = List.copyOf(meters);
            Objects.requireNonNull(sweep, "sweep");
            Objects.requireNonNull(buttonPin, "buttonPin");
            Objects.requireNonNull(meter, "meter");
            Objects.requireNonNull(recording, "recording");
        }

        /** A plan for a meter of no known count. */
        public Plan(LadderSpec ladder, MeasurementPlan plan, double lsbVolts, List<MeterAdvice> meters,
                Optional<EmitResult> sweep, double holdSeconds, Optional<String> buttonPin) {
            this(ladder, plan, lsbVolts, meters, sweep, holdSeconds, buttonPin, Optional.empty(), Optional.empty());
        }
    }

    /** The text report of a plan: checklist, meter, safety, sweep program and the files written. */
    public static String planText(Plan p, List<Path> files) {
        StringBuilder b = new StringBuilder();
        MeasurementPlan plan = p.plan();
        LevelTable model = plan.expected();
        if (p.recording().isPresent()) {
            line(b, "Calibration plan for a recording: %s, %d codes%s", p.ladder().describe(), plan.codes().size(),
                    plan.everyCode() ? " (every code: the recorded levels will be the profile)" : "");
            line(b, "  the model expects %s .. %s, an average step (LSB) of %s", v(model.minVolts()),
                    v(model.maxVolts()), v(p.lsbVolts()));
            line(b, "");
            RecordingChecklist.text(b, p.recording().get(), plan);
            sweep(b, p);
            line(b, "");
            line(b, "Wrote %s", CalibrationFiles.joined(files));
            line(b, "Next: record the sweep, then run");
            line(b, "  rungtone calibrate listen RECORDING.wav --board NAME (with the same ladder, code and --hold"
                    + " options)");
            return b.toString();
        }
        line(b, "Calibration plan: %s, %d codes to measure%s", p.ladder().describe(), plan.codes().size(),
                plan.everyCode() ? " (every code: the readings will be the profile)" : "");
        line(b, "  the model expects %s .. %s, an average step (LSB) of %s", v(model.minVolts()),
                v(model.maxVolts()), v(p.lsbVolts()));
        line(b, "");
        line(b, "Checklist, in sweep order (write each reading in the measured column of plan.csv)");
        TextTable t = new TextTable("step", "code", "binary", "expected", "why");
        int step = 1;
        for (PlannedCode c : plan.codes()) {
            t.row(step++, c.code(), MeasurementPlan.binary(c.code(), plan.bits()),
                    String.format(Locale.ROOT, "%.4f V", c.expectedVolts()), c.describe());
        }
        b.append(t.render("  "));
        line(b, "");
        p.meter().ifPresent(m -> RecordingChecklist.meterLine(b, m, p.plan()));
        meter(b, p);
        line(b, "");
        safety(b);
        sweep(b, p);
        line(b, "");
        line(b, "Wrote %s", CalibrationFiles.joined(files));
        line(b, "Next: fill in the measured column, then run");
        line(b, "  rungtone calibrate fit %s --board NAME (with the same ladder options)", files.get(0));
        return b.toString();
    }

    private static void meter(StringBuilder b, Plan p) {
        LevelTable model = p.plan().expected();
        line(b, "Meter: DC volts, %s at most", v(Math.max(Math.abs(model.minVolts()), Math.abs(model.maxVolts()))));
        TextTable m = new TextTable("meter counts", "range", "step", "steps per LSB", "note");
        for (MeterAdvice a : p.meters()) {
            m.row(a.counts(), Units.format(a.rangeVolts(), "V"), Units.format(a.stepVolts(), "V"),
                    String.format(Locale.ROOT, "%.1f", a.stepsPerLsb()), a.fineEnough() ? "" : "coarse: the fit"
                            + " will be limited by the meter");
        }
        b.append(m.render("  "));
        line(b, "  (2000 counts is a 3½-digit meter, 20000 a 4½-digit one.) The fit wants a step of a quarter");
        line(b, "  LSB or finer; repeated readings of a code average its noise.");
        line(b, "  Settling: the ladder settles in microseconds, a handheld meter needs 1-2 s (two or three");
        line(b, "  updates) before its last digit is steady; read then. The sweep: %s.", stepping(p));
    }

    private static void safety(StringBuilder b) {
        line(b, "Measuring safely");
        line(b, "  ! Black probe on the board's ground, red probe on the buffer's output (or the ladder's output");
        line(b, "    node without a buffer). Clip the black lead on rather than holding it.");
        line(b, "  ! Keep the probe tips off neighbouring pins: a slip shorts two outputs and can drive a pin past");
        line(b, "    its current limit. The microcontroller's datasheet gives the limits per pin and per port.");
        line(b, "  ! Use the volts setting only: the ohms and current ranges on a powered board can damage it or");
        line(b, "    the meter.");
    }

    private static void sweep(StringBuilder b, Plan p) {
        line(b, "");
        if (p.sweep().isEmpty()) {
            line(b, "No sweep program: give --pins (and --target, --cpu-clock) to have one written, or set the"
                    + " codes by hand.");
            return;
        }
        line(b, "Sweep program");
        for (String r : p.sweep().get().report()) {
            line(b, "  %s", r);
        }
        for (String w : p.sweep().get().warnings()) {
            line(b, "  ! %s", w);
        }
    }

    private static String stepping(Plan p) {
        if (p.buttonPin().isPresent()) {
            return "one code per press of the button on " + p.buttonPin().get();
        }
        return String.format(Locale.ROOT, "each code held %s, %s in all", seconds(p.holdSeconds()),
                seconds(p.holdSeconds() * p.plan().codes().size()));
    }

    private static String seconds(double s) {
        return s >= 120 ? String.format(Locale.ROOT, "%.1f min", s / 60) : Units.format(s, "s");
    }

    /**
     * The JSON report of a plan ({@code docs/schema/calibrate-plan.schema.json}); paths are relative to
     * {@code outDir}.
     */
    public static Map<String, Object> planJson(Plan p, List<Path> files, Path outDir, String toolVersion) {
        return CalibrationJson.plan(p, files, outDir, toolVersion);
    }

    /**
     * The JSON report of a simulated board ({@code docs/schema/calibrate-simulate.schema.json}); paths are
     * relative to {@code outDir}.
     */
    public static String simulationJson(BoardSimulation.Result r, List<Path> files, Path outDir, String toolVersion) {
        return Json.toJson(CalibrationJson.simulation(r, files, outDir, toolVersion));
    }

    /**
     * The text report of a simulated board: its drawn parts against the nominal ones, how it was read, and
     * the files written (the readings first, then the true levels).
     */
    public static String simulationText(BoardSimulation.Result r, List<Path> files) {
        StringBuilder b = new StringBuilder();
        BoardSimulation.Request q = r.request();
        line(b, "Simulated board: %s, seed %d", q.ladder().describe(), q.seed());
        List<Part> nominal = q.ladder().parts();
        List<Part> drawn = r.board().ladder().parts();
        for (int i = 0; i < drawn.size(); i++) {
            line(b, "  %-14s %10s  (%+.2f %%)", drawn.get(i).label(), Units.format(drawn.get(i).ohms(), ""),
                    100 * (drawn.get(i).ohms() / nominal.get(i).ohms() - 1));
        }
        int repeats = q.meter().repeats();
        line(b, "  read at %d codes, %d time%s each; meter noise %s rms, step %s", r.plan().codes().size(),
                repeats, repeats == 1 ? "" : "s", Units.format(q.meter().noiseVolts(), "V"),
                Units.format(q.meter().stepVolts(), "V"));
        line(b, "Wrote %s", CalibrationFiles.joined(files));
        line(b, "Next: rungtone calibrate fit %s (with the same ladder options)", files.get(0));
        return b.toString();
    }

    private static String v(double volts) {
        return Units.format(volts, "V");
    }
}
