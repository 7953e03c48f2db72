package org.rungtone.report;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.rungtone.analysis.QualityReport;
import org.rungtone.analysis.ToneReport;
import org.rungtone.internal.FileNames;
import org.rungtone.internal.Units;

/** Renders a {@link BuildSummary} as text for people and as JSON for machines. */
public final class BuildReport {
    private BuildReport() {
    }

    private static String f1(double v) {
        return Double.isInfinite(v) ? (v > 0 ? "inf" : "-inf") : String.format(Locale.ROOT, "%.1f", v);
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
            lt.row(FigureText.LISTENER_SNR, f1(l.snrDb()));
            lt.row(FigureText.LISTENER_A_WEIGHTED, f1(l.aWeightedSnrDb()));
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
        t.row("source", FileNames.display(s.source()) + "  (" + s.sourceLayout() + ")");
        t.row("conditioning", s.conditioning());
        t.row("resampler", s.resampler());
        t.row("target", s.bits() + " bits at " + Units.format(s.rateHz(), "Hz") + ", "
                + s.samples() + " samples, " + String.format(Locale.ROOT, "%.3f s", s.durationSeconds()));
        t.row("dither / shaping", s.dither() + " / " + s.shaping() + "  (seed " + s.seed() + ")");
        t.row("levels played", s.ladder());
        t.row("C files hold", s.emittedCase());
        t.row("clipped samples", s.clippedSamples() + (s.samples() > 0 ? String.format(Locale.ROOT,
                "  (%.3f %%)", 100.0 * s.clippedSamples() / s.samples()) : ""));
        s.emitted().codeUse().ifPresent(u -> {
            t.row("end codes", FigureText.endCodes(u, "  "));
            if (u.shaped()) {
                t.row("shaping headroom", FigureText.headroom(u));
            }
        });
        t.row("flash", String.format(Locale.ROOT, "%,d bytes of samples", s.flashBytes()));
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
            q.row(r.label(), f1(r.sinadDb()), f1(r.inBandSnrDb()), f1(r.aWeightedSnrDb()),
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
        List<String> warnings = new ArrayList<>(s.warnings());
        if (p.peak() > 1) {
            warnings.add(String.format(Locale.ROOT, "the preview's filter rings %.1f %% past full scale;"
                    + " the preview WAV clips there", 100 * (p.peak() - 1)));
        }
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

    static Map<String, Object> quality(QualityReport r) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("case", r.label());
        m.put("sinad_db", r.sinadDb());
        m.put("in_band_snr_db", r.inBandSnrDb());
        m.put("in_band_cutoff_hz", r.inBandCutoffHz());
        m.put("a_weighted_snr_db", r.aWeightedSnrDb());
        m.put("enob_full_scale_bits", r.enobFullScaleBits());
        m.put("enob_signal_bits", r.enobSignalBits());
        m.put("error_rms_dbfs", r.errorRmsDbfs());
        m.put("reference_rms_dbfs", r.referenceRmsDbfs());
        r.codeUse().ifPresent(u -> {
            Map<String, Object> um = new LinkedHashMap<>();
            um.put("end_code_samples", u.endCodeSamples());
            um.put("end_code_fraction", u.endCodeFraction());
            um.put("overload_samples", u.overloadSamples());
            um.put("headroom_gain_db", u.headroomGainDb());
            um.put("headroom_kept", u.headroomKept());
            um.put("feedback_excursion_lsb", u.feedbackExcursionLsb());
            m.put("code_use", um);
        });
        r.listener().ifPresent(l -> {
            Map<String, Object> lm = new LinkedHashMap<>();
            lm.put("snr_db", l.snrDb());
            lm.put("a_weighted_snr_db", l.aWeightedSnrDb());
            lm.put("band_low_hz", l.bandLowHz());
            lm.put("band_top_hz", l.bandTopHz());
            lm.put("analysis_rate_hz", l.analysisRateHz());
            lm.put("analysed_s", l.analysedSeconds());
            lm.put("delay_s", l.delaySeconds());
            m.put("listener", lm);
        });
        return m;
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
        m.put("emitted_case", s.emittedCase());
        m.put("clipped_samples", s.clippedSamples());
        m.put("snr_db", s.emitted().sinadDb());
        m.put("quality", s.quality().stream().map(BuildReport::quality).toList());
        s.shapingGainDb().ifPresent(g -> m.put("shaping_in_band_gain_db", g));
        s.tone().ifPresent(t -> {
            Map<String, Object> tm = new LinkedHashMap<>();
            tm.put("fundamental_hz", t.fundamentalHz());
            tm.put("sinad_db", t.sinadDb());
            tm.put("snr_db", t.snrDb());
            tm.put("thd_db", t.thdDb());
            tm.put("thd_below_noise", t.thdBelowNoise());
            tm.put("sfdr_db", t.sfdrDb());
            tm.put("sfdr_limited_by_noise", t.sfdrLimitedByNoise());
            tm.put("enob_full_scale_bits", t.enobFullScaleBits());
            tm.put("enob_signal_bits", t.enobSignalBits());
            m.put("tone", tm);
        });
        Map<String, Object> pm = new LinkedHashMap<>();
        pm.put("filter", s.preview().filter());
        pm.put("rate_hz", s.preview().rateHz());
        pm.put("zoh_droop_db", s.preview().zohDroopDb());
        pm.put("droop_at_hz", s.preview().passbandTopHz());
        pm.put("peak", s.preview().peak());
        m.put("preview", pm);
        m.put("firmware", s.firmware());
        m.put("flash_bytes", s.flashBytes());
        m.put("files", s.files().stream().map(Path::toString).toList());
        m.put("warnings", List.copyOf(s.warnings()));
        m.put("stage_ms", s.stageMillis());
        return m;
    }
}
