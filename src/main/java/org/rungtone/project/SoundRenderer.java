package org.rungtone.project;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.CompletableFuture;
import org.rungtone.analysis.AnalogModel;
import org.rungtone.analysis.CodeUse;
import org.rungtone.analysis.ListenerMetrics;
import org.rungtone.analysis.ListenerReport;
import org.rungtone.analysis.QualityReport;
import org.rungtone.analysis.SeamlessLoop;
import org.rungtone.analysis.SineFit;
import org.rungtone.analysis.Spectrum;
import org.rungtone.analysis.ToneAnalysis;
import org.rungtone.analysis.ToneReport;
import org.rungtone.calibrate.OutputSpan;
import org.rungtone.codec.TreadStream;
import org.rungtone.condition.Conditioner;
import org.rungtone.condition.Conditioning;
import org.rungtone.condition.KaiserResampler;
import org.rungtone.firmware.CNames;
import org.rungtone.internal.FileNames;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Units;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.quantize.Quantizer;
import org.rungtone.report.SourceFacts;
import org.rungtone.source.Signal;

/**
 * Computes one sound in memory, writing nothing: read the source, condition it, quantize onto every ladder
 * case, measure, render the analog preview.
 *
 * <p>Ladder cases: "ideal" is the source quantized onto the ideal ladder. With a board (modelled ladder or
 * measured unit profile) two more: "board, plain codes" plays the ideal codes on the board's real levels,
 * and "board, compensated" quantizes onto those real levels. The emitted codes are the compensated ones when
 * compensation is on, else the plain ones; the preview is of the emitted codes on the board.
 *
 * <p>Figures: every case gets the quantization-only figures (its codes on its levels against the
 * conditioned source at the target rate) and how its codes use the range; the emitted case also gets what
 * the listener hears ({@link ListenerMetrics}): the preview against the source as supplied, read again
 * from the file (at most its first minute) with the conditioning's trim and fades.
 */
public final class SoundRenderer {

    /** A reference whose 4-parameter sine fit leaves less than this residual (dB) counts as a single tone. */
    private static final double TONE_THRESHOLD_DB = 40;
    /** A three-parameter fit at the spectral peak below this (dB) rules a single tone out at once. */
    private static final double TONE_SCREEN_DB = 12;
    private static final int TONE_SAMPLES = 1 << 16;
    private static final int TONE_PROBE = 1 << 13;


    private final OutputSpan span;
    private final BuildProgress progress;

    /**
     * A renderer whose compensated quantization maps full scale onto {@code span} of the board's levels, and
     * that tells {@code progress} every stage it finishes ("open done", "condition done", ...) and, while it
     * reads the source, how much of it it has read.
     */
    public SoundRenderer(OutputSpan span, BuildProgress progress) {
        this.span = span;
        this.progress = progress;
    }

    /**
     * One sound computed in memory: its codes and every figure, the preview and the plots' data, before any
     * file is written.
     *
     * @param plan the plan it came from
     * @param layout the source's description
     * @param source what was read, as values
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
     * @param autoLoop the loop found in the sound, when its loop is auto (the codes hold its crossfades)
     * @param stream the Tread stream the emitted codes decode from, for a Tread store
     */
    public record Rendered(BuildPlan plan, String layout, SourceFacts source, double rateHz,
            Conditioner.Conditioned conditioned, Codes emitted, LevelTable played, List<QualityReport> quality,
            Optional<Double> shapingGainDb, Optional<ToneReport> tone, AnalogModel.Preview preview,
            Spectrum errorSpectrum, Optional<Spectrum> toneSpectrum, double inBandCutoffHz, long clippedSamples,
            List<String> settings, List<String> warnings, Map<String, Double> stageMillis,
            Optional<SeamlessLoop> autoLoop, Optional<TreadStream> stream) {
    }

    /** The codes of every ladder case and how they use the range. */
    record Cases(Quantizer.Quantized ideal, LevelTable idealTable, Codes emitted, LevelTable played,
            long clipped, Optional<Codes> compensated, double[] range, CodeUse idealUse,
            Optional<CodeUse> compensatedUse, Optional<TreadStream> stream) {

        /** How the emitted codes use the range. */
        CodeUse emittedUse() {
            return compensatedUse.orElse(idealUse);
        }
    }

    /**
     * Computes one sound without writing anything.
     *
     * @throws InputError for anything the user can fix
     */
    public Rendered render(BuildPlan plan) {
        Stopwatch watch = new Stopwatch(progress);
        AnalogModel model = new AnalogModel(plan.preview().filter(), plan.preview().rateHz());
        Prepared prepared = prepare(plan, model, watch);
        double rate = prepared.rateHz();
        Conditioner.Conditioned conditioned = prepared.conditioned();
        Signal reference = conditioned.signal();
        if (reference.length() < 2) {
            throw InputError.inFile(plan.source().file(), tooShort(plan, reference.length()));
        }
        List<String> warnings = new ArrayList<>(prepared.warnings());
        CNames.rewritten(plan.source().name()).ifPresent(warnings::add);
        warnings.addAll(conditioned.warnings());
        Optional<AutoLoop.Placed> loop = AutoLoop.place(plan, reference);
        loop.flatMap(AutoLoop.Placed::shortened).ifPresent(w -> warnings.add(w.text()));
        reference = loop.map(AutoLoop.Placed::signal).orElse(reference);
        Coding coding = Coding.of(plan, rate, model.inBandTopHz(rate));
        Cases cases = quantize(plan, reference, coding);
        watch.lap(BuildStage.QUANTIZE);
        if (cases.clipped() > 0) {
            warnings.add(cases.clipped() + " samples were beyond full scale and clipped");
        }
        CodeUse use = cases.emittedUse();
        if (use.shapingOverloads()) {
            warnings.add(String.format(Locale.ROOT, "noise shaping overloaded the quantizer on %.2f %% of the"
                    + " samples (its input went past the end levels), which adds distortion; lower the level",
                    100 * use.overloadFraction()));
        }
        // The preview is independent of the figures: render it on another core meanwhile. With an automatic
        // loop it plays the loop several times, so the listener figures render the stored codes on their own.
        CompletableFuture<AnalogModel.Preview> previewJob = startPreview(plan, AutoLoop.previewed(cases.emitted(),
                loop), cases.played(), model, rate, warnings);
        // What the listener gets follows the preview on the same core.
        CompletableFuture<Optional<ListenerReport>> listenerJob = previewJob.thenApply(p -> prepared.listener()
                .filter(l -> l.measurable(p.signal().length())).map(l -> loop.isEmpty() ? l.measure(p.signal())
                        : l.measure(cases.emitted(), cases.played())));
        // in-band figures stop where the analog output's passband does (rate/2, or a lower filter cutoff),
        // and at 20 kHz: the one definition the survey uses too
        double cutoff = model.inBandTopHz(rate);
        SoundFigures.Figures figures = SoundFigures.of(plan, prepared.wavetable(), reference, cases, cutoff,
                warnings, coding);
        Optional<ToneReport> tone = Optional.empty();
        Optional<Spectrum> toneSpectrum = Optional.empty();
        if (isTone(reference)) {
            Signal out = head(cases.emitted(), cases.played(), rate);
            toneSpectrum = Optional.of(ToneAnalysis.spectrum(out));
            tone = Optional.of(ToneAnalysis.analyze(out, toneSpectrum.get()));
        }
        watch.lap(BuildStage.ANALYZE);
        AnalogModel.Preview preview = Jobs.join(previewJob);
        watch.lap(BuildStage.PREVIEW);
        List<QualityReport> quality = figures.quality();
        Optional<ListenerReport> heard = Jobs.join(listenerJob);
        if (heard.isPresent()) {
            quality = new ArrayList<>(quality);
            int last = quality.size() - 1;
            quality.set(last, quality.get(last).withListener(heard.get()));
            watch.lap(BuildStage.LISTENER);
        }
        return new Rendered(plan, prepared.layout(), prepared.source(), rate, conditioned, cases.emitted(),
                cases.played(), quality, figures.shapingGainDb(), tone, preview, figures.errorSpectrum(), toneSpectrum,
                cutoff, cases.clipped(), settings(plan, prepared.layout(), conditioned, cases.played(), rate,
                        cases.range()), warnings, watch.laps(), loop.map(AutoLoop.Placed::loop), cases.stream());
    }

    /**
     * Quantizes (or, for a Tread store, encodes) onto the ideal ladder and, with a board, onto its real levels
     * when compensating.
     */
    private Cases quantize(BuildPlan plan, Signal reference, Coding coding) {
        QuantizeSettings q = plan.quantize();
        LevelTable ideal = LevelTable.ideal(plan.bits(), plan.preview().fullScaleVolts());
        Coding.Coded idealC = coding.apply(quantizer(ideal, plan), reference);
        Quantizer.Quantized idealQ = idealC.quantized();
        CodeUse idealUse = idealC.use();
        if (q.board().isEmpty()) {
            return new Cases(idealQ, ideal, idealQ.codes(), ideal, idealQ.clippedSamples(), Optional.empty(),
                    new double[] {ideal.minVolts(), ideal.maxVolts()}, idealUse, Optional.empty(), idealC.stream());
        }
        LevelTable board = q.board().get();
        if (!q.compensate()) {
            return new Cases(idealQ, ideal, idealQ.codes(), board, idealQ.clippedSamples(), Optional.empty(),
                    new double[] {board.minVolts(), board.maxVolts()}, idealUse, Optional.empty(), idealC.stream());
        }
        double[] range = span.volts(board, ideal);
        Coding.Coded comp = coding.apply(new Quantizer(board, range[0], range[1], q.dither(), q.shaping(),
                q.seed()), reference);
        Quantizer.Quantized c = comp.quantized();
        return new Cases(idealQ, ideal, c.codes(), board, c.clippedSamples(), Optional.of(c.codes()), range,
                idealUse, Optional.of(comp.use()), comp.stream());
    }

    /** Starts rendering the preview of the emitted codes (its first seconds) on another core. */
    private static CompletableFuture<AnalogModel.Preview> startPreview(BuildPlan plan, Codes emitted,
            LevelTable played, AnalogModel model, double rate, List<String> warnings) {
        int previewCodes = (int) Math.min(emitted.length(), Math.ceil(plan.preview().seconds() * rate));
        Codes previewInput = previewCodes == emitted.length() ? emitted : Codes.of(emitted.bits(), rate,
                Arrays.copyOf(emitted.unsafeCodes(), previewCodes));
        if (previewCodes < emitted.length()) {
            warnings.add(String.format(Locale.ROOT, "preview.wav holds the first %.0f s of %.0f s; set"
                    + " the preview length to all for the whole sound", previewCodes / rate, emitted.length() / rate));
        }
        return CompletableFuture.supplyAsync(() -> model.render(previewInput, played));
    }

    /** Why a sound of {@code samples} samples (fewer than 2) cannot be built, in words. */
    private static String tooShort(BuildPlan plan, int samples) {
        boolean trimmed = plan.conditioning().trimDbfs().isPresent();
        String held = samples + (samples == 1 ? " sample" : " samples") + " at the target rate";
        return (trimmed ? "trimming the quiet ends leaves " + held + "; lower the trim level or leave it out"
                : "the sound is " + held + "; a sound needs at least 2: give a longer sound or a higher rate");
    }

    /**
     * The source's description, the conditioned reference, the target rate and the source as supplied for
     * the listener figures (none for a wavetable, which has no rate of its own).
     */
    private record Prepared(String layout, SourceFacts source, List<String> warnings,
            Conditioner.Conditioned conditioned, double rateHz, Optional<ListenerMetrics> listener,
            boolean wavetable) {
    }

    /**
     * Opens and conditions the source. A WAV source is decoded block by block as the resampler reads it, so
     * a long clip is never held at its own rate.
     */
    private static Prepared prepare(BuildPlan plan, AnalogModel model, Stopwatch watch) {
        ConditioningSettings cs = plan.conditioning();
        try (Sources.Opened opened = Sources.open(plan.source().file(), plan.source().channel(),
                cs.rateHz().orElse(Double.NaN), plan.quantize().seed())) {
            watch.lap(BuildStage.OPEN);
            double rate = cs.rateHz().orElse(Double.isNaN(opened.preferredRateHz()) ? Defaults.RATE_HZ
                    : opened.preferredRateHz());
            Conditioner.Conditioned conditioned;
            Optional<ListenerMetrics> listener = Optional.empty();
            if (opened.wavetable() && plan.firmware().loop().map(LoopSpan::auto).orElse(false)) {
                throw AutoLoop.onWavetable(plan);
            }
            if (opened.wavetable()) {
                // One cycle: its samples are the table as it is, played at any rate by the DDS engine. Only DC
                // removal and level apply; the codes are labelled with the playback rate.
                double[] cycle = new double[opened.samples().length()];
                opened.samples().read(0, cycle, 0, cycle.length);
                Signal table = Signal.wrap(cycle, rate);
                Conditioning c = new Conditioning(cs.removeDc(), java.util.OptionalDouble.empty(), rate, cs.gainDb(),
                        cs.normalizeDbfs(), 0, 0);
                conditioned = new Conditioner(KaiserResampler.forBits(plan.bits())).apply(table, c);
            } else {
                conditioned = new Conditioner(cs.resampler().create(plan.bits())).apply(new ReadShare(opened.samples(),
                        watch.within(BuildStage.CONDITION, "reading")), cs.at(rate));
                listener = listener(opened.samples(), conditioned, cs, model);
            }
            watch.lap(BuildStage.CONDITION);
            return new Prepared(opened.layout(), opened.facts(), opened.warnings(), conditioned, rate, listener,
                    opened.wavetable());
        }
    }

    /**
     * The source as supplied, over the stretch conditioning kept (trim) and with its fades, prepared for the
     * listener figures; none when nothing is left to compare.
     */
    private static Optional<ListenerMetrics> listener(org.rungtone.source.SampleSource source,
            Conditioner.Conditioned c, ConditioningSettings cs, AnalogModel model) {
        if (c.signal().length() < 2) {
            return Optional.empty();
        }
        return ListenerMetrics.Span.kept(source.length(), source.sampleRateHz(), c.trimmedStartSeconds(),
                c.trimmedEndSeconds(), cs.fadeInSeconds(), cs.fadeOutSeconds())
                .map(span -> ListenerMetrics.prepare(source, span, model));
    }

    private static Quantizer quantizer(LevelTable table, BuildPlan plan) {
        QuantizeSettings q = plan.quantize();
        return new Quantizer(table, table.minVolts(), table.maxVolts(), q.dither(), q.shaping(), q.seed());
    }

    private List<String> settings(BuildPlan plan, String layout, Conditioner.Conditioned c,
            LevelTable played, double rate, double[] range) {
        QuantizeSettings q = plan.quantize();
        return List.of(
                "name: " + plan.symbol(),
                "source: " + FileNames.display(plan.source().file()) + " (" + layout + ")",
                "conditioning: " + describe(plan, c),
                "target: " + plan.bits() + " bits at " + Units.format(rate, "Hz"),
                "dither: " + q.dither().label() + ", shaping: " + q.shaping().name() + ", seed: " + q.seed(),
                "levels: " + played.origin() + ", " + Units.format(played.minVolts(), "V") + " .. "
                        + Units.format(played.maxVolts(), "V")
                        + (q.board().isPresent() ? (q.compensate() ? ", compensated" + spanNote(range)
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

    static String describe(BuildPlan plan, Conditioner.Conditioned c) {
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
}
