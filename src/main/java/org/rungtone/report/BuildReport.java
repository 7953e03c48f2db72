package org.rungtone.report;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.rungtone.internal.Units;

/** Renders a {@link BuildSummary} as text for people and as JSON for machines. */
public final class BuildReport {
    private BuildReport() {
    }

    /** The text report: settings, figures, files, then warnings at the end. */
    public static String text(BuildSummary s) {
        StringBuilder b = new StringBuilder();
        b.append("Rungtone ").append(s.toolVersion()).append(" build report: ").append(s.symbol()).append("\n\n");
        TextTable t = new TextTable("item", "value");
        t.row("source", s.source().getFileName() + "  (" + s.sourceLayout() + ")");
        t.row("conditioning", s.conditioning());
        t.row("resampler", s.resampler());
        t.row("target", s.bits() + " bits at " + Units.format(s.rateHz(), "Hz") + ", "
                + s.samples() + " samples, " + String.format(Locale.ROOT, "%.3f s", s.durationSeconds()));
        t.row("dither / shaping", s.dither() + " / " + s.shaping() + "  (seed " + s.seed() + ")");
        t.row("ladder", s.ladder());
        t.row("clipped samples", s.clippedSamples() + (s.samples() > 0 ? String.format(Locale.ROOT,
                "  (%.3f %%)", 100.0 * s.clippedSamples() / s.samples()) : ""));
        t.row("error SNR", String.format(Locale.ROOT, "%.2f dB  (output vs conditioned source, gain and"
                + " offset aligned)", s.snrDb()));
        t.row("flash", String.format(Locale.ROOT, "%,d bytes of samples", s.flashBytes()));
        b.append(t.render("  "));
        b.append("\nFiles:\n");
        for (Path f : s.files()) {
            b.append("  ").append(f).append('\n');
        }
        if (!s.warnings().isEmpty()) {
            b.append("\nWarnings:\n");
            for (String w : s.warnings()) {
                b.append("  - ").append(w).append('\n');
            }
        }
        return b.toString();
    }

    /** One line of stage timings, for --verbose: "decode 120 ms, condition 80 ms, ...". */
    public static String timings(BuildSummary s) {
        StringBuilder b = new StringBuilder("stage timings:");
        s.stageMillis().forEach((k, v) -> b.append(String.format(Locale.ROOT, " %s %.0f ms,", k, v)));
        b.setLength(b.length() - 1);
        return b.toString();
    }

    /** The JSON report, with the stable field names documented in the README. */
    public static Map<String, Object> json(BuildSummary s) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("tool", "rungtone");
        m.put("version", s.toolVersion());
        m.put("symbol", s.symbol());
        m.put("source", s.source().toString());
        m.put("source_layout", s.sourceLayout());
        m.put("bits", s.bits());
        m.put("rate_hz", s.rateHz());
        m.put("samples", s.samples());
        m.put("duration_s", s.durationSeconds());
        m.put("dither", s.dither());
        m.put("shaping", s.shaping());
        m.put("seed", s.seed());
        m.put("conditioning", s.conditioning());
        m.put("resampler", s.resampler());
        m.put("ladder", s.ladder());
        m.put("clipped_samples", s.clippedSamples());
        m.put("snr_db", s.snrDb());
        m.put("flash_bytes", s.flashBytes());
        m.put("files", s.files().stream().map(Path::toString).toList());
        m.put("warnings", List.copyOf(s.warnings()));
        m.put("stage_ms", s.stageMillis());
        return m;
    }
}
