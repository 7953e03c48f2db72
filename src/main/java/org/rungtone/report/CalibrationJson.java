package org.rungtone.report;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.rungtone.calibrate.BoardModel;
import org.rungtone.calibrate.BoardSimulation;
import org.rungtone.calibrate.CodeResidual;
import org.rungtone.calibrate.FitReport;
import org.rungtone.calibrate.MeasurementPlan;
import org.rungtone.calibrate.MeterAdvice;
import org.rungtone.calibrate.ModelSummary;
import org.rungtone.calibrate.PlannedCode;
import org.rungtone.calibrate.RecordingCalibration;
import org.rungtone.calibrate.RecordingResult;
import org.rungtone.calibrate.UnitFit;
import org.rungtone.calibrate.UnitProfile;
import org.rungtone.ladder.LevelTable;
import org.rungtone.ladder.Part;

/**
 * The calibrate reports for machines: a measurement plan ({@code calibrate-plan.schema.json}), a board's fit
 * and its unit profile from readings ({@code calibrate-fit.schema.json}) or from a recorded sweep
 * ({@code calibrate-listen.schema.json}), and a simulated board ({@code calibrate-simulate.schema.json}); paths
 * relative to the output folder.
 */
final class CalibrationJson {
    private CalibrationJson() {
    }

    /** A measurement plan: the ladder, the codes to measure, meter advice and the sweep program's facts. */
    static Map<String, Object> plan(CalibrationReport.Plan p, List<Path> files, Path outDir, String toolVersion) {
        MeasurementPlan plan = p.plan();
        LevelTable model = plan.expected();
        Map<String, Object> root = Json.header("calibrate-plan", toolVersion);
        root.put("ladder", LadderJson.description(p.ladder()));
        root.put("bits", plan.bits());
        root.put("every_code", plan.everyCode());
        root.put("lsb_v", p.lsbVolts());
        root.put("min_v", model.minVolts());
        root.put("max_v", model.maxVolts());
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
        for (MeterAdvice a : p.meters()) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("counts", a.counts());
            m.put("range_v", a.rangeVolts());
            m.put("step_v", a.stepVolts());
            m.put("steps_per_lsb", a.stepsPerLsb());
            m.put("fine_enough", a.fineEnough());
            meters.add(m);
        }
        root.put("meters", meters);
        root.put("hold_s", p.buttonPin().isPresent() ? null : p.holdSeconds());
        root.put("button_pin", p.buttonPin().orElse(null));
        root.put("sweep", p.sweep().map(e -> FirmwareJson.of(e.facts())).orElse(null));
        root.put("warnings", p.sweep().map(e -> e.warnings()).orElse(List.of()));
        root.put("meter", p.meter().map(m -> (Object) Map.of("counts", m.counts(), "autoranging", m.autoranging()))
                .orElse(null));
        root.put("recording", p.recording().map(r -> (Object) RecordingChecklist.json(r, model)).orElse(null));
        root.put("files", Json.paths(files, outDir));
        return root;
    }

    /** A board's fit and the unit profile made from it; {@code files} are the profile, then the residuals. */
    static Map<String, Object> fit(UnitFit.Result r, List<Path> files, Path outDir, String toolVersion) {
        Map<String, Object> root = Json.header("calibrate-fit", toolVersion);
        root.put("source", Json.path(r.request().measurements(), outDir));
        root.put("ladder", r.request().ladder().map(LadderJson::description).orElse(null));
        FitReport fit = r.fit();
        root.put("bits", fit.bits());
        root.put("readings", fit.readingCount());
        root.put("codes_measured", fit.codesMeasured());
        root.put("unmeasured_codes", fit.unmeasuredCodes());
        root.put("meter_step_v", fit.resolutionVolts() > 0 ? fit.resolutionVolts() : null);
        root.put("meter_step_given", r.request().resolutionVolts().isPresent());
        root.put("repeat_spread_rms_v", fit.repeatSpreadVolts());
        root.put("floor_rms_v", fit.floorVolts());
        boardFit(root, fit, r.profile(), files, outDir);
        return root;
    }

    /**
     * A board fitted from a recorded sweep ({@code calibrate-listen.schema.json}): what the recording's fit
     * found, then the board fit and profile as for readings; {@code files} are the profile, the residuals,
     * the steps and the plot.
     */
    static Map<String, Object> listen(RecordingCalibration.Result r, List<Path> files, Path outDir,
            String toolVersion) {
        RecordingResult f = r.recording();
        Map<String, Object> root = Json.header("calibrate-listen", toolVersion);
        root.put("source", Json.path(r.request().recording(), outDir));
        root.put("ladder", LadderJson.description(r.request().ladder()));
        root.put("bits", r.fit().bits());
        Map<String, Object> rec = new LinkedHashMap<>();
        rec.put("rate_hz", f.recording().sampleRateHz());
        rec.put("pcm_bits", f.recording().pcmBits() == 0 ? null : f.recording().pcmBits());
        rec.put("channel", f.recording().channel());
        rec.put("channels", f.recording().channels());
        rec.put("duration_s", f.recording().durationSeconds());
        rec.put("codes", f.sweep().planCodes().length);
        rec.put("hold_s", f.sweep().holdTicks() / 1000.0);
        rec.put("sweep_start_s", f.clock().startSample() / f.recording().sampleRateHz());
        rec.put("clock_mismatch_ppm", f.clock().mismatchPpm());
        rec.put("corner_hz", f.cornerHz());
        rec.put("hum_hz", f.humHz() > 0 ? f.humHz() : null);
        rec.put("inverted", !f.upright());
        rec.put("swing_fs", Math.abs(f.swing()));
        rec.put("noise_rms_fs", f.noiseRms());
        rec.put("median_level_sigma_fs", f.medianLevelSigma());
        rec.put("full_scale_reading_v", r.request().fullScaleVolts().isPresent()
                ? r.request().fullScaleVolts().getAsDouble() : null);
        rec.put("step_residuals_rms_fs", f.stepResiduals());
        rec.put("warnings", f.warnings());
        root.put("recording", rec);
        boardFit(root, r.fit(), r.profile(), files, outDir);
        return root;
    }

    /** The board fit's fields, from the models to the files, shared by fit and listen. */
    private static void boardFit(Map<String, Object> root, FitReport fit, UnitProfile p, List<Path> files,
            Path outDir) {
        List<Map<String, Object>> models = new ArrayList<>();
        for (ModelSummary m : List.of(fit.superposition(), fit.switchedLoad())) {
            models.add(model(m, fit.bits()));
        }
        root.put("models", models);
        root.put("chosen", fit.chosen().key());
        root.put("reason", fit.reason());
        root.put("parameter_sigmas", fit.parameterSigmas());
        root.put("residuals", residuals(fit));
        root.put("outlier_codes", fit.outlierCodes());
        Map<String, Object> prof = new LinkedHashMap<>();
        prof.put("board", p.board());
        prof.put("date", p.date().toString());
        prof.put("table", p.tableSource().key());
        prof.put("levels_v", p.levels().levels());
        prof.put("level_sigmas_v", fit.levelSigmas());
        prof.put("monotonic", p.levels().isMonotonic());
        root.put("profile", prof);
        root.put("warnings", fit.warnings());
        root.put("files", Json.paths(files, outDir));
    }

    private static Map<String, Object> model(ModelSummary m, int bits) {
        Map<String, Object> e = new LinkedHashMap<>();
        e.put("model", m.key());
        e.put("fitted", m.fitted());
        e.put("parameters", m.model().map(BoardModel::parameters).orElse(new double[0]));
        e.put("offset_v", m.model().map(x -> (Object) x.offsetVolts()).orElse(null));
        e.put("bit_steps_v", m.model().map(x -> {
            List<Double> steps = new ArrayList<>();
            for (int i = 0; i < bits; i++) {
                steps.add(x.stepVolts(i));
            }
            return (Object) steps;
        }).orElse(null));
        e.put("codes_kept", m.keptReadings());
        e.put("rms_residual_v", m.fitted() ? m.rmsVolts() : null);
        e.put("largest_residual_v", m.fitted() ? m.maxAbsVolts() : null);
        e.put("outlier_codes", m.outlierCodes());
        e.put("note", m.note());
        return e;
    }

    private static List<Map<String, Object>> residuals(FitReport fit) {
        List<Map<String, Object>> res = new ArrayList<>();
        for (CodeResidual r : fit.residuals()) {
            Map<String, Object> e = new LinkedHashMap<>();
            e.put("code", r.code());
            e.put("readings", r.readings());
            e.put("mean_v", r.meanVolts());
            e.put("std_dev_v", r.spreadVolts());
            e.put("model_v", r.modelVolts());
            e.put("residual_v", r.residualVolts());
            e.put("studentized_residual", r.status() == CodeResidual.Status.UNCHECKED ? null : r.score());
            e.put("verdict", r.status().word());
            res.add(e);
        }
        return res;
    }

    /** A simulated board: its drawn parts, how it was read, its true levels and the files written. */
    static Map<String, Object> simulation(BoardSimulation.Result r, List<Path> files, Path outDir,
            String toolVersion) {
        BoardSimulation.Request q = r.request();
        Map<String, Object> root = Json.header("calibrate-simulate", toolVersion);
        root.put("ladder", LadderJson.description(q.ladder()));
        root.put("seed", q.seed());
        List<Part> nominal = q.ladder().parts();
        List<Part> drawn = r.board().ladder().parts();
        List<Map<String, Object>> parts = new ArrayList<>();
        for (int i = 0; i < drawn.size(); i++) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("part", drawn.get(i).label());
            m.put("nominal_ohm", nominal.get(i).ohms());
            m.put("drawn_ohm", drawn.get(i).ohms());
            m.put("deviation_fraction", drawn.get(i).ohms() / nominal.get(i).ohms() - 1);
            parts.add(m);
        }
        root.put("parts", parts);
        root.put("codes_read", r.plan().codes().size());
        root.put("readings_per_code", q.meter().repeats());
        Map<String, Object> meter = new LinkedHashMap<>();
        meter.put("noise_rms_v", q.meter().noiseVolts());
        meter.put("step_v", q.meter().stepVolts());
        root.put("meter", meter);
        root.put("true_levels_v", r.board().levels().levels());
        root.put("files", Json.paths(files, outDir));
        return root;
    }
}
