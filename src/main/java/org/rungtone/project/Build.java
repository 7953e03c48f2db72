package org.rungtone.project;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.rungtone.analysis.ErrorMetrics;
import org.rungtone.condition.Conditioner;
import org.rungtone.condition.Conditioning;
import org.rungtone.condition.KaiserResampler;
import org.rungtone.condition.Resampler;
import org.rungtone.condition.TarsosResampler;
import org.rungtone.firmware.SampleArrayEmitter;
import org.rungtone.firmware.Templates;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Units;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.quantize.Quantizer;
import org.rungtone.report.BuildReport;
import org.rungtone.report.BuildSummary;
import org.rungtone.report.Json;
import org.rungtone.source.Signal;

/**
 * Runs one {@link BuildPlan}: read the source, condition it, quantize onto the level table, measure, emit C
 * and write the reports. Each stage is a pure function; only the firmware and report writers touch files.
 */
public final class Build {
    private final String toolVersion;

    /** A build that stamps {@code toolVersion} into its outputs. */
    public Build(String toolVersion) {
        this.toolVersion = toolVersion;
    }

    /**
     * Runs the plan and writes every output into the plan's folder.
     *
     * @throws InputError for anything the user can fix; no output file is left half-written
     */
    public BuildSummary run(BuildPlan plan) {
        AtomicFiles.checkFolderUsable(plan.outDir());
        Stopwatch watch = new Stopwatch();
        Sources.Loaded loaded = Sources.load(plan.source(), plan.channel(), plan.rateHz().orElse(Double.NaN),
                plan.seed());
        watch.lap("decode");
        double rate = plan.rateHz().orElse(BuildPlan.DEFAULT_RATE_HZ);
        Conditioning conditioning = new Conditioning(plan.removeDc(), plan.trimDbfs(), rate, plan.gainDb(),
                plan.normalizeDbfs(), plan.fadeInSeconds(), plan.fadeOutSeconds());
        Resampler resampler = plan.resampler().equals("tarsos") ? new TarsosResampler()
                : KaiserResampler.forBits(plan.bits());
        Conditioner.Conditioned conditioned = new Conditioner(resampler).apply(loaded.signal(), conditioning);
        Signal reference = conditioned.signal();
        watch.lap("condition");
        if (reference.length() == 0) {
            throw InputError.inFile(plan.source(), "nothing is left to build after conditioning"
                    + " (all trimmed?)");
        }
        LevelTable table = LevelTable.ideal(plan.bits(), plan.fullScaleVolts());
        Quantizer quantizer = new Quantizer(table, table.minVolts(), table.maxVolts(), plan.dither(),
                plan.shaping(), plan.seed());
        Quantizer.Quantized q = quantizer.apply(reference);
        Codes codes = q.codes();
        watch.lap("quantize");
        double snr = snrDb(reference, codes, table);
        watch.lap("analyze");

        List<String> warnings = new ArrayList<>(loaded.warnings());
        warnings.addAll(conditioned.warnings());
        if (q.clippedSamples() > 0) {
            warnings.add(q.clippedSamples() + " samples were beyond full scale and clipped");
        }
        String condText = describe(plan, conditioned);
        List<String> settings = List.of(
                "source: " + plan.source().getFileName() + " (" + loaded.layout() + ")",
                "conditioning: " + condText,
                "target: " + plan.bits() + " bits at " + Units.format(rate, "Hz"),
                "dither: " + plan.dither().label() + ", shaping: " + plan.shaping().name() + ", seed: "
                        + plan.seed(),
                "levels: " + table.origin() + ", " + Units.format(table.minVolts(), "V") + " .. "
                        + Units.format(table.maxVolts(), "V"));
        List<Path> files = new ArrayList<>(new SampleArrayEmitter(Templates.bundled()).emit(
                new SampleArrayEmitter.Request(plan.symbol(), codes, plan.flashQualifier(), toolVersion,
                        settings), plan.outDir()));
        watch.lap("emit");
        long flash = (long) codes.length() * (plan.bits() <= 8 ? 1 : 2);
        Path txt = plan.outDir().resolve("report.txt");
        Path json = plan.outDir().resolve("report.json");
        files.add(txt);
        files.add(json);
        BuildSummary summary = new BuildSummary(toolVersion, plan.source(), loaded.layout(), plan.symbol(),
                plan.bits(), rate, codes.length(), codes.length() / rate, plan.dither().label(),
                plan.shaping().name(), plan.seed(), condText, conditioned.resampler(), table.origin(),
                q.clippedSamples(), snr, flash, files, warnings, watch.laps());
        AtomicFiles.writeString(txt, BuildReport.text(summary));
        Json.write(json, BuildReport.json(summary));
        return summary;
    }

    /** Wall-clock milliseconds per stage, in order. */
    static final class Stopwatch {
        private final java.util.LinkedHashMap<String, Double> laps = new java.util.LinkedHashMap<>();
        private long last = System.nanoTime();

        void lap(String stage) {
            long now = System.nanoTime();
            laps.merge(stage, (now - last) / 1e6, Double::sum);
            last = now;
        }

        java.util.Map<String, Double> laps() {
            return laps;
        }
    }

    /** Aligned error SNR of the codes' levels, back in signal units, against the reference. */
    static double snrDb(Signal reference, Codes codes, LevelTable table) {
        int[] c = codes.unsafeCodes();
        double[] out = new double[c.length];
        for (int i = 0; i < c.length; i++) {
            out[i] = table.volts(c[i]);
        }
        return ErrorMetrics.alignedSnrDb(reference.unsafeSamples(), out);
    }

    private static String describe(BuildPlan plan, Conditioner.Conditioned c) {
        List<String> parts = new ArrayList<>();
        parts.add(plan.removeDc() ? "DC removed" : "DC kept");
        if (c.trimmedStartSeconds() > 0 || c.trimmedEndSeconds() > 0) {
            parts.add(String.format(Locale.ROOT, "trimmed %.0f ms + %.0f ms", 1000 * c.trimmedStartSeconds(),
                    1000 * c.trimmedEndSeconds()));
        }
        if (plan.normalizeDbfs().isPresent()) {
            parts.add(String.format(Locale.ROOT, "normalized to %.1f dBFS (%+.1f dB)",
                    plan.normalizeDbfs().getAsDouble(), c.gainDb()));
        } else if (plan.gainDb().isPresent()) {
            parts.add(String.format(Locale.ROOT, "gain %+.1f dB", c.gainDb()));
        }
        if (plan.fadeInSeconds() > 0 || plan.fadeOutSeconds() > 0) {
            parts.add(String.format(Locale.ROOT, "fades %.0f/%.0f ms", 1000 * plan.fadeInSeconds(),
                    1000 * plan.fadeOutSeconds()));
        }
        return String.join(", ", parts);
    }
}
