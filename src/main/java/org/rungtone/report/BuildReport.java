package org.rungtone.report;

import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.rungtone.analysis.QualityReport;
import org.rungtone.analysis.ToneReport;
import org.rungtone.internal.Units;

/** Renders a {@link BuildSummary} as text for people and as JSON for machines. */
public final class BuildReport {
    private BuildReport() {
    }

    /**
     * The text report: settings, quality per ladder case (quantization only), what the listener gets, the
     * definitions of the figures, preview, files, then warnings at the end.
     */
    public static String text(BuildSummary s) {
        StringBuilder b = new StringBuilder();
        b.append("Rungtone ").append(s.toolVersion()).append(" build report: ").append(s.symbol()).append("\n\n");
        b.append(settings(s).render("  "));
        quality(b, s);
        s.emitted().listener().ifPresent(l -> {
            b.append(String.format(Locale.ROOT, "%nWhat the listener gets (%s):%n", FigureText.listenerScope(l)));
            TextTable lt = new TextTable("figure", "dB");
            lt.row(FigureText.LISTENER_SNR, FigureText.f1(l.snrDb()));
            lt.row(FigureText.LISTENER_A_WEIGHTED, FigureText.f1(l.aWeightedSnrDb()));
            b.append(lt.render("  "));
        });
        b.append("\nDefinitions:\n");
        for (String line : FigureText.definitions()) {
            b.append("  ").append(line).append('\n');
        }
        rest(b, s);
        return b.toString();
    }

    private static TextTable settings(BuildSummary s) {
        TextTable t = new TextTable("setting", "value");
        for (HtmlReport.Setting row : SoundTables.settings(s, "  ")) {
            t.row(row.key(), row.value());
        }
        return t;
    }

    private static void quality(StringBuilder b, BuildSummary s) {
        b.append("\nQuality, quantization only (the codes' levels against the conditioned source at the target"
                + " rate, gain and offset aligned):\n");
        QualityReport first = s.quality().get(0);
        TextTable q = new TextTable("case", "SINAD dB",
                "SNR dB <" + Units.format(first.inBandCutoffHz(), "Hz"), "A-wtd SNR dB",
                FigureText.ENOB_FULL_SCALE, FigureText.ENOB_SIGNAL);
        for (QualityReport r : s.quality()) {
            q.row(r.label(), FigureText.f1(r.sinadDb()), FigureText.f1(r.inBandSnrDb()),
                    FigureText.f1(r.aWeightedSnrDb()),
                    FigureText.f2(r.enobFullScaleBits()), FigureText.f2(r.enobSignalBits()));
        }
        b.append(q.render("  "));
        s.shapingGainDb().ifPresent(g -> b.append(String.format(Locale.ROOT,
                "  noise shaping (%s) %s %.1f dB of in-band SNR against flat quantization%n", s.shaping(),
                g >= 0 ? "wins" : "loses", Math.abs(g))));
        if (s.tone().isPresent()) {
            ToneReport tr = s.tone().get();
            b.append(String.format(Locale.ROOT, "  single tone at %s: SINAD %.1f dB, SNR %.1f dB, THD %s,"
                    + " SFDR %s, %s %.2f bits, %s %.2f bits (IEEE 1241 sine fit and spectrum)%n",
                    Units.format(tr.fundamentalHz(), "Hz"), tr.sinadDb(), tr.snrDb(), FigureText.thdExplained(tr),
                    FigureText.sfdrExplained(tr), FigureText.ENOB_FULL_SCALE, tr.enobFullScaleBits(),
                    FigureText.ENOB_SIGNAL, tr.enobSignalBits()));
        }
    }

    /** Preview, firmware, files and warnings. */
    private static void rest(StringBuilder b, BuildSummary s) {
        BuildSummary.PreviewInfo p = s.preview();
        String filter = p.filter().equals("none") ? "no reconstruction filter" : p.filter();
        b.append(String.format(Locale.ROOT, "%nPreview (preview.wav at %s): the board's levels, zero-order hold,"
                + " %s; the hold alone droops %.2f dB at %s%n", Units.format(p.rateHz(), "Hz"), filter,
                p.zohDroopDb(), Units.format(p.passbandTopHz(), "Hz")));
        if (!s.firmware().isEmpty()) {
            b.append("\nFirmware:\n");
            for (String line : s.firmware()) {
                b.append("  ").append(line).append('\n');
            }
        }
        b.append("\nFiles:\n");
        for (Path f : s.files()) {
            b.append("  ").append(f).append('\n');
        }
        List<String> warnings = FigureText.soundWarnings(s);
        if (!warnings.isEmpty()) {
            b.append("\nWarnings:\n");
            for (String w : warnings) {
                b.append("  - ").append(w).append('\n');
            }
        }
    }

    /** One line of stage timings, for --verbose: "stage timings: decode 120 ms, condition 80 ms, ...". */
    public static String timings(BuildSummary s) {
        StringBuilder b = new StringBuilder("stage timings:");
        s.stageMillis().forEach((k, v) -> b.append(String.format(Locale.ROOT, " %s %.0f ms,", k, v)));
        b.setLength(b.length() - 1);
        return b.toString();
    }

    /**
     * The JSON report ({@code docs/json.md}, {@code docs/schema/build.schema.json}); paths are relative to the
     * build's output folder.
     */
    public static Map<String, Object> json(BuildSummary s) {
        return BuildJson.of(s);
    }
}
