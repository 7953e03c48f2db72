package org.rungtone.project;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.rungtone.analysis.AnalogModel;
import org.rungtone.analysis.AudioMetrics;
import org.rungtone.analysis.QualityReport;
import org.rungtone.analysis.SineFit;
import org.rungtone.analysis.ToneAnalysis;
import org.rungtone.analysis.ToneReport;
import org.rungtone.calibrate.OutputSpan;
import org.rungtone.condition.Conditioner;
import org.rungtone.condition.Conditioning;
import org.rungtone.condition.KaiserResampler;
import org.rungtone.condition.Resampler;
import org.rungtone.condition.TarsosResampler;
import org.rungtone.firmware.EmitResult;
import org.rungtone.firmware.FirmwareEmitter;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.firmware.FlashBudget;
import org.rungtone.firmware.SampleArrayEmitter;
import org.rungtone.firmware.SampleStorage;
import org.rungtone.firmware.Templates;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Units;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.quantize.ErrorFilter;
import org.rungtone.quantize.Quantizer;
import org.rungtone.report.AnalysisPlots;
import org.rungtone.report.BuildReport;
import org.rungtone.report.BuildSummary;
import org.rungtone.report.Json;
import org.rungtone.source.Signal;
import org.rungtone.source.WavWriter;

/**
 * Runs one {@link BuildPlan}: read the source, condition it, quantize onto the level table, measure every
 * ladder case, render the analog preview, emit C and write the reports. Each stage is a pure function; only
 * the firmware and report writers touch files.
 *
 * <p>Ladder cases: "ideal" is the source quantized onto the ideal ladder. With a board (modelled ladder or
 * measured unit profile) two more: "board, plain codes" plays the ideal codes on the board's real levels,
 * and "board, compensated" quantizes onto those real levels. The emitted codes are the compensated ones when
 * compensation is on, else the plain ones; the preview is of the emitted codes on the board.
 */
public final class Build {
    /** A reference whose 4-parameter sine fit leaves less than this residual (dB) counts as a single tone. */
    private static final double TONE_THRESHOLD_DB = 40;
    private static final int TONE_SAMPLES = 1 << 16;

    private final String toolVersion;
    private final OutputSpan span;

    /** A build that stamps {@code toolVersion} into its outputs; compensation uses the board's full span. */
    public Build(String toolVersion) {
        this(toolVersion, OutputSpan.FULL);
    }

    /** A build whose compensated quantization maps full scale onto {@code span} of the board's levels. */
    public Build(String toolVersion, OutputSpan span) {
        this.toolVersion = toolVersion;
        this.span = span;
    }

    /**
     * Runs the plan and writes every output into the plan's folder.
     *
     * @throws InputError for anything the user can fix; no output file is left half-written
     */
    public BuildSummary run(BuildPlan plan) {
        AtomicFiles.checkFolderUsable(plan.outDir());
        Stopwatch watch = new Stopwatch();
        Prepared prepared = prepare(plan, watch);
        Sources.Loaded loaded = prepared.loaded();
        double rate = prepared.rateHz();
        Conditioner.Conditioned conditioned = prepared.conditioned();
        Signal reference = conditioned.signal();
        if (reference.length() < 2) {
            throw InputError.inFile(plan.source(), "nothing is left to build after conditioning"
                    + " (all trimmed?)");
        }

        List<String> warnings = new ArrayList<>(loaded.warnings());
        warnings.addAll(conditioned.warnings());
        LevelTable ideal = LevelTable.ideal(plan.bits(), plan.fullScaleVolts());
        Quantizer.Quantized idealQ = quantizer(ideal, plan).apply(reference);
        Codes emitted = idealQ.codes();
        LevelTable played = ideal;
        long clipped = idealQ.clippedSamples();
        Optional<Codes> compensated = Optional.empty();
        double[] range = {ideal.minVolts(), ideal.maxVolts()};
        if (plan.board().isPresent()) {
            LevelTable board = plan.board().get();
            played = board;
            range = new double[] {board.minVolts(), board.maxVolts()};
            if (plan.compensate()) {
                range = span.volts(board, ideal);
                Quantizer.Quantized q = new Quantizer(board, range[0], range[1], plan.dither(), plan.shaping(),
                        plan.seed()).apply(reference);
                compensated = Optional.of(q.codes());
                emitted = q.codes();
                clipped = q.clippedSamples();
            }
        }
        watch.lap("quantize");
        if (clipped > 0) {
            warnings.add(clipped + " samples were beyond full scale and clipped");
        }

        double cutoff = plan.filter().kind() == org.rungtone.analysis.ReconstructionFilter.Kind.NONE
                ? rate / 2 : Math.min(rate / 2, plan.filter().cutoffHz());
        AudioMetrics metrics = AudioMetrics.of(reference, cutoff);
        List<QualityReport> quality = new ArrayList<>();
        quality.add(metrics.measure("ideal ladder", idealQ.codes(), ideal));
        if (plan.board().isPresent()) {
            quality.add(metrics.measure("board, plain codes", idealQ.codes(), played));
            compensated.ifPresent(c -> quality.add(metrics.measure("board, compensated", c, plan.board().get())));
        }
        QualityReport emittedQuality = quality.get(quality.size() - 1);
        Optional<Double> shapingGain = Optional.empty();
        if (plan.shaping().order() > 0) {
            Quantizer flat = new Quantizer(played, range[0], range[1], plan.dither(), ErrorFilter.NONE, plan.seed());
            double flatInBand = metrics.measure("flat", flat.apply(reference).codes(), played).inBandSnrDb();
            shapingGain = Optional.of(emittedQuality.inBandSnrDb() - flatInBand);
        }
        Optional<ToneReport> tone = toneOf(reference, emitted, played);
        watch.lap("analyze");

        AnalogModel model = new AnalogModel(plan.filter(), plan.previewRateHz());
        AnalogModel.Preview preview = model.render(emitted, played);
        watch.lap("preview");

        List<String> settings = settings(plan, loaded, conditioned, played, rate, range);
        List<Path> files = new ArrayList<>();
        List<String> firmwareLines = new ArrayList<>();
        long flash;
        if (plan.firmware().isPresent()) {
            FirmwareRequest.Builder fb = plan.firmware().get().toBuilder().name(plan.symbol())
                    .toolVersion(toolVersion).settings(settings);
            if (plan.loop().isPresent()) {
                int[] lp = plan.loop().get().samples(rate, emitted.length());
                fb.sound(plan.symbol(), emitted, lp[0], lp[1]);
            } else {
                fb.sound(plan.symbol(), emitted);
            }
            EmitResult er = FirmwareEmitter.emit(fb.build(), plan.outDir());
            files.addAll(er.files());
            firmwareLines.addAll(er.report());
            warnings.addAll(er.warnings());
            flash = er.flashBytes();
        } else {
            flash = (long) emitted.length() * (plan.bits() <= 8 ? 1 : 2);
            if (plan.flashBudgetBytes() > 0) {
                FlashBudget.check(flash, plan.flashBudgetBytes(), FlashBudget.alternatives(emitted.length(),
                        rate, plan.bits(), SampleStorage.UNPACKED, 0));
            }
            files.addAll(new SampleArrayEmitter(Templates.bundled()).emit(new SampleArrayEmitter.Request(
                    plan.symbol(), emitted, plan.flashQualifier(), toolVersion, settings), plan.outDir()));
        }
        watch.lap("emit");

        Path previewFile = plan.outDir().resolve("preview.wav");
        WavWriter.write(previewFile, preview.signal(), WavWriter.Format.PCM16);
        files.add(previewFile);
        Path errPlot = plan.outDir().resolve("error-spectrum.png");
        AnalysisPlots.writeErrorSpectrum(errPlot, metrics.errorSpectrum(AudioMetrics.volts(emitted, played)),
                cutoff);
        files.add(errPlot);
        if (tone.isPresent()) {
            Path specPlot = plan.outDir().resolve("spectrum.png");
            AnalysisPlots.writeSpectrum(specPlot, ToneAnalysis.spectrum(head(volts(emitted, played), rate)),
                    tone.get(), plan.bits());
            files.add(specPlot);
        }
        watch.lap("plots");

        Path txt = plan.outDir().resolve("report.txt");
        Path json = plan.outDir().resolve("report.json");
        files.add(txt);
        files.add(json);
        BuildSummary summary = new BuildSummary(toolVersion, plan.source(), loaded.layout(), plan.symbol(),
                plan.bits(), rate, emitted.length(), emitted.length() / rate, plan.dither().label(),
                plan.shaping().name(), plan.seed(), describe(plan, conditioned), conditioned.resampler(),
                played.origin(), clipped, quality, emittedQuality.label(), shapingGain, tone,
                new BuildSummary.PreviewInfo(plan.filter().describe(), plan.previewRateHz(),
                        preview.passbandTopHz(), preview.zohDroopDb(), preview.peak()),
                firmwareLines, flash, files, warnings, watch.laps());
        AtomicFiles.writeString(txt, BuildReport.text(summary));
        Json.write(json, BuildReport.json(summary));
        return summary;
    }

    /** The source's description (its samples dropped), the conditioned reference and the target rate. */
    private record Prepared(Sources.Loaded loaded, Conditioner.Conditioned conditioned, double rateHz) {
    }

    /**
     * Loads and conditions the source. The decoded source lives only inside this method, so its memory can be
     * reclaimed before quantizing a long clip.
     */
    private static Prepared prepare(BuildPlan plan, Stopwatch watch) {
        Sources.Loaded loaded = Sources.load(plan.source(), plan.channel(), plan.rateHz().orElse(Double.NaN),
                plan.seed());
        watch.lap("decode");
        double rate = plan.rateHz().orElse(Double.isNaN(loaded.preferredRateHz()) ? BuildPlan.DEFAULT_RATE_HZ
                : loaded.preferredRateHz());
        Conditioner.Conditioned conditioned;
        if (loaded.wavetable()) {
            // One cycle: its samples are the table as it is, played at any rate by the DDS engine. Only DC
            // removal and level apply; the codes are labelled with the playback rate.
            Signal table = Signal.wrap(loaded.signal().samples(), rate);
            Conditioning c = new Conditioning(plan.removeDc(), java.util.OptionalDouble.empty(), rate,
                    plan.gainDb(), plan.normalizeDbfs(), 0, 0);
            conditioned = new Conditioner(KaiserResampler.forBits(plan.bits())).apply(table, c);
        } else {
            Conditioning conditioning = new Conditioning(plan.removeDc(), plan.trimDbfs(), rate, plan.gainDb(),
                    plan.normalizeDbfs(), plan.fadeInSeconds(), plan.fadeOutSeconds());
            Resampler resampler = plan.resampler().equals("tarsos") ? new TarsosResampler()
                    : KaiserResampler.forBits(plan.bits());
            conditioned = new Conditioner(resampler).apply(loaded.signal(), conditioning);
        }
        watch.lap("condition");
        return new Prepared(new Sources.Loaded(Signal.wrap(new double[0], 1), loaded.layout(), loaded.warnings(),
                loaded.preferredRateHz(), loaded.wavetable()), conditioned, rate);
    }

    private static Quantizer quantizer(LevelTable table, BuildPlan plan) {
        return new Quantizer(table, table.minVolts(), table.maxVolts(), plan.dither(), plan.shaping(), plan.seed());
    }

    private List<String> settings(BuildPlan plan, Sources.Loaded loaded, Conditioner.Conditioned c,
            LevelTable played, double rate, double[] range) {
        return List.of(
                "name: " + plan.symbol(),
                "source: " + plan.source().getFileName() + " (" + loaded.layout() + ")",
                "conditioning: " + describe(plan, c),
                "target: " + plan.bits() + " bits at " + Units.format(rate, "Hz"),
                "dither: " + plan.dither().label() + ", shaping: " + plan.shaping().name() + ", seed: "
                        + plan.seed(),
                "levels: " + played.origin() + ", " + Units.format(played.minVolts(), "V") + " .. "
                        + Units.format(played.maxVolts(), "V")
                        + (plan.board().isPresent() ? (plan.compensate() ? ", compensated" + spanNote(range)
                                : ", plain codes") : ""));
    }

    private String spanNote(double[] range) {
        return span == OutputSpan.FULL ? "" : ", span " + span.key() + " " + Units.format(range[0], "V") + " .. "
                + Units.format(range[1], "V");
    }

    /** Single-tone figures when the reference is essentially one sine (IEEE Std 1241 sine fit). */
    private static Optional<ToneReport> toneOf(Signal reference, Codes codes, LevelTable table) {
        Signal ref = head(reference.unsafeSamples(), reference.sampleRateHz());
        if (ref.length() < 256) {
            return Optional.empty();
        }
        SineFit.Result fit;
        try {
            fit = SineFit.fit(ref.unsafeSamples(), ref.sampleRateHz());
        } catch (RuntimeException e) {
            return Optional.empty();
        }
        if (!(fit.sinadDb() > TONE_THRESHOLD_DB)) {
            return Optional.empty();
        }
        return Optional.of(ToneAnalysis.analyze(head(volts(codes, table), reference.sampleRateHz())));
    }

    private static double[] volts(Codes codes, LevelTable table) {
        return AudioMetrics.volts(codes, table);
    }

    private static Signal head(double[] x, double rate) {
        return Signal.wrap(Arrays.copyOf(x, Math.min(x.length, TONE_SAMPLES)), rate);
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

    /** Wall-clock milliseconds per stage, in order. */
    static final class Stopwatch {
        private final Map<String, Double> laps = new LinkedHashMap<>();
        private long last = System.nanoTime();

        void lap(String stage) {
            long now = System.nanoTime();
            laps.merge(stage, (now - last) / 1e6, Double::sum);
            last = now;
        }

        Map<String, Double> laps() {
            return laps;
        }
    }
}
