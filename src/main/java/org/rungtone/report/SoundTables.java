package org.rungtone.report;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.rungtone.analysis.QualityReport;
import org.rungtone.analysis.ToneReport;
import org.rungtone.internal.FileNames;
import org.rungtone.internal.Units;
import org.rungtone.report.HtmlReport.Setting;

/** The key-value tables of one sound on the HTML page: how it was built, the tone, the listener, the preview. */
final class SoundTables {
    private SoundTables() {
    }

    /** How the sound was built, one space before each bracket. */
    static List<Setting> settings(BuildSummary s) {
        return settings(s, " ");
    }

    /** How the sound was built, as every report shows it; {@code gap} goes before each bracket. */
    static List<Setting> settings(BuildSummary s, String gap) {
        List<Setting> rows = new ArrayList<>();
        rows.add(new Setting("source", FileNames.display(s.source()) + gap + "(" + s.sourceLayout() + ")"));
        rows.add(new Setting("conditioning", s.conditioning()));
        rows.add(new Setting("resampler", s.resampler()));
        rows.add(new Setting("target", s.bits() + " bits at " + Units.format(s.rateHz(), "Hz") + ", "
                + s.samples() + " samples, " + String.format(Locale.ROOT, "%.3f s", s.durationSeconds())));
        rows.add(new Setting("dither / shaping", s.dither() + " / " + s.shaping() + gap + "(seed " + s.seed()
                + ")"));
        rows.add(new Setting("levels played", s.ladder()));
        rows.add(new Setting("C files hold", s.emittedCase()));
        rows.add(new Setting("clipped samples", s.clippedSamples() + (s.samples() > 0 ? gap + String.format(
                Locale.ROOT, "(%.3f %%)", 100.0 * s.clippedSamples() / s.samples()) : "")));
        s.emitted().codeUse().ifPresent(u -> {
            rows.add(new Setting("end codes", FigureText.endCodes(u, gap)));
            if (u.shaped()) {
                rows.add(new Setting("shaping headroom", FigureText.headroom(u)));
            }
        });
        rows.add(new Setting("flash", String.format(Locale.ROOT, "%,d bytes", s.flashBytes()) + " of samples"));
        s.autoLoop().ifPresent(l -> rows.add(new Setting("loop (found)", LoopFigures.line(l, s.rateHz()))));
        return rows;
    }

    /** The quantization-only figures of every case, the emitted (last) one marked. */
    static List<Map<String, Object>> quality(List<QualityReport> cases) {
        List<Map<String, Object>> quality = new ArrayList<>();
        for (int i = 0; i < cases.size(); i++) {
            QualityReport r = cases.get(i);
            Map<String, Object> q = new LinkedHashMap<>();
            q.put("label", r.label());
            q.put("emitted", i == cases.size() - 1);
            q.put("sinad", FigureText.f1(r.sinadDb()));
            q.put("inBandSnr", FigureText.f1(r.inBandSnrDb()));
            q.put("aWeightedSnr", FigureText.f1(r.aWeightedSnrDb()));
            q.put("enob", FigureText.f2(r.enobFullScaleBits()));
            q.put("enobSignal", FigureText.f2(r.enobSignalBits()));
            quality.add(q);
        }
        return quality;
    }

    /** What the listener gets, when it was measured (empty otherwise). */
    static List<Setting> listener(QualityReport emitted) {
        return emitted.listener().map(l -> List.of(
                new Setting(FigureText.LISTENER_SNR, FigureText.f1(l.snrDb()) + " dB"),
                new Setting(FigureText.LISTENER_A_WEIGHTED, FigureText.f1(l.aWeightedSnrDb()) + " dB")))
                .orElse(List.of());
    }

    /** The single-tone figures and harmonics. */
    static Map<String, Object> tone(ToneReport t) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("rows", rows(List.of(
                new Setting("fundamental", Units.format(t.fundamentalHz(), "Hz")),
                new Setting("amplitude", FigureText.f1(t.amplitudeDbfs()) + " dBFS"),
                new Setting("SINAD (sine fit)", FigureText.f1(t.sinadDb()) + " dB"),
                new Setting("SNR", FigureText.f1(t.snrDb()) + " dB"),
                new Setting("THD", FigureText.thdExplained(t)),
                new Setting("SFDR", FigureText.sfdrExplained(t)),
                new Setting(FigureText.ENOB_FULL_SCALE, FigureText.f2(t.enobFullScaleBits()) + " bits"),
                new Setting(FigureText.ENOB_SIGNAL, FigureText.f2(t.enobSignalBits()) + " bits"),
                new Setting("noise floor", FigureText.f1(t.noiseFloorDbfs()) + " dBFS"))));
        List<Map<String, Object>> harmonics = new ArrayList<>();
        for (ToneReport.Harmonic h : t.harmonics()) {
            Map<String, Object> hm = new LinkedHashMap<>();
            hm.put("order", Integer.toString(h.order()));
            hm.put("frequency", Units.format(h.frequencyHz(), "Hz"));
            hm.put("level", FigureText.harmonic(h));
            harmonics.add(hm);
        }
        m.put("harmonics", harmonics);
        m.put("hasHarmonics", !harmonics.isEmpty());
        return m;
    }

    /** The analog preview's settings. */
    static List<Setting> preview(BuildSummary.PreviewInfo p) {
        return List.of(
                new Setting("reconstruction filter", p.filter().equals("none") ? "none (the hold alone)"
                        : p.filter()),
                new Setting("preview WAV rate", Units.format(p.rateHz(), "Hz")),
                new Setting("zero-order-hold droop", String.format(Locale.ROOT, "%.2f dB at %s",
                        p.zohDroopDb(), Units.format(p.passbandTopHz(), "Hz"))),
                new Setting("peak", String.format(Locale.ROOT, "%.3f of full scale", p.peak())));
    }

    /** Settings as the template's key/value maps. */
    static List<Map<String, Object>> rows(List<Setting> settings) {
        List<Map<String, Object>> rows = new ArrayList<>();
        for (Setting s : settings) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("key", s.key());
            m.put("value", s.value());
            rows.add(m);
        }
        return rows;
    }
}
