package org.rungtone.report;

import static org.rungtone.report.TextLines.line;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.rungtone.calibrate.Recording;
import org.rungtone.calibrate.RecordingCalibration;
import org.rungtone.calibrate.RecordingResult;
import org.rungtone.calibrate.RecordingSweep;

/**
 * Renders the fit of a recorded sweep: where the sweep is, the clocks, the input's corner, hum, level and
 * noise, the steps that fit worst, then the board fit and profile as {@link UnitFitReport} does; as text, as
 * JSON, as a CSV of every step and as a plot of the recording with the fitted model.
 */
public final class RecordingReport {
    /** Steps listed in the text, the worst first. */
    private static final int WORST_STEPS = 8;

    private RecordingReport() {
    }

    /** The text report; {@code files} are the profile, the residuals, the steps and the plot. */
    public static String text(RecordingCalibration.Result r, List<Path> files) {
        StringBuilder b = new StringBuilder();
        RecordingResult f = r.recording();
        Recording rec = f.recording();
        RecordingSweep sweep = f.sweep();
        line(b, "Recording %s: %s, %.0f Hz, channel %d of %d, %.2f s", rec.source(), rec.pcmBits() == 0 ? "float"
                : "PCM " + rec.pcmBits() + "-bit", rec.sampleRateHz(), rec.channel(), rec.channels(),
                rec.durationSeconds());
        double start = f.clock().startSample() / rec.sampleRateHz();
        line(b, "  sweep from %.3f s to %.3f s: %d codes held %d ms (and %d returns to code 0) between its patterns",
                start, start + sweep.durationSeconds() * (1 + f.clock().mismatchPpm() * 1e-6), sweep.planCodes().length,
                sweep.holdTicks(), sweep.returns());
        line(b, "  clocks: a board tick lasts %+.1f ppm against the sound card's millisecond (%d edges timed,"
                + " %.2f samples rms)", f.clock().mismatchPpm(), f.clock().edgesTimed(), f.clock().edgeRmsSamples());
        line(b, "  input: high-pass corner %.3f Hz (time constant %.1f ms), %s", f.cornerHz(),
                1000 / (2 * Math.PI * f.cornerHz()), f.upright() ? "upright" : "inverted (taken into account)");
        line(b, "  hum: %s", f.humHz() > 0 ? String.format(Locale.ROOT, "%.3f Hz and two harmonics, fitted and"
                + " removed", f.humHz()) : "none found");
        double lsb = Math.abs(f.swing()) / ((1 << sweep.bits()) - 1);
        line(b, "  full swing %s; noise %s rms per sample; levels resolved to %.3f LSB (median, 1 sigma)",
                dbfs(Math.abs(f.swing())), dbfs(f.noiseRms()), f.medianLevelSigma() / lsb);
        line(b, "  volts: code 0 at the model's %.4f V, all ones at %s", r.fit().levels().volts(0),
                r.request().fullScaleVolts().isPresent() ? String.format(Locale.ROOT, "the reading of %.4f V",
                        r.request().fullScaleVolts().getAsDouble()) : String.format(Locale.ROOT,
                        "the model's %.4f V (give --full-scale-reading for the board's own)",
                        r.request().ladder().levels().maxVolts()));
        for (String w : f.warnings()) {
            TextLines.wrap(b, "  warning: ", w);
        }
        line(b, "");
        worstSteps(b, f, lsb);
        UnitFitReport.sections(b, r.fit(), Optional.of(r.request().ladder()), r.profile(), files);
        return b.toString();
    }

    private static void worstSteps(StringBuilder b, RecordingResult f, double lsb) {
        double[] res = f.stepResiduals();
        int[] codes = f.sweep().stepCodes();
        Integer[] order = new Integer[res.length];
        for (int i = 0; i < order.length; i++) {
            order[i] = i;
        }
        Arrays.sort(order, (x, y) -> Double.compare(res[y], res[x]));
        line(b, "Steps with the largest residuals (every step is in %s)", CalibrationFiles.RECORDING_STEPS_CSV);
        TextTable t = new TextTable("step", "code", "part", "rms residual", "in LSB");
        for (int i = 0; i < Math.min(WORST_STEPS, order.length); i++) {
            int k = order[i];
            t.row(k, codes[k], f.sweep().part(k).word(), dbfs(res[k]), String.format(Locale.ROOT, "%.3f",
                    res[k] / lsb));
        }
        b.append(t.render("  "));
    }

    /** Every step: its code, part, start time, relative level and rms residual. */
    static String stepsCsv(RecordingResult f) {
        StringBuilder sb = new StringBuilder();
        RecordingSweep sweep = f.sweep();
        int[] codes = sweep.stepCodes();
        long[] ticks = sweep.stepStartTicks();
        double[] rel = f.relativeLevels();
        double[] res = f.stepResiduals();
        double rate = f.recording().sampleRateHz();
        CSVFormat format = CSVFormat.DEFAULT.builder().setRecordSeparator("\n").setHeader("step", "code", "part",
                "start_seconds", "relative_level", "residual_rms").build();
        try (CSVPrinter p = new CSVPrinter(sb, format)) {
            for (int k = 0; k < codes.length; k++) {
                RecordingSweep.Part part = sweep.part(k);
                double level = part == RecordingSweep.Part.PLAN ? rel[sweep.planIndex(k)] : codes[k] == 0 ? 0 : 1;
                p.printRecord(k, codes[k], part.word(), String.format(Locale.ROOT, "%.6f", f.clock().sampleAt(ticks[k])
                        / rate), String.format(Locale.ROOT, "%.9f", level), String.format(Locale.ROOT, "%.3e", res[k]));
            }
        } catch (IOException e) {
            throw new IllegalStateException("CSV to memory failed", e);
        }
        return sb.toString();
    }

    /** The recording with the fitted model and the input staircase it came from. */
    static Plots.Chart chart(RecordingResult f) {
        RecordingResult.Trace t = f.trace();
        List<Plots.Series> series = new ArrayList<>();
        series.add(new Plots.Series("recording (1 ms means)", t.seconds(), t.recorded(), Plots.Style.LINE));
        series.add(new Plots.Series("fitted model", t.seconds(), t.model(), Plots.Style.LINE));
        series.add(new Plots.Series("input staircase (levels times gain)", t.seconds(), t.input(),
                Plots.Style.DASHED));
        String title = String.format(Locale.ROOT, "Recorded sweep and fit: corner %.2f Hz, clocks %+.1f ppm",
                f.cornerHz(), f.clock().mismatchPpm());
        return Plots.Chart.of(title, "time (s)", "level (full scale)", series, List.of(), String.format(Locale.ROOT,
                "The recording of the sweep in 1 ms means with the model fitted to it (input corner %.2f Hz, clocks"
                + " %+.1f ppm apart) and the staircase of levels it came from.", f.cornerHz(),
                f.clock().mismatchPpm()));
    }

    /**
     * The JSON report ({@code docs/schema/calibrate-listen.schema.json}); paths are relative to
     * {@code outDir}.
     */
    public static Map<String, Object> json(RecordingCalibration.Result r, List<Path> files, Path outDir,
            String toolVersion) {
        return CalibrationJson.listen(r, files, outDir, toolVersion);
    }

    private static String dbfs(double v) {
        return String.format(Locale.ROOT, "%.1f dBFS", 20 * Math.log10(Math.max(v, 1e-12)));
    }
}
