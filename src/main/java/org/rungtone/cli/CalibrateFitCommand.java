package org.rungtone.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.rungtone.calibrate.BoardFit;
import org.rungtone.calibrate.BoardModel;
import org.rungtone.calibrate.CodeResidual;
import org.rungtone.calibrate.FitReport;
import org.rungtone.calibrate.MeasurementCsv;
import org.rungtone.calibrate.MeasurementPlan;
import org.rungtone.calibrate.Measurements;
import org.rungtone.calibrate.ModelSummary;
import org.rungtone.calibrate.SwitchedLoad;
import org.rungtone.calibrate.UnitProfile;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;
import org.rungtone.report.Json;
import org.rungtone.report.TextTable;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code rungtone calibrate fit}: readings of a built board to a unit profile. */
@Command(name = "fit", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Fit a board's readings and write its unit profile.",
            "Reads the filled-in plan (or any CSV of code, volts), fits the board by least squares (an offset"
                + " plus a step per bit; a switched-load model when the pins' high and low resistances differ"
                + " enough to show), leaves out readings that do not fit and names them, and writes a unit"
                + " profile with every code's level for 'build --unit'."},
        footerHeading = "%nExample:%n",
        footer = {"  rungtone calibrate fit greenhouse-cal/plan.csv --board greenhouse-1 \\",
            "      --ladder examples/calibration/greenhouse-r2r.toml \\",
            "      --date 2026-05-01 --out greenhouse-cal",
            "  (writes greenhouse-cal/greenhouse-1.unit.toml and fit-residuals.csv)"})
public final class CalibrateFitCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Parameters(index = "0", paramLabel = "MEASUREMENTS.csv", description = "The readings: the plan's CSV with"
            + " its measured column filled in, or rows of code, volts.")
    Path measurements;

    @Option(names = "--bits", paramLabel = "N",
            description = "Bit depth (default: the ladder's, else the width of the file's binary column).")
    int bits;

    @Mixin
    LadderOptions ladder;

    @Option(names = "--board", paramLabel = "NAME",
            description = "The board's name in the profile and its file name (default: the readings' file name).")
    String board;

    @Option(names = "--date", paramLabel = "YYYY-MM-DD",
            description = "Date of the readings (default: today).")
    String date;

    @Option(names = "--resolution", paramLabel = "<volts>", converter = Converters.Volts.class,
            description = "The meter's step, e.g. 1mV (default: from the readings' last digits).")
    Double resolution;

    @Option(names = "--out", paramLabel = "DIR", defaultValue = "rungtone-out/calibration",
            description = "Output folder (default ${DEFAULT-VALUE}).")
    Path out;

    @Option(names = "--json", description = "Print JSON instead of text.")
    boolean json;

    @Override
    public Integer call() {
        LocalDate day = day();
        if (resolution != null && !(resolution > 0 && resolution < 10)) {
            throw new InputError("--resolution must be a positive voltage below 10 V, e.g. 1mV: " + resolution);
        }
        AtomicFiles.checkFolderUsable(out);
        Optional<LadderSpec> ladderSpec = ladder.given() ? Optional.of(ladder.spec(bits)) : Optional.empty();
        int bitsOrZero = bits != 0 ? bits : ladderSpec.map(LadderSpec::bits).orElse(0);
        Measurements m = MeasurementCsv.read(measurements, bitsOrZero);
        BoardFit.Settings settings = new BoardFit.Settings(resolution == null ? 0 : resolution,
                ladderSpec.map(s -> s.buffer().outMinVolts()).orElse(Double.NaN),
                ladderSpec.map(s -> s.buffer().outMaxVolts()).orElse(Double.NaN));
        FitReport fit = BoardFit.fit(m, settings);
        String boardName = board != null ? board.trim() : stem(measurements);
        if (boardName.isEmpty()) {
            throw new InputError("--board: the name is empty");
        }
        UnitProfile profile = UnitProfile.of(fit, boardName, day, ladderSpec.map(LadderSpec::describe).orElse(""));
        Path profileFile = out.resolve(fileName(boardName) + ".unit.toml");
        Path residualFile = out.resolve("fit-residuals.csv");
        AtomicFiles.writeString(profileFile, profile.toToml());
        AtomicFiles.writeString(residualFile, residualCsv(fit));
        List<String> files = List.of(profileFile.toString(), residualFile.toString());
        PrintWriter o = spec.commandLine().getOut();
        if (json) {
            o.print(Json.toJson(json(fit, profile, files)));
        } else if (!common.quiet) {
            o.print(text(fit, profile, resolution != null, ladderSpec, files));
        }
        o.flush();
        return 0;
    }

    private LocalDate day() {
        if (date == null) {
            return LocalDate.now();
        }
        try {
            return LocalDate.parse(date.trim());
        } catch (DateTimeParseException e) {
            throw new InputError("--date must look like 2026-05-01: " + date, e);
        }
    }

    /** The board name as a file name: letters, digits, '.', '-' and '_' kept, anything else a '-'. */
    static String fileName(String boardName) {
        String f = boardName.replaceAll("[^A-Za-z0-9._-]", "-");
        return f.startsWith(".") ? "board" + f : f;
    }

    private static String residualCsv(FitReport fit) {
        StringBuilder sb = new StringBuilder();
        CSVFormat format = CSVFormat.DEFAULT.builder().setRecordSeparator("\n")
                .setHeader("code", "binary", "readings", "mean_volts", "spread_volts", "model_volts",
                        "residual_volts", "score", "verdict").build();
        try (CSVPrinter p = new CSVPrinter(sb, format)) {
            for (var r : fit.residuals()) {
                p.printRecord(r.code(), MeasurementPlan.binary(r.code(), fit.bits()), r.readings(),
                        f9(r.meanVolts()), f9(r.spreadVolts()), f9(r.modelVolts()), f9(r.residualVolts()),
                        String.format(Locale.ROOT, "%.3f", r.score()), r.status().word());
            }
        } catch (IOException e) {
            throw new IllegalStateException("CSV to memory failed", e);
        }
        return sb.toString();
    }

    private static String f9(double v) {
        return String.format(Locale.ROOT, "%.9f", v);
    }

    /** The file name without its extension. */
    static String stem(Path p) {
        String f = p.getFileName() == null ? "board" : p.getFileName().toString();
        int dot = f.lastIndexOf('.');
        return dot > 0 ? f.substring(0, dot) : f;
    }

    /** The text report of a fit. */
    static String text(FitReport fit, UnitProfile p, boolean resolutionGiven, Optional<LadderSpec> s,
            List<String> files) {
        StringBuilder b = new StringBuilder();
        int readings = fit.readingCount();
        line(b, "Fit of %s: %d reading%s of %d codes, %d-bit board%s", fit.source(), readings,
                readings == 1 ? "" : "s", fit.codesMeasured(), fit.bits(), s.map(x -> " (" + x.describe() + ")")
                        .orElse(""));
        line(b, "  meter step %s (%s); repeat spread %s", fit.resolutionVolts() > 0 ? mv(fit.resolutionVolts())
                : "unknown", resolutionGiven ? "given" : "from the readings' last digits", fit.repeatSpreadVolts() > 0
                        ? mv(fit.repeatSpreadVolts()) + " rms" : "none (no code read twice)");
        line(b, "  so the readings resolve nothing below %s rms", mv(fit.floorVolts()));
        line(b, "");
        line(b, "Models");
        TextTable t = new TextTable("model", "parameters", "codes kept", "rms residual", "largest", "left out");
        for (ModelSummary m : List.of(fit.superposition(), fit.switchedLoad())) {
            if (m.fitted()) {
                t.row(m.key(), m.model().get().parameterCount(), m.keptReadings(), Double.isNaN(m.rmsVolts()) ? "-"
                        : mv(m.rmsVolts()), mv(m.maxAbsVolts()), m.outlierCodes().isEmpty() ? "-"
                        : codes(m.outlierCodes()));
            } else {
                t.row(m.key(), "-", "-", "-", "-", "not fitted");
            }
        }
        b.append(t.render("  "));
        if (!fit.switchedLoad().fitted()) {
            line(b, "  switched-load: %s", fit.switchedLoad().note());
        }
        wrap(b, "  chosen: ", fit.reason());
        line(b, "");
        bits(b, fit, s);
        line(b, "");
        residuals(b, fit);
        line(b, "");
        LevelTable levels = fit.levels();
        line(b, "Profile: board %s, %s; %s", p.board(), p.date(), fit.tableMeasured() ? "the readings of every"
                + " code" : "the " + fit.chosen().key() + " model at all " + levels.size() + " codes");
        line(b, "  levels %s .. %s%s", v(levels.minVolts()), v(levels.maxVolts()), levels.isMonotonic() ? ""
                : ", not monotonic: compensation uses every level in order of voltage");
        int worst = fit.leastCertainCode();
        double lsb = (levels.maxVolts() - levels.minVolts()) / (levels.size() - 1);
        line(b, "  uncertain by up to %s (1 sigma, %.2f LSB) at code %d", mv(fit.levelSigmas().get(worst)),
                fit.levelSigmas().get(worst) / lsb, worst);
        if (!fit.warnings().isEmpty()) {
            line(b, "");
            line(b, "Warnings");
            for (String w : fit.warnings()) {
                wrap(b, "  ! ", w);
            }
        }
        line(b, "");
        line(b, "Wrote %s", String.join(", ", files));
        line(b, "Next: rungtone build SOURCE --unit %s", files.get(0));
        return b.toString();
    }

    private static void bits(StringBuilder b, FitReport fit, Optional<LadderSpec> s) {
        BoardModel m = fit.chosen();
        boolean load = m instanceof SwitchedLoad;
        line(b, "Bits (%s): offset %s%s", m.key(), mv(m.offsetVolts()), load ? "" : String.format(Locale.ROOT,
                " ± %s", mv(fit.parameterSigmas().get(0))));
        TextTable t = load ? new TextTable("bit", "step alone", "load term", "model expected")
                : new TextTable("bit", "step", "± 1 sigma", "model expected");
        double[] expected = s.map(x -> x.levels().levels()).orElse(null);
        double[] d = load ? ((SwitchedLoad) m).loadTerms() : null;
        for (int i = 0; i < fit.bits(); i++) {
            String exp = expected == null ? "-" : mv(expected[1 << i] - expected[0]);
            if (load) {
                t.row(i, mv(m.stepVolts(i)), String.format(Locale.ROOT, "%+.3e", d[i]), exp);
            } else {
                t.row(i, mv(m.stepVolts(i)), mv(fit.parameterSigmas().get(i + 1)), exp);
            }
        }
        b.append(t.render("  "));
    }

    private static void residuals(StringBuilder b, FitReport fit) {
        List<CodeResidual> all = fit.residuals();
        List<CodeResidual> shown = new ArrayList<>();
        boolean every = all.size() <= 64;
        if (every) {
            shown.addAll(all);
        } else {
            List<CodeResidual> byMagnitude = new ArrayList<>(all);
            byMagnitude.sort((x, y) -> Double.compare(Math.abs(y.score()), Math.abs(x.score())));
            for (CodeResidual r : byMagnitude) {
                if (shown.size() < 16 || r.status() != CodeResidual.Status.OK && shown.size() < 60) {
                    shown.add(r);
                }
            }
            shown.sort((x, y) -> Integer.compare(x.code(), y.code()));
        }
        line(b, "Residuals%s", every ? "" : " (the largest; every code is in fit-residuals.csv)");
        TextTable t = new TextTable("code", "binary", "reads", "mean", "spread", "model", "residual", "score",
                "verdict");
        for (CodeResidual r : shown) {
            t.row(r.code(), MeasurementPlan.binary(r.code(), fit.bits()), r.readings(),
                    String.format(Locale.ROOT, "%.4f V", r.meanVolts()), r.readings() > 1 ? mv(r.spreadVolts()) : "",
                    String.format(Locale.ROOT, "%.4f V", r.modelVolts()), String.format(Locale.ROOT, "%+.2f mV",
                            1000 * r.residualVolts()), r.status() == CodeResidual.Status.UNCHECKED ? "-"
                            : String.format(Locale.ROOT, "%+.1f", r.score()), r.status().word());
        }
        b.append(t.render("  "));
    }

    /** The JSON report of a fit. */
    static Map<String, Object> json(FitReport fit, UnitProfile p, List<String> files) {
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("source", fit.source());
        root.put("bits", fit.bits());
        root.put("readings", fit.readingCount());
        root.put("codes_measured", fit.codesMeasured());
        root.put("unmeasured_codes", fit.unmeasuredCodes());
        root.put("resolution_v", fit.resolutionVolts());
        root.put("repeat_spread_v", fit.repeatSpreadVolts());
        root.put("floor_v", fit.floorVolts());
        List<Map<String, Object>> models = new ArrayList<>();
        for (ModelSummary m : List.of(fit.superposition(), fit.switchedLoad())) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("model", m.key());
            e.put("fitted", m.fitted());
            e.put("parameters", m.model().map(x -> x.parameters()).orElse(new double[0]));
            e.put("codes_kept", m.keptReadings());
            e.put("rms_residual_v", Double.isNaN(m.rmsVolts()) ? null : m.rmsVolts());
            e.put("largest_residual_v", m.fitted() ? m.maxAbsVolts() : null);
            e.put("outlier_codes", m.outlierCodes());
            e.put("note", m.note());
            models.add(e);
        }
        root.put("models", models);
        root.put("chosen", fit.chosen().key());
        root.put("reason", fit.reason());
        root.put("parameter_sigmas", fit.parameterSigmas());
        List<Map<String, Object>> res = new ArrayList<>();
        for (CodeResidual r : fit.residuals()) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("code", r.code());
            e.put("readings", r.readings());
            e.put("mean_v", r.meanVolts());
            e.put("spread_v", r.spreadVolts());
            e.put("model_v", r.modelVolts());
            e.put("residual_v", r.residualVolts());
            e.put("score", r.score());
            e.put("verdict", r.status().word());
            res.add(e);
        }
        root.put("residuals", res);
        root.put("outlier_codes", fit.outlierCodes());
        Map<String, Object> prof = new LinkedHashMap<>();
        prof.put("board", p.board());
        prof.put("date", p.date().toString());
        prof.put("table", p.tableSource().key());
        prof.put("levels_v", p.levels().levels());
        prof.put("level_sigmas_v", fit.levelSigmas());
        root.put("profile", prof);
        root.put("warnings", fit.warnings());
        root.put("files", files);
        return root;
    }

    /** Writes {@code text} after {@code first}, wrapped at 100 columns, continued under its first word. */
    private static void wrap(StringBuilder b, String first, String text) {
        String indent = " ".repeat(first.length());
        StringBuilder l = new StringBuilder(first);
        for (String word : text.split(" ")) {
            if (l.length() + 1 + word.length() > 100 && l.length() > first.length()) {
                b.append(l.toString().stripTrailing()).append('\n');
                l = new StringBuilder(indent);
            }
            if (l.length() > indent.length()) {
                l.append(' ');
            }
            l.append(word);
        }
        b.append(l.toString().stripTrailing()).append('\n');
    }

    private static void line(StringBuilder b, String format, Object... args) {
        b.append(String.format(Locale.ROOT, format, args).stripTrailing()).append('\n');
    }

    private static String codes(List<Integer> codes) {
        StringBuilder b = new StringBuilder();
        for (int i = 0; i < codes.size() && i < 6; i++) {
            b.append(i == 0 ? "" : ",").append(codes.get(i));
        }
        return codes.size() > 6 ? b + " +" + (codes.size() - 6) : b.toString();
    }

    private static String mv(double volts) {
        // below half the last digit: print 0.000 rather than -0.000
        return String.format(Locale.ROOT, "%.3f mV", Math.abs(volts) < 5e-7 ? 0.0 : 1000 * volts);
    }

    private static String v(double volts) {
        return String.format(Locale.ROOT, "%.4f V", volts);
    }
}
