package org.rungtone.report;

import static org.rungtone.report.TextLines.line;
import static org.rungtone.report.TextLines.wrap;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.rungtone.calibrate.BoardModel;
import org.rungtone.calibrate.CodeResidual;
import org.rungtone.calibrate.FitReport;
import org.rungtone.calibrate.MeasurementPlan;
import org.rungtone.calibrate.ModelSummary;
import org.rungtone.calibrate.SwitchedLoad;
import org.rungtone.calibrate.UnitFit;
import org.rungtone.calibrate.UnitProfile;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;

/**
 * Renders a board's fit and the unit profile made from it as text for people (readings, models, bits,
 * residuals, profile, warnings) and as JSON for machines.
 */
public final class UnitFitReport {
    /** Up to this many residuals the text lists every code; above it, the largest. */
    private static final int EVERY_RESIDUAL_MAX = 64;

    private UnitFitReport() {
    }

    /** The text report of a fit; {@code files} are the profile, then the residuals. */
    public static String text(UnitFit.Result r, List<Path> files) {
        StringBuilder b = new StringBuilder();
        FitReport fit = r.fit();
        Optional<LadderSpec> s = r.request().ladder();
        int readings = fit.readingCount();
        line(b, "Fit of %s: %d reading%s of %d codes, %d-bit board%s", fit.source(), readings,
                readings == 1 ? "" : "s", fit.codesMeasured(), fit.bits(), s.map(x -> " (" + x.describe() + ")")
                        .orElse(""));
        line(b, "  meter step %s (%s); repeat spread %s", fit.resolutionVolts() > 0 ? mv(fit.resolutionVolts())
                : "unknown", r.request().resolutionVolts().isPresent() ? "given" : "from the readings' last digits",
                fit.repeatSpreadVolts() > 0 ? mv(fit.repeatSpreadVolts()) + " rms" : "none (no code read twice)");
        line(b, "  so the readings resolve nothing below %s rms", mv(fit.floorVolts()));
        sections(b, fit, s, r.profile(), files);
        return b.toString();
    }

    /** The sections after the readings' summary: models, bits, residuals, profile, warnings, files. */
    static void sections(StringBuilder b, FitReport fit, Optional<LadderSpec> s, UnitProfile profile,
            List<Path> files) {
        line(b, "");
        models(b, fit);
        line(b, "");
        bits(b, fit, s);
        line(b, "");
        residuals(b, fit);
        line(b, "");
        profile(b, fit, profile);
        if (!fit.warnings().isEmpty()) {
            line(b, "");
            line(b, "Warnings");
            for (String w : fit.warnings()) {
                wrap(b, "  ! ", w);
            }
        }
        line(b, "");
        line(b, "Wrote %s", CalibrationFiles.joined(files));
        line(b, "Next: rungtone build SOURCE --unit %s", files.get(0));
    }

    private static void models(StringBuilder b, FitReport fit) {
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
        boolean every = all.size() <= EVERY_RESIDUAL_MAX;
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

    private static void profile(StringBuilder b, FitReport fit, UnitProfile p) {
        LevelTable levels = fit.levels();
        line(b, "Profile: board %s, %s; %s", p.board(), p.date(), fit.tableMeasured() ? "the readings of every"
                + " code" : "the " + fit.chosen().key() + " model at all " + levels.size() + " codes");
        line(b, "  levels %s .. %s%s", v(levels.minVolts()), v(levels.maxVolts()), levels.isMonotonic() ? ""
                : ", not monotonic: compensation uses every level in order of voltage");
        int worst = fit.leastCertainCode();
        double lsb = (levels.maxVolts() - levels.minVolts()) / (levels.size() - 1);
        line(b, "  uncertain by up to %s (1 sigma, %.2f LSB) at code %d", mv(fit.levelSigmas().get(worst)),
                fit.levelSigmas().get(worst) / lsb, worst);
    }

    /**
     * The JSON report of a fit ({@code docs/schema/calibrate-fit.schema.json}); {@code files} are the profile,
     * then the residuals; paths are relative to {@code outDir}.
     */
    public static Map<String, Object> json(UnitFit.Result r, List<Path> files, Path outDir, String toolVersion) {
        return CalibrationJson.fit(r, files, outDir, toolVersion);
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
