package org.rungtone.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.rungtone.calibrate.MeasurementPlan;
import org.rungtone.calibrate.MeterAdvice;
import org.rungtone.calibrate.PlannedCode;
import org.rungtone.firmware.EmitResult;
import org.rungtone.firmware.FirmwareEmitter;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.firmware.PlaybackEngine;
import org.rungtone.firmware.SweepSpec;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Units;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;
import org.rungtone.report.Json;
import org.rungtone.report.TextTable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code rungtone calibrate plan}: what to measure on a built board, as a checklist, a CSV and a sweep program. */
@Command(name = "plan", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Say what to measure on a built board; write plan.csv and a sweep program.",
            "Chooses the codes to measure (every code up to 6 bits; else all bits low, all high, each bit alone"
                + " and check codes spread over the range), prints a checklist with the level the model expects"
                + " for each and how to measure it, writes plan.csv to fill in, and with --pins a sweep program"
                + " that puts each code on the pins in turn."},
        footerHeading = "%nExample:%n",
        footer = {"  rungtone calibrate plan \\",
            "      --ladder examples/calibration/greenhouse-r2r.toml \\",
            "      --target avr --pins PD2-PD7 --cpu-clock 16MHz --button PB0 \\",
            "      --out greenhouse-cal",
            "  (writes plan.csv, sweep.h, sweep.c and sweep_data.c into greenhouse-cal/)"})
public final class CalibratePlanCommand implements Callable<Integer> {
    static final double DEFAULT_HOLD_SECONDS = 2.0;

    @Spec
    CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Mixin
    PlanOptions codes;

    @Option(names = "--hold", paramLabel = "<time>", converter = Converters.Seconds.class, defaultValue = "2s",
            description = "How long the sweep holds each code (default ${DEFAULT-VALUE}).")
    double holdSeconds;

    @Option(names = "--button", paramLabel = "PIN",
            description = "Step to the next code on each press of a button on this pin (to ground) instead,"
                    + " e.g. PB0.")
    String button;

    @Mixin
    FirmwareOptions firmware;

    @Option(names = "--name", paramLabel = "<symbol>", defaultValue = "sweep",
            description = "C symbol prefix of the sweep program (default ${DEFAULT-VALUE}).")
    String name;

    @Option(names = "--out", paramLabel = "DIR", defaultValue = "rungtone-out/calibration",
            description = "Output folder (default ${DEFAULT-VALUE}).")
    Path out;

    @Option(names = "--json", description = "Print JSON instead of text.")
    boolean json;

    @Override
    public Integer call() {
        codes.check();
        if (firmware.engine != null && PlaybackEngine.parse(firmware.engine) != PlaybackEngine.SWEEP) {
            throw new InputError("--engine " + firmware.engine + ": a measurement plan always emits the sweep"
                    + " program; leave --engine out");
        }
        if (firmware.loop != null || firmware.ddsFrequencyHz != null) {
            throw new InputError("--loop and --dds-frequency do not apply to the sweep program; leave them out");
        }
        AtomicFiles.checkFolderUsable(out);
        LadderSpec ladderSpec = codes.spec();
        LevelTable model = ladderSpec.levels();
        MeasurementPlan plan = codes.plan(ladderSpec);
        double lsb = (model.maxVolts() - model.minVolts()) / (model.size() - 1);
        double maxAbs = Math.max(Math.abs(model.minVolts()), Math.abs(model.maxVolts()));
        List<MeterAdvice> advice = MeterAdvice.forLevels(maxAbs, lsb);
        Optional<EmitResult> emitted = sweep(plan);
        Path csv = out.resolve("plan.csv");
        AtomicFiles.writeString(csv, plan.csv());
        List<String> files = new ArrayList<>();
        files.add(csv.toString());
        emitted.ifPresent(e -> e.files().forEach(f -> files.add(f.toString())));
        PrintWriter o = spec.commandLine().getOut();
        if (json) {
            o.print(Json.toJson(json(ladderSpec, plan, lsb, advice, emitted, files)));
        } else if (!common.quiet) {
            o.print(text(ladderSpec, plan, lsb, advice, emitted, files));
        }
        o.flush();
        return 0;
    }

    private Optional<EmitResult> sweep(MeasurementPlan plan) {
        if (!firmware.wantsPlayer() && button == null) {
            return Optional.empty();
        }
        FirmwareRequest base = firmware.request().orElseGet(() -> FirmwareRequest.builder().build());
        SweepSpec sweep = SweepSpec.of(plan.bits(), plan.codeArray(), 1000 * holdSeconds, Optional.ofNullable(button));
        FirmwareRequest r = base.toBuilder().name(name).toolVersion(Version.get())
                .setting("calibration sweep: the " + plan.codes().size() + " codes of plan.csv, in its order")
                .sweep(sweep).build();
        return Optional.of(FirmwareEmitter.emit(r, out));
    }

    private String stepping(MeasurementPlan plan) {
        if (button != null) {
            return "one code per press of the button on " + button;
        }
        return String.format(Locale.ROOT, "each code held %s, %s in all", seconds(holdSeconds),
                seconds(holdSeconds * plan.codes().size()));
    }

    private static String seconds(double s) {
        return s >= 120 ? String.format(Locale.ROOT, "%.1f min", s / 60) : Units.format(s, "s");
    }

    private String text(LadderSpec s, MeasurementPlan plan, double lsb, List<MeterAdvice> advice,
            Optional<EmitResult> emitted, List<String> files) {
        StringBuilder b = new StringBuilder();
        LevelTable model = plan.expected();
        line(b, "Calibration plan: %s, %d codes to measure%s", s.describe(), plan.codes().size(),
                plan.everyCode() ? " (every code: the readings will be the profile)" : "");
        line(b, "  the model expects %s .. %s, an average step (LSB) of %s", v(model.minVolts()),
                v(model.maxVolts()), v(lsb));
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
        line(b, "Meter: DC volts, %s at most", v(Math.max(Math.abs(model.minVolts()), Math.abs(model.maxVolts()))));
        TextTable m = new TextTable("meter counts", "range", "step", "steps per LSB", "note");
        for (MeterAdvice a : advice) {
            m.row(a.counts(), Units.format(a.rangeVolts(), "V"), Units.format(a.stepVolts(), "V"),
                    String.format(Locale.ROOT, "%.1f", a.stepsPerLsb()), a.fineEnough() ? "" : "coarse: the fit"
                            + " will be limited by the meter");
        }
        b.append(m.render("  "));
        line(b, "  (2000 counts is a 3½-digit meter, 20000 a 4½-digit one.) The fit wants a step of a quarter");
        line(b, "  LSB or finer; repeated readings of a code average its noise.");
        line(b, "  Settling: the ladder settles in microseconds, a handheld meter needs 1-2 s (two or three");
        line(b, "  updates) before its last digit is steady; read then. The sweep: %s.", stepping(plan));
        line(b, "");
        line(b, "Measuring safely");
        line(b, "  ! Black probe on the board's ground, red probe on the buffer's output (or the ladder's output");
        line(b, "    node without a buffer). Clip the black lead on rather than holding it.");
        line(b, "  ! Keep the probe tips off neighbouring pins: a slip shorts two outputs and can drive a pin past");
        line(b, "    its current limit. The microcontroller's datasheet gives the limits per pin and per port.");
        line(b, "  ! Use the volts setting only: the ohms and current ranges on a powered board can damage it or");
        line(b, "    the meter.");
        if (emitted.isPresent()) {
            line(b, "");
            line(b, "Sweep program");
            for (String r : emitted.get().report()) {
                line(b, "  %s", r);
            }
            for (String w : emitted.get().warnings()) {
                line(b, "  ! %s", w);
            }
        } else {
            line(b, "");
            line(b, "No sweep program: give --pins (and --target, --cpu-clock) to have one written, or set the"
                    + " codes by hand.");
        }
        line(b, "");
        line(b, "Wrote %s", String.join(", ", files));
        line(b, "Next: fill in the measured column, then run");
        line(b, "  rungtone calibrate fit %s --board NAME (with the same ladder options)", files.get(0));
        return b.toString();
    }

    private static Map<String, Object> json(LadderSpec s, MeasurementPlan plan, double lsb,
            List<MeterAdvice> advice, Optional<EmitResult> emitted, List<String> files) {
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("ladder", s.describe());
        root.put("bits", plan.bits());
        root.put("every_code", plan.everyCode());
        root.put("lsb_v", lsb);
        List<Map<String, Object>> codes = new ArrayList<>();
        for (PlannedCode c : plan.codes()) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("code", c.code());
            m.put("binary", MeasurementPlan.binary(c.code(), plan.bits()));
            m.put("expected_v", c.expectedVolts());
            m.put("role", c.role().name().toLowerCase(Locale.ROOT));
            codes.add(m);
        }
        root.put("codes", codes);
        List<Map<String, Object>> meters = new ArrayList<>();
        for (MeterAdvice a : advice) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("counts", a.counts());
            m.put("range_v", a.rangeVolts());
            m.put("step_v", a.stepVolts());
            m.put("steps_per_lsb", a.stepsPerLsb());
            meters.add(m);
        }
        root.put("meters", meters);
        root.put("sweep", emitted.map(EmitResult::report).orElse(List.of()));
        root.put("warnings", emitted.map(EmitResult::warnings).orElse(List.of()));
        root.put("files", files);
        return root;
    }

    private static void line(StringBuilder b, String format, Object... args) {
        b.append(String.format(Locale.ROOT, format, args).stripTrailing()).append('\n');
    }

    private static String v(double volts) {
        return Units.format(volts, "V");
    }
}
