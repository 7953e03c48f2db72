package org.rungtone.report;

import java.math.BigDecimal;
import java.math.MathContext;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.rungtone.analysis.SurveyResult;
import org.rungtone.analysis.SurveyRow;
import org.rungtone.analysis.SurveyTarget;

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
     */
    public record Context(String toolVersion, Path source, String sourceLayout, String conditioning,
            String resampler, String levels, String dither, String shaping, long seed, String filter,
            boolean previews, List<Path> files, List<String> warnings) {
        /** Copies the lists. */
        public Context {
            files = List.copyOf(files);
            warnings = List.copyOf(warnings);
        }
    }

    /** The preview file of a cell, e.g. {@code b06-r16000.wav} (rate in hertz, without trailing zeros). */
    public static String previewFileName(SurveyRow row) {
        return String.format(Locale.ROOT, "b%02d-r%s%s.wav", row.bits(), plain(row.rateHz()),
                row.codec().map(f -> "-" + f.optionName()).orElse(""));
    }

    /** The whole text report: settings, the table, the recommendation, files and warnings. */
    public static String text(SurveyResult result, Context c) {
        StringBuilder b = new StringBuilder();
        b.append("Rungtone ").append(c.toolVersion()).append(" survey: ").append(fileName(c.source()))
                .append("\n\n");
        TextTable t = new TextTable("item", "value");
        t.row("source", fileName(c.source()) + "  (" + c.sourceLayout() + ")");
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
            return String.format(Locale.ROOT, "Recommended: %d bits at %s%s (SINAD %s dB, ENOB re full scale %s bits,"
                    + " %s).",
                    c.bits(), khz(c.rateHz()), c.codec().map(f -> " stored as " + f.optionName()).orElse(""),
                    fixed(c.sinadDb(), 1), fixed(c.enobFullScaleBits(), 2), bytes(c, result.packed()));
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
        SurveyRow best = result.rows().stream().max(Comparator.comparingDouble(r ->
                target.kind() == SurveyTarget.Kind.SINAD_DB ? r.sinadDb() : r.enobFullScaleBits())).orElseThrow();
        return String.format(Locale.ROOT, "No surveyed setting reaches %s%s; the best is %d bits at %s with"
                + " SINAD %s dB, ENOB re full scale %s bits.", target.describe(),
                result.flashBudgetBytes() == null ? "" : ", within the budget or beyond it", best.bits(),
                khz(best.rateHz()), fixed(best.sinadDb(), 1), fixed(best.enobFullScaleBits(), 2));
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

    /** The JSON report, with the stable field names documented in the README. */
    public static Map<String, Object> json(SurveyResult result, Context c) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("tool", "rungtone");
        m.put("version", c.toolVersion());
        m.put("source", c.source().toString());
        m.put("source_layout", c.sourceLayout());
        m.put("conditioning", c.conditioning());
        m.put("resampler", c.resampler());
        m.put("levels", c.levels());
        m.put("dither", c.dither());
        m.put("shaping", c.shaping());
        m.put("seed", c.seed());
        m.put("filter", c.filter());
        if (result.target() != null) {
            Map<String, Object> target = new LinkedHashMap<>();
            target.put("figure", result.target().kind() == SurveyTarget.Kind.SINAD_DB ? "sinad_db"
                    : "enob_full_scale_bits");
            target.put("value", result.target().value());
            m.put("target", target);
        }
        if (result.flashBudgetBytes() != null) {
            m.put("flash_budget_bytes", result.flashBudgetBytes());
        }
        m.put("packed", result.packed());
        m.put("rows", result.rows().stream().map(r -> row(r, c.previews())).toList());
        result.chosen().ifPresent(r -> m.put("chosen", row(r, c.previews())));
        m.put("recommendation", recommendation(result));
        m.put("files", c.files().stream().map(Path::toString).toList());
        m.put("warnings", c.warnings());
        return m;
    }

    private static Map<String, Object> row(SurveyRow r, boolean previews) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("bits", r.bits());
        m.put("rate_hz", r.rateHz());
        m.put("samples", r.samples());
        m.put("sinad_db", r.sinadDb());
        m.put("in_band_snr_db", r.inBandSnrDb());
        m.put("a_weighted_snr_db", r.aWeightedSnrDb());
        m.put("enob_full_scale_bits", r.enobFullScaleBits());
        m.put("clipped_samples", r.clippedSamples());
        m.put("flash_bytes_unpacked", r.flashBytesUnpacked());
        m.put("flash_bytes_packed", r.flashBytesPacked());
        m.put("fits", r.fits());
        m.put("reaches_target", r.reachesTarget());
        m.put("chosen", r.chosen());
        r.codec().ifPresent(f -> m.put("storage", f.optionName()));
        if (previews) {
            m.put("preview", "previews/" + previewFileName(r));
        }
        return m;
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

    private static String fileName(Path p) {
        return p.getFileName() == null ? p.toString() : p.getFileName().toString();
    }
}
