package org.rungtone.report;

import java.math.BigDecimal;
import java.math.MathContext;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.rungtone.analysis.ReconstructionFilter;
import org.rungtone.analysis.SurveyResult;
import org.rungtone.analysis.SurveyRow;
import org.rungtone.analysis.SurveyTarget;
import org.rungtone.condition.ResamplerKind;
import org.rungtone.internal.FileNames;
import org.rungtone.ladder.LevelTable;

/**
 * Renders a {@link SurveyResult} as a text table for people and as JSON for machines (stable field names,
 * documented in the README), with a closing recommendation.
 */
public final class SurveyReport {
    /** Marks the chosen row in the text table. */
    public static final String CHOSEN_MARK = "<- chosen";

    private SurveyReport() {
    }

    /**
     * How the survey was run, as the reports show it.
     *
     * @param toolVersion Rungtone version
     * @param source the source file
     * @param sourceLayout one-line description of what was read
     * @param conditioning one-line summary of the conditioning
     * @param resampler resampler description
     * @param levels where the level tables came from
     * @param dither dither kind
     * @param shaping error-feedback filter name
     * @param seed random seed
     * @param filter reconstruction filter description
     * @param previews whether a preview WAV was written per cell (named by {@link #previewFileName})
     * @param files files written, in order
     * @param warnings what the user should know
     * @param facts what the reports state beyond the figures, as values for the JSON report
     */
    public record Context(String toolVersion, Path source, String sourceLayout, String conditioning,
            String resampler, String levels, String dither, String shaping, long seed, String filter,
            boolean previews, List<Path> files, List<String> warnings, Facts facts) {
        /** Copies the lists. */
        public Context {
            files = List.copyOf(files);
            warnings = List.copyOf(warnings);
        }
    }

    /**
     * What a survey report states beyond its figures, as values.
     *
     * @param source what was read
     * @param conditioning the conditioning settings
     * @param resampler the resampler design
     * @param deepestLevels the level table of the deepest bit depth surveyed
     * @param filter the previews' reconstruction filter
     * @param outDir the output folder, which the JSON report's paths are relative to
     */
    public record Facts(SourceFacts source, ConditioningFacts conditioning, ResamplerKind resampler,
            LevelTable deepestLevels, ReconstructionFilter filter, Path outDir) {
    }

    /** The preview file of a cell, e.g. {@code b06-r16000.wav} (rate in hertz, without trailing zeros). */
    public static String previewFileName(SurveyRow row) {
        return String.format(Locale.ROOT, "b%02d-r%s%s.wav", row.bits(), plain(row.rateHz()),
                row.codec().map(f -> "-" + f.optionName()).orElse(""));
    }

    /** The whole text report: settings, the table, the recommendation, files and warnings. */
    public static String text(SurveyResult result, Context c) {
        StringBuilder b = new StringBuilder();
        b.append("Rungtone ").append(c.toolVersion()).append(" survey: ").append(FileNames.display(c.source()))
                .append("\n\n");
        TextTable t = new TextTable("item", "value");
        t.row("source", FileNames.display(c.source()) + "  (" + c.sourceLayout() + ")");
        t.row("conditioning", c.conditioning());
        t.row("resampler", c.resampler());
        t.row("levels", c.levels());
        t.row("dither / shaping", c.dither() + " / " + c.shaping() + "  (seed " + c.seed() + ")");
        t.row("reconstruction filter", c.filter());
        t.row("target", result.target() == null ? "none" : result.target().describe());
        t.row("flash budget", (result.flashBudgetBytes() == null ? "none"
                : String.format(Locale.ROOT, "%,d bytes", result.flashBudgetBytes()))
                + (result.packed() ? ", counting bit-packed bytes" : ", counting unpacked bytes"));
        b.append(t.render("  ")).append('\n');
        b.append(table(result)).append('\n');
        if (result.rows().stream().anyMatch(r -> !Double.isNaN(r.listenerSnrDb()))) {
            b.append("SINAD, in-band and A-weighted SNR and ENOB are quantization only (the codes against the source"
                    + " at each rate); \"heard\" is what the listener gets: the board's output rendered as the"
                    + " preview against the source as supplied, 20 Hz to 20 kHz, so treble a rate loses counts."
                    + (result.target() == null ? "" : " The target is checked against the heard figures.")
                    + "\n");
        }
        b.append(recommendation(result)).append('\n');
        if (!c.files().isEmpty()) {
            b.append("\nFiles:\n");
            for (Path f : c.files()) {
                b.append("  ").append(f).append('\n');
            }
        }
        if (!c.warnings().isEmpty()) {
            b.append("\nWarnings:\n");
            for (String w : c.warnings()) {
                b.append("  - ").append(w).append('\n');
            }
        }
        return b.toString();
    }

    /**
     * The table, one line per cell in the result's order; a "meets target" column when a target was given,
     * and {@link #CHOSEN_MARK} after the chosen row.
     */
    public static String table(SurveyResult result) {
        List<String> header = new ArrayList<>(List.of("bits", "rate", "SINAD dB", "in-band SNR dB",
                "A-wtd SNR dB", "ENOB re FS", "flash bytes", "packed bytes", "fits"));
        // a survey of Tread stores names each row's store; its bytes fill both byte columns
        boolean stores = result.rows().stream().anyMatch(r -> r.codec().isPresent());
        if (stores) {
            header.add(2, "storage");
        }
        boolean hasTarget = result.target() != null;
        boolean hasChoice = result.chosen().isPresent();
        boolean heard = result.rows().stream().anyMatch(r -> !Double.isNaN(r.listenerSnrDb()));
        if (heard) {
            header.add("heard SNR dB");
            header.add("heard A-wtd dB");
        }
        if (hasTarget) {
            header.add("meets target");
        }
        if (hasChoice) {
            header.add("");
        }
        TextTable t = new TextTable(header.toArray(new String[0]));
        for (SurveyRow r : result.rows()) {
            List<String> cells = new ArrayList<>(List.of(String.valueOf(r.bits()), khz(r.rateHz()),
                    fixed(r.sinadDb(), 1), fixed(r.inBandSnrDb(), 1), fixed(r.aWeightedSnrDb(), 1),
                    fixed(r.enobFullScaleBits(), 2), String.format(Locale.ROOT, "%,d", r.flashBytesUnpacked()),
                    String.format(Locale.ROOT, "%,d", r.flashBytesPacked()), yesNo(r.fits())));
            if (heard) {
                cells.add(fixed(r.listenerSnrDb(), 1));
                cells.add(fixed(r.listenerAWeightedSnrDb(), 1));
            }
            if (stores) {
                cells.add(2, storage(r));
            }
            if (hasTarget) {
                cells.add(yesNo(r.reachesTarget()));
            }
            if (hasChoice) {
                cells.add(r.chosen() ? CHOSEN_MARK : "");
            }
            t.row(cells.toArray());
        }
        return t.render("  ");
    }

    /**
     * One line: the recommendation, or why there is none (no target; nothing fits the budget and reaches
     * the target, naming the closest miss).
     */
    public static String recommendation(SurveyResult result) {
        SurveyTarget target = result.target();
        Optional<SurveyRow> chosen = result.chosen();
        if (chosen.isPresent()) {
            SurveyRow c = chosen.get();
            String heard = Double.isNaN(c.listenerSnrDb()) ? "" : "heard SNR " + fixed(c.listenerSnrDb(), 1)
                    + " dB, ";
            return String.format(Locale.ROOT, "Recommended: %d bits at %s%s (%sSINAD %s dB, ENOB re full scale %s"
                    + " bits, %s).", c.bits(), khz(c.rateHz()), c.codec().map(f -> " stored as " + f.optionName())
                    .orElse(""), heard, fixed(c.sinadDb(), 1), fixed(c.enobFullScaleBits(), 2),
                    bytes(c, result.packed()));
        }
        if (target == null) {
            return "No target given, so nothing is recommended; give a SINAD or ENOB target.";
        }
        Comparator<SurveyRow> byBytes = Comparator.comparingLong(r -> counted(r, result.packed()));
        Optional<SurveyRow> reaching = result.rows().stream().filter(SurveyRow::reachesTarget).min(byBytes);
        if (reaching.isPresent() && result.flashBudgetBytes() != null) {
            SurveyRow r = reaching.get();
            return String.format(Locale.ROOT, "Nothing reaches %s within the %s budget; the smallest setting"
                    + " that reaches it, %d bits at %s%s, needs %s.", target.describe(),
                    bytes(result.flashBudgetBytes(), result.packed()), r.bits(), khz(r.rateHz()),
                    r.codec().map(f -> " as " + f.optionName()).orElse(""), bytes(r, result.packed()));
        }
        boolean heard = result.rows().stream().anyMatch(r -> !Double.isNaN(r.listenerSnrDb()));
        SurveyRow best = result.rows().stream().max(Comparator.comparingDouble(r -> heard ? r.listenerSnrDb()
                : target.kind() == SurveyTarget.Kind.SINAD_DB ? r.sinadDb() : r.enobFullScaleBits())).orElseThrow();
        return String.format(Locale.ROOT, "No surveyed setting reaches %s%s; the best is %d bits at %s with"
                + " %sSINAD %s dB, ENOB re full scale %s bits.", target.describe(),
                result.flashBudgetBytes() == null ? "" : ", within the budget or beyond it", best.bits(),
                khz(best.rateHz()), heard ? "heard SNR " + fixed(best.listenerSnrDb(), 1) + " dB (images and lost"
                        + " treble count; a reconstruction filter or a higher rate helps), " : "",
                fixed(best.sinadDb(), 1), fixed(best.enobFullScaleBits(), 2));
    }

    /**
     * One line of stage timings, for --verbose: "stage timings: load and survey 900 ms, previews 0 ms, files
     * 40 ms".
     */
    public static String timings(Map<String, Double> stageMillis) {
        StringBuilder b = new StringBuilder("stage timings:");
        stageMillis.forEach((k, v) -> b.append(String.format(Locale.ROOT, " %s %.0f ms,", k, v)));
        b.setLength(b.length() - 1);
        return b.toString();
    }

    /**
     * The JSON report ({@code docs/schema/survey.schema.json}); paths are relative to the survey's output
     * folder.
     */
    public static Map<String, Object> json(SurveyResult result, Context c) {
        return SurveyJson.of(result, c);
    }

    private static long counted(SurveyRow r, boolean packed) {
        return packed ? r.flashBytesPacked() : r.flashBytesUnpacked();
    }

    private static String bytes(long n, boolean packed) {
        return String.format(Locale.ROOT, "%,d bytes %s", n, packed ? "bit-packed" : "unpacked");
    }

    /** A row's counted bytes in words: bit-packed or unpacked for the plain codes, else its Tread store's. */
    private static String bytes(SurveyRow r, boolean packed) {
        return r.codec().isEmpty() ? bytes(counted(r, packed), packed)
                : String.format(Locale.ROOT, "%,d bytes as %s", r.flashBytesPacked(), r.codec().get().optionName());
    }

    private static String storage(SurveyRow r) {
        return r.codec().map(f -> f.optionName()).orElse("plain");
    }

    private static String yesNo(boolean b) {
        return b ? "yes" : "no";
    }

    /** Fixed decimals; "inf", "-inf" or "nan" for non-finite values. */
    private static String fixed(double v, int decimals) {
        if (Double.isNaN(v)) {
            return "nan";
        }
        if (Double.isInfinite(v)) {
            return v > 0 ? "inf" : "-inf";
        }
        return String.format(Locale.ROOT, "%." + decimals + "f", v);
    }

    /** A rate in kilohertz without trailing zeros: "8 kHz", "11.025 kHz". */
    private static String khz(double hz) {
        return plain(hz / 1000) + " kHz";
    }

    private static String plain(double v) {
        return BigDecimal.valueOf(v).round(new MathContext(9)).stripTrailingZeros().toPlainString();
    }
}
