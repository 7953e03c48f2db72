package org.rungtone.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.concurrent.Callable;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.IntFunction;
import org.rungtone.analysis.AnalogModel;
import org.rungtone.analysis.ReconstructionFilter;
import org.rungtone.analysis.Survey;
import org.rungtone.analysis.SurveyResult;
import org.rungtone.analysis.SurveySpec;
import org.rungtone.analysis.SurveyTarget;
import org.rungtone.condition.Conditioner;
import org.rungtone.condition.Conditioning;
import org.rungtone.condition.Resampler;
import org.rungtone.firmware.CNames;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.Checks;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Units;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;
import org.rungtone.project.Sources;
import org.rungtone.quantize.Codes;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;
import org.rungtone.report.AnalysisPlots;
import org.rungtone.report.Json;
import org.rungtone.report.SurveyReport;
import org.rungtone.source.Signal;
import org.rungtone.source.WavWriter;
import picocli.CommandLine.Command;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.TypeConversionException;

/** {@code rungtone survey}: quality and flash cost of one source over bit depths × sample rates. */
@Command(name = "survey",
        header = "Tabulate quality and flash cost over bit depths x sample rates.", mixinStandardHelpOptions = true,
        description = {"Tabulate quality and flash cost over bit depths x sample rates.",
            "Quantizes a sound at every setting and measures SINAD, in-band and A-weighted",
            "SNR and ENOB; marks the setting with the fewest flash bytes that reaches a",
            "target within a flash budget. Writes survey.txt, survey.json and",
            "survey-sinad.png, and with --previews a 44.1 kHz WAV per cell to listen to."},
        sortOptions = false,
        footerHeading = "%nExample:%n",
        footer = {"  rungtone survey door-chime.wav --bits-list 4..10 --rates 8k,16k \\",
            "      --flash-budget 32k --target-sinad 40",
            "  (7 bit depths x 2 rates; marks the smallest setting with SINAD >= 40 dB",
            "   that fits 32,000 bytes; files go to rungtone-out/survey-door_chime/)"})
public final class SurveyCommand implements Callable<Integer> {
    /** Reference voltage of the ideal ladder the survey models when no ladder is given. */
    static final double IDEAL_FULL_SCALE_VOLTS = 5.0;
    /** Sample rate of the preview WAV files. */
    static final double PREVIEW_RATE_HZ = 44_100;
    /** Fewest samples a cell needs for its quality figures. */
    static final int MIN_SAMPLES = 16;

    @Spec
    CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Parameters(index = "0", paramLabel = "SOURCE", description = "A .wav file or a .rung script (rendered at"
            + " the highest surveyed rate).")
    Path source;

    @Option(names = "--bits-list", paramLabel = "<list>", defaultValue = "1..12", converter = BitList.Parser.class,
            description = "Bit depths: ranges and single depths, comma separated, e.g. 4..10 or 4,6,8"
                    + " (default ${DEFAULT-VALUE}).")
    BitList bitList;

    @Option(names = "--rates", paramLabel = "<list>", defaultValue = "8k,11.025k,16k,22.05k",
            converter = RateList.Parser.class,
            description = "Sample rates, a comma list (default ${DEFAULT-VALUE}).")
    RateList rateList;

    @Option(names = "--dither", paramLabel = "none|rpdf|tpdf", defaultValue = "tpdf",
            description = "Dither before quantizing (default ${DEFAULT-VALUE}).")
    Dither dither;

    @Option(names = "--shaping", paramLabel = "none|first|second", defaultValue = "none",
            description = "Error-feedback noise shaping (default ${DEFAULT-VALUE}).")
    String shaping;

    @Option(names = "--seed", paramLabel = "<n>", defaultValue = "1",
            description = "Seed for dither; every cell uses it (default ${DEFAULT-VALUE}).")
    long seed;

    @Option(names = "--channel", paramLabel = "<n>", defaultValue = "0",
            description = "0 mixes all channels down (default); 1..8 picks one.")
    int channel;

    @Mixin
    ConditioningOptions conditioning;

    @Mixin
    LadderOptions ladder;

    @Mixin
    UnitOptions unit;

    @Option(names = "--flash-budget", paramLabel = "<bytes>", converter = Converters.Bytes.class,
            description = "Flash available for the samples, e.g. 32000 or 32k.")
    Long flashBudget;

    @Option(names = "--target-sinad", paramLabel = "<dB>", converter = Converters.Decibels.class,
            description = "Least acceptable full-band SINAD in dB, e.g. 40.")
    Double targetSinadDb;

    @Option(names = "--target-enob", paramLabel = "<bits>",
            description = "Least acceptable effective number of bits, e.g. 6.5 (instead of --target-sinad).")
    Double targetEnobBits;

    @Option(names = "--packed", description = "Judge the budget and the choice by bit-packed bytes.")
    boolean packed;

    @Option(names = "--previews", description = "Write a 16-bit preview WAV per cell into OUT/previews/.")
    boolean previews;

    @Option(names = "--filter", paramLabel = "<filter>", defaultValue = "none", converter = FilterParser.class,
            description = "Reconstruction filter after the ladder, for previews and the in-band cutoff: none,"
                    + " rc:<hz> (first-order RC) or lp2:<hz>[:<q>] (second order, Q 0.707 unless given).")
    ReconstructionFilter filter;

    @Option(names = "--out", paramLabel = "<dir>",
            description = "Output folder (default ./rungtone-out/survey-NAME).")
    Path out;

    @Option(names = "--json", description = "Print the report as JSON instead of text.")
    boolean json;

    @Override
    public Integer call() {
        long start = System.nanoTime();
        List<Integer> bits = bitList.expand();
        List<Double> rates = rateList.checked();
        Checks.checkInput(channel >= 0 && channel <= 8, "--channel must be 0 (mix down) or 1..8: %d", channel);
        Path outDir = out != null ? out
                : Path.of("rungtone-out", "survey-" + CNames.symbol(BuildCommand.stem(source)));
        AtomicFiles.checkFolderUsable(outDir);
        int maxBits = bits.stream().max(Integer::compare).orElseThrow();
        double maxRate = rates.stream().max(Double::compare).orElseThrow();
        Resampler resampler = conditioning.resamplerFor(maxBits);
        Conditioner conditioner = new Conditioner(resampler);
        Map<Double, Conditioning> conditionings = new LinkedHashMap<>();
        for (double rate : rates) {
            conditionings.put(rate, conditioning.toRate(rate));
        }
        TreeMap<Integer, LevelTable> tables = new TreeMap<>();
        IntFunction<LevelTable> levels = levelTables();
        for (int b : bits) {
            tables.put(b, levels.apply(b));
        }
        AnalogModel model = new AnalogModel(filter, PREVIEW_RATE_HZ);
        SurveySpec surveySpec = spec(bits, rates, tables, model);

        Map<Double, Conditioner.Conditioned> references = new ConcurrentHashMap<>();
        ProgressLine progress = ProgressLine.forTerminal(spec.commandLine().getErr(), common);
        SurveyResult result;
        List<String> sourceWarnings;
        String layout;
        // A WAV source is decoded as each rate's conditioning reads it, never held whole at its own rate.
        try (Sources.Opened loaded = Sources.open(source, channel, maxRate, seed)) {
            sourceWarnings = loaded.warnings();
            layout = loaded.layout();
            progress.show("survey", 0, bits.size() * rates.size());
            result = Survey.run(surveySpec, rate -> {
                Conditioner.Conditioned c = conditioner.apply(loaded.samples(), conditionings.get(rate));
                Checks.checkInput(c.signal().length() >= MIN_SAMPLES, "%s: only %d samples are left at %s after"
                        + " conditioning; the survey needs at least %d (use a longer clip or higher --rates)",
                        source, c.signal().length(), Units.format(rate, "Hz"), MIN_SAMPLES);
                references.put(rate, c);
                return c.signal();
            }, (done, total) -> progress.show("survey", done, total));
        }
        progress.clear();
        long surveyed = System.nanoTime();

        List<Path> files = new ArrayList<>();
        Set<String> warnings = new LinkedHashSet<>(sourceWarnings);
        warnings.addAll(conditioningWarnings(rates, references));
        if (previews) {
            Path folder = outDir.resolve("previews");
            double peak = writePreviews(result, surveySpec, references, tables, model, folder, progress);
            files.add(folder);
            if (peak > 1) {
                warnings.add(String.format(Locale.ROOT, "preview overshoot (peak %.3f of full scale) is clipped"
                        + " in the 16-bit WAV files", peak));
            }
        }
        long previewed = System.nanoTime();
        Path txt = outDir.resolve("survey.txt");
        Path jsonFile = outDir.resolve("survey.json");
        Path png = outDir.resolve("survey-sinad.png");
        files.addAll(0, List.of(txt, jsonFile, png));
        SurveyReport.Context context = new SurveyReport.Context(Version.get(), source, layout,
                conditioning.describe(), resampler.name(), describeLevels(tables), dither.label(),
                surveySpec.shaping().name(), seed, filter.describe(), previews, files, new ArrayList<>(warnings));
        String jsonText = Json.toJson(SurveyReport.json(result, context));
        String text = SurveyReport.text(result, context);
        AnalysisPlots.writeSurvey(png, result);
        AtomicFiles.writeString(jsonFile, jsonText);
        AtomicFiles.writeString(txt, text);

        PrintWriter stdout = spec.commandLine().getOut();
        if (json) {
            stdout.print(jsonText);
        } else if (!common.quiet) {
            stdout.print(text);
        }
        stdout.flush();
        if (common.verbose) {
            long done = System.nanoTime();
            spec.commandLine().getErr().printf(Locale.ROOT, "stage timings: load and survey %.0f ms, previews"
                    + " %.0f ms, files %.0f ms%n", (surveyed - start) / 1e6, (previewed - surveyed) / 1e6,
                    (done - previewed) / 1e6);
            spec.commandLine().getErr().flush();
        }
        return 0;
    }

    /**
     * The level table for each bit depth: the one place where a modelled or measured ladder plugs in.
     * Without one, the ideal table with a {@value #IDEAL_FULL_SCALE_VOLTS} V reference.
     */
    IntFunction<LevelTable> levelTables() {
        if (unit.given()) {
            LevelTable measured = unit.resolve(0, ladder, false).levels().orElseThrow();
            return b -> {
                if (b != measured.bits()) {
                    throw new InputError("the unit profile has " + measured.bits() + " bits; survey it with"
                            + " --bits-list " + measured.bits());
                }
                return measured;
            };
        }
        if (!ladder.given()) {
            return b -> LevelTable.ideal(b, IDEAL_FULL_SCALE_VOLTS);
        }
        LadderSpec base = ladder.spec(0);
        return b -> {
            if (b != base.bits() && !base.resistors().isEmpty()) {
                throw new InputError("the ladder lists " + base.resistors().size() + " resistors, so it can only"
                        + " be surveyed at " + base.bits() + " bits; give base_r instead of resistors to survey"
                        + " other depths");
            }
            LadderSpec s = b == base.bits() ? base : base.toBuilder().bits(b).build();
            // one description for every depth, so the report names the ladder once
            return s.levels().withOrigin("modelled " + s.describe().replaceFirst(" \\d+-bit", ""));
        };
    }

    private SurveySpec spec(List<Integer> bits, List<Double> rates, Map<Integer, LevelTable> tables,
            AnalogModel model) {
        SurveySpec.Builder b = SurveySpec.builder().bitDepths(bits).ratesHz(rates).dither(dither)
                .shaping(ErrorFilter.parse(shaping)).seed(seed).tables(tables::get)
                .inBandCutoffHz(rate -> Math.min(20_000, model.passbandTopHz(rate))).packed(packed);
        if (flashBudget != null) {
            b.flashBudgetBytes(flashBudget);
        }
        Checks.checkInput(targetSinadDb == null || targetEnobBits == null,
                "give one target, --target-sinad or --target-enob, not both");
        if (targetSinadDb != null) {
            b.target(SurveyTarget.sinadDb(targetSinadDb));
        } else if (targetEnobBits != null) {
            b.target(SurveyTarget.enobBits(targetEnobBits));
        }
        return b.build();
    }

    /**
     * Renders and writes one preview per cell, cells in parallel (each file is independent and written
     * atomically); returns the largest preview peak.
     */
    private static double writePreviews(SurveyResult result, SurveySpec surveySpec,
            Map<Double, Conditioner.Conditioned> references, Map<Integer, LevelTable> tables, AnalogModel model,
            Path folder, ProgressLine progress) {
        AtomicFiles.prepareFolder(folder);
        AtomicInteger done = new AtomicInteger();
        int total = result.rows().size();
        double peak = result.rows().parallelStream().mapToDouble(row -> {
            LevelTable table = tables.get(row.bits());
            Signal reference = references.get(row.rateHz()).signal();
            Codes codes = Survey.quantize(surveySpec, reference, table).codes();
            AnalogModel.Preview p = model.render(codes, table);
            WavWriter.write(folder.resolve(SurveyReport.previewFileName(row)), p.signal(),
                    WavWriter.Format.PCM16);
            progress.show("previews", done.incrementAndGet(), total);
            return p.peak();
        }).max().orElse(0);
        progress.clear();
        return peak;
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

    /** A --bits-list value: ranges {@code a..b} and single depths, as written. */
    record BitList(String text, List<int[]> ranges) {
        /**
         * The depths in order.
         *
         * @throws InputError when a depth is outside 1..16 or repeats
         */
        List<Integer> expand() {
            List<Integer> out = new ArrayList<>();
            for (int[] r : ranges) {
                for (int end : r) {
                    Checks.checkInput(end >= 1 && end <= 16, "--bits-list %s: bit depth must be 1..16: %d", text,
                            end);
                }
                for (int b = r[0]; b <= r[1]; b++) {
                    Checks.checkInput(!out.contains(b), "--bits-list %s: %d appears twice; give each depth once",
                            text, b);
                    out.add(b);
                }
            }
            return out;
        }

        /** Reads "1..12", "4,6,8", "2..4,8"; malformed text is a usage error. */
        static final class Parser implements ITypeConverter<BitList> {
            @Override
            public BitList convert(String value) {
                List<int[]> ranges = new ArrayList<>();
                for (String item : value.split(",", -1)) {
                    String[] ends = item.trim().split("\\.\\.", -1);
                    if (ends.length > 2) {
                        throw new TypeConversionException("'" + item + "' is not a bit depth or a range like 4..10");
                    }
                    int from = depth(ends[0], item);
                    int to = ends.length == 2 ? depth(ends[1], item) : from;
                    if (to < from) {
                        throw new TypeConversionException("the range '" + item + "' runs backwards; write "
                                + to + ".." + from);
                    }
                    ranges.add(new int[] {from, to});
                }
                return new BitList(value, ranges);
            }

            private static int depth(String text, String item) {
                try {
                    return Integer.parseInt(text.trim());
                } catch (NumberFormatException e) {
                    throw new TypeConversionException("'" + item + "' is not a bit depth or a range like 4..10"
                            + " (e.g. --bits-list 1..12 or 4,6,8)");
                }
            }
        }
    }

    /** A --rates value: sample rates in hertz, as written. */
    record RateList(String text, List<Double> ratesHz) {
        /**
         * The rates, checked.
         *
         * @throws InputError when a rate is outside 1 Hz..384 kHz or repeats
         */
        List<Double> checked() {
            List<Double> out = new ArrayList<>();
            for (double r : ratesHz) {
                Checks.checkInput(r >= 1 && r <= 384_000, "--rates %s: a sample rate must be 1 Hz..384 kHz: %s",
                        text, Units.format(r, "Hz"));
                Checks.checkInput(!out.contains(r), "--rates %s: %s appears twice; give each rate once", text,
                        Units.format(r, "Hz"));
                out.add(r);
            }
            return out;
        }

        /** Reads "8k,11.025k,16kHz"; malformed text is a usage error. */
        static final class Parser implements ITypeConverter<RateList> {
            @Override
            public RateList convert(String value) {
                List<Double> rates = new ArrayList<>();
                for (String item : value.split(",", -1)) {
                    rates.add(new Converters.Hertz().convert(item));
                }
                return new RateList(value, rates);
            }
        }
    }

    /** Reads --filter: none, rc:HZ or lp2:HZ[:Q] (see {@link ReconstructionFilter#parse}). */
    static final class FilterParser implements ITypeConverter<ReconstructionFilter> {
        @Override
        public ReconstructionFilter convert(String value) {
            try {
                return ReconstructionFilter.parse(value);
            } catch (InputError e) {
                throw new TypeConversionException(e.getMessage());
            }
        }
    }
}
