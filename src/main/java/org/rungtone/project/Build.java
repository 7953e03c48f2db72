package org.rungtone.project;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionException;
import java.util.OptionalLong;
import org.rungtone.analysis.AnalogModel;
import org.rungtone.analysis.AudioMetrics;
import org.rungtone.analysis.QualityReport;
import org.rungtone.analysis.SineFit;
import org.rungtone.analysis.Spectrum;
import org.rungtone.analysis.ToneAnalysis;
import org.rungtone.analysis.ToneReport;
import org.rungtone.calibrate.OutputSpan;
import org.rungtone.condition.Conditioner;
import org.rungtone.condition.Conditioning;
import org.rungtone.condition.KaiserResampler;
import org.rungtone.condition.Resampler;
import org.rungtone.firmware.EmitResult;
import org.rungtone.firmware.FirmwareEmitter;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.firmware.FlashBudget;
import org.rungtone.firmware.SampleArrayEmitter;
import org.rungtone.firmware.SampleStorage;
import org.rungtone.firmware.SoundClip;
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
import org.rungtone.report.HtmlReport;
import org.rungtone.report.Json;
import org.rungtone.report.Plots;
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
    /** A three-parameter fit at the spectral peak below this (dB) rules a single tone out at once. */
    private static final double TONE_SCREEN_DB = 12;
    private static final int TONE_SAMPLES = 1 << 16;
    private static final int TONE_PROBE = 1 << 13;

    private final String toolVersion;
    private final OutputSpan span;
    private final java.util.function.Consumer<String> progress;

    /** A build that stamps {@code toolVersion} into its outputs; compensation uses the board's full span. */
    public Build(String toolVersion) {
        this(toolVersion, OutputSpan.FULL, stage -> { });
    }

    /**
     * A build whose compensated quantization maps full scale onto {@code span} of the board's levels, and
     * that tells {@code progress} the name of every stage it finishes ("open", "condition", ...; a WAV file
     * is decoded during "condition").
     */
    public Build(String toolVersion, OutputSpan span, java.util.function.Consumer<String> progress) {
        this.toolVersion = toolVersion;
        this.span = span;
        this.progress = progress;
    }

    /**
     * One sound computed in memory: its codes and every figure, the preview and the plots' data, before any
     * file is written.
     *
     * @param plan the plan it came from
     * @param layout the source's description
     * @param rateHz the target rate
     * @param conditioned what conditioning did
     * @param emitted the codes the firmware holds
     * @param played the levels the board plays
     * @param quality figures per ladder case, emitted case last
     * @param shapingGainDb in-band gain of noise shaping, if used
     * @param tone single-tone figures, if the source is one sine
     * @param preview the analog preview
     * @param errorSpectrum the emitted case's error spectrum, for its plot (null when the error is zero)
     * @param toneSpectrum the output spectrum, for tones
     * @param inBandCutoffHz top of the in-band figures
     * @param clippedSamples samples beyond full scale
     * @param settings "key: value" lines for the C header comment
     * @param warnings what the user should know
     * @param stageMillis timings so far
     */
    public record Rendered(BuildPlan plan, String layout, double rateHz, Conditioner.Conditioned conditioned,
            Codes emitted, LevelTable played, List<QualityReport> quality, Optional<Double> shapingGainDb,
            Optional<ToneReport> tone, AnalogModel.Preview preview, Spectrum errorSpectrum,
            Optional<Spectrum> toneSpectrum, double inBandCutoffHz, long clippedSamples, List<String> settings,
            List<String> warnings, Map<String, Double> stageMillis) {
    }

    /**
     * Runs the plan and writes every output into the plan's folder.
     *
     * @throws InputError for anything the user can fix; no output file is left half-written
     */
    public BuildSummary run(BuildPlan plan) {
        AtomicFiles.checkFolderUsable(plan.outDir());
        CompletableFuture<Void> plotsReady = CompletableFuture.runAsync(Plots::warmUp);
        Rendered r = render(plan);
        Stopwatch watch = new Stopwatch(progress);
        List<Path> files = new ArrayList<>();
        List<String> firmwareLines = new ArrayList<>();
        List<String> warnings = new ArrayList<>(r.warnings());
        long flash;
        // Every check that can refuse the build runs before the first file is written.
        FirmwareEmitter.Rendered firmware = null;
        if (plan.firmware().player().isPresent()) {
            FirmwareRequest.Builder fb = plan.firmware().player().get().toBuilder().name(plan.symbol())
                    .toolVersion(toolVersion).settings(r.settings());
            fb.sound(clip(plan.symbol(), r));
            firmware = FirmwareEmitter.render(fb.build());
            flash = firmware.result().flashBytes();
        } else {
            flash = arrayBytes(r);
            if (plan.firmware().flashBudgetBytes() > 0) {
                FlashBudget.check(flash, plan.firmware().flashBudgetBytes(), FlashBudget.alternatives(r.emitted().length(),
                        r.rateHz(), plan.bits(), SampleStorage.UNPACKED, 0));
            }
        }
        // The preview and plots are written on another core while the C files are.
        CompletableFuture<List<Path>> assets = CompletableFuture.supplyAsync(() -> {
            join(plotsReady);
            return writeAssets(r, plan.outDir());
        });
        try {
            if (firmware != null) {
                EmitResult er = FirmwareEmitter.write(firmware, plan.outDir());
                files.addAll(er.files());
                firmwareLines.addAll(er.report());
                warnings.addAll(er.warnings());
            } else {
                files.addAll(emitArray(plan.symbol(), r, plan.outDir()));
            }
        } catch (RuntimeException e) {
            // Leave nothing behind: wait for the assets and remove what they wrote.
            try {
                for (Path p : join(assets)) {
                    java.nio.file.Files.deleteIfExists(p);
                }
            } catch (RuntimeException | java.io.IOException suppressed) {
                e.addSuppressed(suppressed);
            }
            throw e;
        }
        watch.lap("emit");
        files.addAll(join(assets));
        watch.lap("plots");
        Path txt = plan.outDir().resolve("report.txt");
        Path json = plan.outDir().resolve("report.json");
        Path html = plan.outDir().resolve("report.html");
        files.add(txt);
        files.add(json);
        files.add(html);
        Map<String, Double> laps = new LinkedHashMap<>(r.stageMillis());
        laps.putAll(watch.laps());
        BuildSummary summary = summary(r, firmwareLines, flash, files, warnings, laps);
        AtomicFiles.writeString(txt, BuildReport.text(summary));
        Json.write(json, BuildReport.json(summary));
        HtmlReport.write(html, new HtmlReport.Page(plan.symbol(), toolVersion, List.of(), List.of(summary),
                List.of(), flash, plan.firmware().flashBudgetBytes() > 0 ? OptionalLong.of(plan.firmware().flashBudgetBytes())
                        : OptionalLong.empty(), List.of(), Optional.empty()));
        return summary;
    }

    /** The firmware clip of a rendered sound, with its loop points. */
    public static SoundClip clip(String name, Rendered r) {
        if (r.plan().firmware().loop().isPresent()) {
            int[] lp = r.plan().firmware().loop().get().samples(r.rateHz(), r.emitted().length());
            return new SoundClip(name, r.emitted(), lp[0], lp[1]);
        }
        return SoundClip.of(name, r.emitted());
    }

    /** Flash bytes of a plain sample array. */
    public static long arrayBytes(Rendered r) {
        return (long) r.emitted().length() * (r.plan().bits() <= 8 ? 1 : 2);
    }

    /** Emits the plain sample array of a rendered sound. */
    public List<Path> emitArray(String symbol, Rendered r, Path dir) {
        return new SampleArrayEmitter(Templates.bundled()).emit(new SampleArrayEmitter.Request(symbol,
                r.emitted(), r.plan().firmware().flashQualifier(), toolVersion, r.settings()), dir);
    }

    /** The summary of a rendered sound with what emission added. */
    public BuildSummary summary(Rendered r, List<String> firmwareLines, long flash, List<Path> files,
            List<String> warnings, Map<String, Double> stageMillis) {
        BuildPlan plan = r.plan();
        return new BuildSummary(toolVersion, plan.source().file(), r.layout(), plan.symbol(), plan.bits(), r.rateHz(),
                r.emitted().length(), r.emitted().length() / r.rateHz(), plan.quantize().dither().label(),
                plan.quantize().shaping().name(), plan.quantize().seed(), describe(plan, r.conditioned()), r.conditioned().resampler(),
                r.played().origin(), r.clippedSamples(), r.quality(), r.quality().get(r.quality().size() - 1)
                        .label(), r.shapingGainDb(), r.tone(),
                new BuildSummary.PreviewInfo(plan.preview().filter().describe(), plan.preview().rateHz(),
                        r.preview().passbandTopHz(), r.preview().zohDroopDb(), r.preview().peak()),
                firmwareLines, flash, files, warnings, stageMillis);
    }

    /** Writes preview.wav and the plots of a rendered sound into {@code dir}. */
    public static List<Path> writeAssets(Rendered r, Path dir) {
        List<Path> files = new ArrayList<>();
        Path previewFile = dir.resolve("preview.wav");
        WavWriter.write(previewFile, r.preview().signal(), WavWriter.Format.PCM16);
        files.add(previewFile);
        if (r.errorSpectrum() != null) {
            Path errPlot = dir.resolve("error-spectrum.png");
            AnalysisPlots.writeErrorSpectrum(errPlot, r.errorSpectrum(), r.inBandCutoffHz());
            files.add(errPlot);
        }
        if (r.tone().isPresent() && r.toneSpectrum().isPresent()) {
            Path specPlot = dir.resolve("spectrum.png");
            AnalysisPlots.writeSpectrum(specPlot, r.toneSpectrum().get(), r.tone().get(), r.plan().bits());
            files.add(specPlot);
        }
        return files;
    }

    /**
     * Computes one sound without writing anything: load, condition, quantize for every ladder case, measure,
     * render the preview.
     *
     * @throws InputError for anything the user can fix
     */
    public Rendered render(BuildPlan plan) {
        Stopwatch watch = new Stopwatch(progress);
        Prepared prepared = prepare(plan, watch);
        double rate = prepared.rateHz();
        Conditioner.Conditioned conditioned = prepared.conditioned();
        Signal reference = conditioned.signal();
        if (reference.length() < 2) {
            throw InputError.inFile(plan.source().file(), "nothing is left to build after conditioning"
                    + " (all trimmed?)");
        }

        List<String> warnings = new ArrayList<>(prepared.warnings());
        warnings.addAll(conditioned.warnings());
        LevelTable ideal = LevelTable.ideal(plan.bits(), plan.preview().fullScaleVolts());
        Quantizer.Quantized idealQ = quantizer(ideal, plan).apply(reference);
        Codes emitted = idealQ.codes();
        LevelTable played = ideal;
        long clipped = idealQ.clippedSamples();
        Optional<Codes> compensated = Optional.empty();
        double[] range = {ideal.minVolts(), ideal.maxVolts()};
        if (plan.quantize().board().isPresent()) {
            LevelTable board = plan.quantize().board().get();
            played = board;
            range = new double[] {board.minVolts(), board.maxVolts()};
            if (plan.quantize().compensate()) {
                range = span.volts(board, ideal);
                Quantizer.Quantized q = new Quantizer(board, range[0], range[1], plan.quantize().dither(), plan.quantize().shaping(),
                        plan.quantize().seed()).apply(reference);
                compensated = Optional.of(q.codes());
                emitted = q.codes();
                clipped = q.clippedSamples();
            }
        }
        watch.lap("quantize");
        if (clipped > 0) {
            warnings.add(clipped + " samples were beyond full scale and clipped");
        }

        // The preview is independent of the figures: render it on another core meanwhile.
        final Codes emittedCodes = emitted;
        final LevelTable playedTable = played;
        int previewCodes = (int) Math.min(emitted.length(), Math.ceil(plan.preview().seconds() * rate));
        final Codes previewInput = previewCodes == emitted.length() ? emittedCodes : Codes.of(emitted.bits(),
                rate, Arrays.copyOf(emitted.unsafeCodes(), previewCodes));
        if (previewCodes < emitted.length()) {
            warnings.add(String.format(Locale.ROOT, "preview.wav holds the first %.0f s of %.0f s; set"
                    + " the preview length to all for the whole sound", previewCodes / rate, emitted.length() / rate));
        }
        AnalogModel model = new AnalogModel(plan.preview().filter(), plan.preview().rateHz());
        CompletableFuture<AnalogModel.Preview> previewJob = CompletableFuture.supplyAsync(
                () -> model.render(previewInput, playedTable));
        // in-band figures stop where the analog output's passband does: rate/2, or a lower filter cutoff
        double cutoff = model.passbandTopHz(rate);
        AudioMetrics metrics = AudioMetrics.of(reference, cutoff);
        List<QualityReport> quality = new ArrayList<>();
        Spectrum errorSpectrum;
        if (plan.quantize().board().isEmpty()) {
            AudioMetrics.Measured m = metrics.measureWithSpectrum("ideal ladder", idealQ.codes(), ideal);
            quality.add(m.report());
            errorSpectrum = m.errorSpectrum();
        } else {
            quality.add(metrics.measure("ideal ladder", idealQ.codes(), ideal));
            AudioMetrics.Measured plain = metrics.measureWithSpectrum("board, plain codes", idealQ.codes(),
                    played);
            quality.add(plain.report());
            errorSpectrum = plain.errorSpectrum();
            if (compensated.isPresent()) {
                AudioMetrics.Measured comp = metrics.measureWithSpectrum("board, compensated",
                        compensated.get(), played);
                quality.add(comp.report());
                errorSpectrum = comp.errorSpectrum();
            }
        }
        QualityReport emittedQuality = quality.get(quality.size() - 1);
        Optional<Double> shapingGain = Optional.empty();
        if (plan.quantize().shaping().order() > 0) {
            Quantizer flat = new Quantizer(played, range[0], range[1], plan.quantize().dither(), ErrorFilter.NONE, plan.quantize().seed());
            double flatInBand = metrics.measure("flat", flat.apply(reference).codes(), played).inBandSnrDb();
            shapingGain = Optional.of(emittedQuality.inBandSnrDb() - flatInBand);
        }
        Optional<ToneReport> tone = Optional.empty();
        Optional<Spectrum> toneSpectrum = Optional.empty();
        if (isTone(reference)) {
            Signal out = head(emitted, played, rate);
            toneSpectrum = Optional.of(ToneAnalysis.spectrum(out));
            tone = Optional.of(ToneAnalysis.analyze(out, toneSpectrum.get()));
        }
        watch.lap("analyze");
        AnalogModel.Preview preview = join(previewJob);
        watch.lap("preview");
        return new Rendered(plan, prepared.layout(), rate, conditioned, emitted, played, quality, shapingGain, tone,
                preview, errorSpectrum, toneSpectrum, cutoff, clipped,
                settings(plan, prepared.layout(), conditioned, played, rate, range), warnings, watch.laps());
    }

    /** The source's description, the conditioned reference and the target rate. */
    private record Prepared(String layout, List<String> warnings, Conditioner.Conditioned conditioned,
            double rateHz) {
    }

    /**
     * Opens and conditions the source. A WAV source is decoded block by block as the resampler reads it, so
     * a long clip is never held at its own rate.
     */
    private static Prepared prepare(BuildPlan plan, Stopwatch watch) {
        try (Sources.Opened opened = Sources.open(plan.source().file(), plan.source().channel(),
                plan.conditioning().rateHz().orElse(Double.NaN), plan.quantize().seed())) {
            watch.lap("open");
            double rate = plan.conditioning().rateHz().orElse(Double.isNaN(opened.preferredRateHz()) ? BuildPlan.DEFAULT_RATE_HZ
                    : opened.preferredRateHz());
            Conditioner.Conditioned conditioned;
            if (opened.wavetable()) {
                // One cycle: its samples are the table as it is, played at any rate by the DDS engine. Only DC
                // removal and level apply; the codes are labelled with the playback rate.
                double[] cycle = new double[opened.samples().length()];
                opened.samples().read(0, cycle, 0, cycle.length);
                Signal table = Signal.wrap(cycle, rate);
                ConditioningSettings cs = plan.conditioning();
                Conditioning c = new Conditioning(cs.removeDc(), java.util.OptionalDouble.empty(), rate, cs.gainDb(),
                        cs.normalizeDbfs(), 0, 0);
                conditioned = new Conditioner(KaiserResampler.forBits(plan.bits())).apply(table, c);
            } else {
                conditioned = new Conditioner(plan.conditioning().resampler().create(plan.bits()))
                        .apply(opened.samples(), plan.conditioning().at(rate));
            }
            watch.lap("condition");
            return new Prepared(opened.layout(), opened.warnings(), conditioned, rate);
        }
    }

    private static Quantizer quantizer(LevelTable table, BuildPlan plan) {
        return new Quantizer(table, table.minVolts(), table.maxVolts(), plan.quantize().dither(), plan.quantize().shaping(), plan.quantize().seed());
    }

    private List<String> settings(BuildPlan plan, String layout, Conditioner.Conditioned c,
            LevelTable played, double rate, double[] range) {
        return List.of(
                "name: " + plan.symbol(),
                "source: " + plan.source().file().getFileName() + " (" + layout + ")",
                "conditioning: " + describe(plan, c),
                "target: " + plan.bits() + " bits at " + Units.format(rate, "Hz"),
                "dither: " + plan.quantize().dither().label() + ", shaping: " + plan.quantize().shaping().name() + ", seed: "
                        + plan.quantize().seed(),
                "levels: " + played.origin() + ", " + Units.format(played.minVolts(), "V") + " .. "
                        + Units.format(played.maxVolts(), "V")
                        + (plan.quantize().board().isPresent() ? (plan.quantize().compensate() ? ", compensated" + spanNote(range)
                                : ", plain codes") : ""));
    }

    private String spanNote(double[] range) {
        return span == OutputSpan.FULL ? "" : ", span " + span.key() + " " + Units.format(range[0], "V") + " .. "
                + Units.format(range[1], "V");
    }

    /** True when the reference is essentially one sine (IEEE Std 1241 sine fit), so tone figures apply. */
    private static boolean isTone(Signal reference) {
        // A quick look at the first 8192 samples decides; only a tone pays for the full analysis.
        double[] probe = Arrays.copyOf(reference.unsafeSamples(), Math.min(reference.length(), TONE_PROBE));
        if (probe.length < 256) {
            return false;
        }
        SineFit.Result fit;
        try {
            double f0 = SineFit.estimateFrequencyHz(probe, reference.sampleRateHz());
            // A three-parameter fit at the spectral peak is one pass. For a tone, a frequency error of δ bins
            // leaves a residual of about (πδ)²/3 of its power: 35 dB below it at δ = 0.01, still 15 dB at
            // δ = 0.1 (analytic, from the linear phase drift across the record); programme material stays far
            // below the screen. Only candidates pay for the iterated four-parameter fit.
            if (!(SineFit.fitKnownFrequency(probe, reference.sampleRateHz(), f0).sinadDb() > TONE_SCREEN_DB)) {
                return false;
            }
            fit = SineFit.fit(probe, reference.sampleRateHz(), f0);
        } catch (RuntimeException e) {
            return false;
        }
        return fit.sinadDb() > TONE_THRESHOLD_DB;
    }

    /** Waits for a job, passing on the user's input errors and programming errors unwrapped. */
    static <T> T join(CompletableFuture<T> job) {
        try {
            return job.join();
        } catch (CompletionException e) {
            if (e.getCause() instanceof RuntimeException r) {
                throw r;
            }
            if (e.getCause() instanceof Error err) {
                throw err;
            }
            throw e;
        }
    }

    /**
     * The first {@value #TONE_SAMPLES} codes' levels in signal units: the table's span mapped onto full scale
     * [-1, 1].
     */
    private static Signal head(Codes codes, LevelTable table, double rate) {
        int[] c = codes.unsafeCodes();
        double[] v = new double[Math.min(c.length, TONE_SAMPLES)];
        double mid = 0.5 * (table.minVolts() + table.maxVolts());
        double half = 0.5 * (table.maxVolts() - table.minVolts());
        for (int i = 0; i < v.length; i++) {
            v[i] = (table.volts(c[i]) - mid) / half;
        }
        return Signal.wrap(v, rate);
    }

    private static String describe(BuildPlan plan, Conditioner.Conditioned c) {
        List<String> parts = new ArrayList<>();
        parts.add(plan.conditioning().removeDc() ? "DC removed" : "DC kept");
        if (c.trimmedStartSeconds() > 0 || c.trimmedEndSeconds() > 0) {
            parts.add(String.format(Locale.ROOT, "trimmed %.0f ms + %.0f ms", 1000 * c.trimmedStartSeconds(),
                    1000 * c.trimmedEndSeconds()));
        }
        if (plan.conditioning().normalizeDbfs().isPresent()) {
            parts.add(String.format(Locale.ROOT, "normalized to %.1f dBFS (%+.1f dB)",
                    plan.conditioning().normalizeDbfs().getAsDouble(), c.gainDb()));
        } else if (plan.conditioning().gainDb().isPresent()) {
            parts.add(String.format(Locale.ROOT, "gain %+.1f dB", c.gainDb()));
        }
        if (plan.conditioning().fadeInSeconds() > 0 || plan.conditioning().fadeOutSeconds() > 0) {
            parts.add(String.format(Locale.ROOT, "fades %.0f/%.0f ms", 1000 * plan.conditioning().fadeInSeconds(),
                    1000 * plan.conditioning().fadeOutSeconds()));
        }
        return String.join(", ", parts);
    }

    /** Wall-clock milliseconds per stage, in order. */
    static final class Stopwatch {
        private final Map<String, Double> laps = new LinkedHashMap<>();
        private final java.util.function.Consumer<String> listener;
        private long last = System.nanoTime();

        Stopwatch(java.util.function.Consumer<String> listener) {
            this.listener = listener;
        }

        void lap(String stage) {
            long now = System.nanoTime();
            laps.merge(stage, (now - last) / 1e6, Double::sum);
            last = now;
            listener.accept(stage);
        }

        Map<String, Double> laps() {
            return laps;
        }
    }
}
