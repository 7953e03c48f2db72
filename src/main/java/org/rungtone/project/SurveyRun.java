package org.rungtone.project;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicInteger;
import org.rungtone.analysis.AnalogModel;
import org.rungtone.analysis.ListenerMetrics;
import org.rungtone.analysis.Survey;
import org.rungtone.analysis.SurveyResult;
import org.rungtone.analysis.SurveySpec;
import org.rungtone.condition.Conditioner;
import org.rungtone.condition.Conditioning;
import org.rungtone.condition.Resampler;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.InputError;
import org.rungtone.internal.OutputFolder;
import org.rungtone.internal.Setting;
import org.rungtone.internal.SettingError;
import org.rungtone.internal.Units;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.report.ConditioningFacts;
import org.rungtone.report.Json;
import org.rungtone.report.SourceFacts;
import org.rungtone.report.SurveyFiles;
import org.rungtone.report.SurveyReport;
import org.rungtone.source.SampleSource;
import org.rungtone.source.Signal;

/**
 * Runs one {@link SurveyRequest}, the counterpart of {@link Build} for the bit-depth × sample-rate survey:
 * condition the source to every rate, take the board's level table at every depth, run the {@link Survey},
 * render a preview per cell if asked (cells in parallel), merge the warnings of all rates and write the
 * reports through {@link SurveyFiles}. Only the report writers touch files.
 */
public final class SurveyRun {
    /** Sample rate of the preview WAV files. */
    static final double PREVIEW_RATE_HZ = 44_100;
    /** Fewest samples a cell needs for its quality figures. */
    static final int MIN_SAMPLES = 16;
    /** The first decode's progress is told in thousandths of the source. */
    private static final int PER_MILLE = 1000;

    private final Progress progress;

    /** Progress of a run, for a progress line. */
    @FunctionalInterface
    public interface Progress {
        /** No progress reports. */
        Progress NONE = (label, done, total) -> { };

        /**
         * Called as work finishes, from worker threads but never concurrently.
         *
         * @param label what is being done: "reading" (the first decode of the source, in thousandths of it),
         *     "survey" (the cells), "previews", then "writing reports" (told once, with no count)
         * @param done items finished so far
         * @param total items of that kind; 0 when not counted
         */
        void update(String label, int done, int total);
    }

    /**
     * What a run found and wrote.
     *
     * @param survey the table and the choice
     * @param context how the survey was run, with the files written and the warnings
     * @param stageMillis wall-clock milliseconds of "load and survey", "previews" and "files", in order
     */
    public record Result(SurveyResult survey, SurveyReport.Context context, Map<String, Double> stageMillis) {
        /** Copies the timings, keeping their order. */
        public Result {
            stageMillis = Collections.unmodifiableMap(new LinkedHashMap<>(stageMillis));
        }

        /** The text report, as survey.txt holds it. */
        public String text() {
            return SurveyReport.text(survey, context);
        }

        /** The JSON report, as survey.json holds it. */
        public String json() {
            return Json.toJson(SurveyReport.json(survey, context));
        }
    }

    /** The source, the survey and the conditioned reference at every rate. */
    private record Surveyed(String layout, SourceFacts source, List<String> sourceWarnings, SurveyResult result,
            Map<Double, Conditioner.Conditioned> references) {
    }

    /** A run that tells {@code progress} how far it got. */
    public SurveyRun(Progress progress) {
        this.progress = progress;
    }

    /**
     * Runs the survey and writes its reports (and previews) into the request's output folder.
     *
     * @throws InputError for anything the user can fix; the reports are written only when all cells are done
     */
    public Result run(SurveyRequest request) {
        long start = System.nanoTime();
        Path folder = request.output().folder();
        AtomicFiles.checkFolderUsable(folder);
        SurveyRequest.Cells cells = request.cells();
        int maxBits = cells.bitDepths().stream().max(Integer::compare).orElseThrow();
        Resampler resampler = request.conditioning().resampler().create(maxBits);
        Map<Double, Conditioning> conditionings = new LinkedHashMap<>();
        for (double rate : cells.ratesHz()) {
            conditionings.put(rate, request.conditioning().at(rate));
        }
        TreeMap<Integer, LevelTable> tables = new TreeMap<>();
        for (int b : cells.bitDepths()) {
            tables.put(b, request.tables().apply(b));
        }
        AnalogModel model = new AnalogModel(request.filter(), PREVIEW_RATE_HZ);
        SurveySpec spec = spec(request, tables, model);
        Surveyed s = survey(request, spec, new Conditioner(resampler), conditionings, model);
        long surveyed = System.nanoTime();

        try (OutputFolder out = OutputFolder.open(folder, "survey")) {
            Result r = write(request, s, spec, tables, model, resampler, start, surveyed);
            out.commit();
            return r;
        }
    }

    /** Writes the previews and the reports into the (staged) output folder. */
    private Result write(SurveyRequest request, Surveyed s, SurveySpec spec, TreeMap<Integer, LevelTable> tables,
            AnalogModel model, Resampler resampler, long start, long surveyed) {
        Path folder = request.output().folder();
        SurveyRequest.Cells cells = request.cells();
        List<Path> files = new ArrayList<>(SurveyFiles.reports(folder, s.result()));
        Set<String> warnings = new LinkedHashSet<>(s.sourceWarnings());
        warnings.addAll(conditioningWarnings(cells.ratesHz(), s.references()));
        if (request.output().previews()) {
            double peak = writePreviews(s, spec, tables, model, folder);
            files.add(SurveyFiles.previews(folder));
            if (peak > 1) {
                warnings.add(String.format(Locale.ROOT, "preview overshoot (peak %.3f of full scale) is clipped"
                        + " in the 16-bit WAV files", peak));
            }
        }
        long previewed = System.nanoTime();
        SurveyReport.Context context = new SurveyReport.Context(request.output().toolVersion(), request.source(),
                s.layout(), request.conditioning().describe(), resampler.name(), describeLevels(tables),
                cells.dither().label(), cells.shaping().name(), cells.seed(), request.filter().describe(),
                request.output().previews(), files, new ArrayList<>(warnings), new SurveyReport.Facts(s.source(),
                ConditioningFacts.of(request.conditioning().at(cells.ratesHz().get(0))),
                request.conditioning().resampler(), tables.lastEntry().getValue(), request.filter(), folder));
        tell("writing reports", 0, 0);
        SurveyFiles.write(folder, s.result(), context);
        long done = System.nanoTime();
        Map<String, Double> laps = new LinkedHashMap<>();
        laps.put("load and survey", (surveyed - start) / 1e6);
        laps.put("previews", (previewed - surveyed) / 1e6);
        laps.put("files", (done - previewed) / 1e6);
        return new Result(s.result(), context, laps);
    }

    private static SurveySpec spec(SurveyRequest request, Map<Integer, LevelTable> tables, AnalogModel model) {
        SurveyRequest.Cells cells = request.cells();
        SurveyRequest.Choice choice = request.choice();
        SurveySpec.Builder b = SurveySpec.builder().bitDepths(cells.bitDepths()).ratesHz(cells.ratesHz())
                .dither(cells.dither()).shaping(cells.shaping()).seed(cells.seed()).tables(tables::get)
                .inBandCutoffHz(model::inBandTopHz).packed(choice.packed()).codecs(choice.codecs());
        choice.flashBudgetBytes().ifPresent(b::flashBudgetBytes);
        choice.target().ifPresent(b::target);
        return b.build();
    }

    /**
     * Opens the source and surveys it. A WAV source is decoded as each rate's conditioning reads it, never
     * held whole at its own rate; a script is rendered at the highest rate.
     */
    private Surveyed survey(SurveyRequest request, SurveySpec spec, Conditioner conditioner,
            Map<Double, Conditioning> conditionings, AnalogModel model) {
        double maxRate = spec.ratesHz().stream().max(Double::compare).orElseThrow();
        Map<Double, Conditioner.Conditioned> references = new ConcurrentHashMap<>();
        try (Sources.Opened loaded = Sources.open(request.source(), request.channel(), maxRate, spec.seed())) {
            // The highest rate first: its trim tells which stretch of the source the listener figures compare.
            Conditioner.Conditioned top = conditioned(request, conditioner, new ReadShare(loaded.samples(),
                    share -> tell("reading", (int) Math.round(share * PER_MILLE), PER_MILLE)), conditionings, maxRate);
            tell("survey", 0, Survey.cellCount(spec));
            references.put(maxRate, top);
            ListenerMetrics listener = listener(request, loaded, top, model);
            SurveyResult result = Survey.run(spec, rate -> references.computeIfAbsent(rate,
                    r -> conditioned(request, conditioner, loaded.samples(), conditionings, r)).signal(), listener,
                    (done, total) -> tell("survey", done, total));
            return new Surveyed(loaded.layout(), loaded.facts(), loaded.warnings(), result, references);
        }
    }

    private static Conditioner.Conditioned conditioned(SurveyRequest request, Conditioner conditioner,
            SampleSource samples, Map<Double, Conditioning> conditionings, double rate) {
        Conditioner.Conditioned c = conditioner.apply(samples, conditionings.get(rate));
        if (c.signal().length() < MIN_SAMPLES) {
            throw tooShort(request.source(), c.signal().length(), rate);
        }
        return c;
    }

    /**
     * The source as supplied over the stretch conditioning kept, for the listener figures of every cell; null
     * for a wavetable (it has no rate of its own) or when nothing is left to compare.
     */
    private static ListenerMetrics listener(SurveyRequest request, Sources.Opened loaded,
            Conditioner.Conditioned top, AnalogModel model) {
        if (loaded.wavetable()) {
            return null;
        }
        ConditioningSettings cs = request.conditioning();
        return ListenerMetrics.Span.kept(loaded.samples().length(), loaded.samples().sampleRateHz(),
                top.trimmedStartSeconds(), top.trimmedEndSeconds(), cs.fadeInSeconds(), cs.fadeOutSeconds())
                .map(span -> ListenerMetrics.prepare(loaded.samples(), span, model)).orElse(null);
    }

    private static SettingError tooShort(Path source, int samples, double rateHz) {
        return new SettingError(Setting.SURVEY_RATES, String.format(Locale.ROOT, "%s: only %d samples are left"
                + " at %s after conditioning; the survey needs at least %d (use a longer clip or higher %s)",
                source, samples, Units.format(rateHz, "Hz"), MIN_SAMPLES, Setting.SURVEY_RATES.ref()), null);
    }

    /**
     * Renders and writes one preview per cell, cells in parallel (each file is independent and written
     * atomically); returns the largest preview peak.
     */
    private double writePreviews(Surveyed s, SurveySpec spec, Map<Integer, LevelTable> tables, AnalogModel model,
            Path folder) {
        SurveyFiles.preparePreviews(folder);
        AtomicInteger done = new AtomicInteger();
        int total = s.result().rows().size();
        return s.result().rows().parallelStream().mapToDouble(row -> {
            LevelTable table = tables.get(row.bits());
            Signal reference = s.references().get(row.rateHz()).signal();
            Codes codes = Survey.codes(spec, reference, table, row.codec()).codes();
            AnalogModel.Preview p = model.render(codes, table);
            SurveyFiles.writePreview(folder, row, p.signal());
            tell("previews", done.incrementAndGet(), total);
            return p.peak();
        }).max().orElse(0);
    }

    private synchronized void tell(String label, int done, int total) {
        progress.update(label, done, total);
    }

    /** Conditioning warnings; one that several rates share is listed once, naming them all. */
    private static List<String> conditioningWarnings(List<Double> rates,
            Map<Double, Conditioner.Conditioned> references) {
        Map<String, List<String>> ratesByWarning = new LinkedHashMap<>();
        for (double rate : rates) {
            for (String w : references.get(rate).warnings()) {
                ratesByWarning.computeIfAbsent(w, k -> new ArrayList<>()).add(Units.format(rate, "Hz"));
            }
        }
        List<String> out = new ArrayList<>();
        ratesByWarning.forEach((w, at) -> out.add("at " + String.join(", ", at) + ": " + w));
        return out;
    }

    /** "ideal, 0V .. 4.999V at 12 bits": the origins of the tables and the span of the deepest one. */
    private static String describeLevels(TreeMap<Integer, LevelTable> tables) {
        Set<String> origins = new LinkedHashSet<>();
        tables.values().forEach(t -> origins.add(t.origin()));
        LevelTable deepest = tables.lastEntry().getValue();
        return String.join(", ", origins) + ", " + Units.format(deepest.minVolts(), "V") + " .. "
                + Units.format(deepest.maxVolts(), "V") + " at " + deepest.bits() + " bits";
    }
}
