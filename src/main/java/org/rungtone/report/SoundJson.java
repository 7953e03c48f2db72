package org.rungtone.report;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import org.rungtone.analysis.ReconstructionFilter;
import org.rungtone.condition.ResamplerKind;
import org.rungtone.internal.FileNames;
import org.rungtone.ladder.LevelTable;
import org.rungtone.source.WavFormat;

/** The parts of the build and survey JSON that describe a sound's source and how it was prepared. */
final class SoundJson {
    private SoundJson() {
    }

    /** The source: where it came from and what it held; {@code path} is null for standard input. */
    static Map<String, Object> source(SourceFacts s, String description, Path base) {
        Map<String, Object> m = new LinkedHashMap<>();
        boolean stdin = FileNames.isStandardInput(s.file());
        m.put("path", stdin ? null : Json.path(s.file(), base));
        m.put("standard_input", stdin);
        m.put("kind", s.kind());
        m.put("encoding", s.encoding().orElse(null));
        m.put("format_tag", s.wav().map(WavFormat::formatTag).orElse(null));
        m.put("bits_per_sample", s.wav().map(WavFormat::bitsPerSample).orElse(null));
        m.put("valid_bits", s.wav().map(WavFormat::validBits).orElse(null));
        m.put("channels", s.channels());
        m.put("channel", s.channel());
        m.put("rate_hz", s.rateHz());
        m.put("samples", s.samples());
        m.put("duration_s", s.durationSeconds());
        m.put("description", description);
        return m;
    }

    /** The conditioning settings and, for a build, what they did. */
    static Map<String, Object> conditioning(ConditioningFacts c, String description) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("dc_removed", c.dcRemoved());
        m.put("trim_below_dbfs", Json.orNull(c.trimBelowDbfs()));
        m.put("gain_db", Json.orNull(c.gainDb()));
        m.put("normalize_dbfs", Json.orNull(c.normalizeDbfs()));
        m.put("fade_in_s", c.fadeInSeconds());
        m.put("fade_out_s", c.fadeOutSeconds());
        c.applied().ifPresent(a -> {
            Map<String, Object> am = new LinkedHashMap<>();
            am.put("gain_db", a.gainDb());
            am.put("trimmed_start_s", a.trimmedStartSeconds());
            am.put("trimmed_end_s", a.trimmedEndSeconds());
            m.put("applied", am);
        });
        m.put("description", description);
        return m;
    }

    /** The resampler design and how it was used ("none" when the source was at the target rate already). */
    static Map<String, Object> resampler(ResamplerKind kind, String description) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("kind", kind.key());
        m.put("used", !description.equals("none"));
        m.put("description", description);
        return m;
    }

    /** A level table: where it came from and its span. */
    static Map<String, Object> levels(LevelTable t, String description) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("bits", t.bits());
        m.put("min_v", t.minVolts());
        m.put("max_v", t.maxVolts());
        m.put("description", description);
        return m;
    }

    /** The preview's reconstruction filter: its kind, and cutoff and Q where they apply. */
    static Map<String, Object> filter(ReconstructionFilter f) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("kind", f.kind().name().toLowerCase(Locale.ROOT));
        boolean any = f.kind() != ReconstructionFilter.Kind.NONE;
        m.put("cutoff_hz", any ? f.cutoffHz() : null);
        m.put("q", f.kind() == ReconstructionFilter.Kind.SECOND_ORDER ? f.q() : null);
        return m;
    }
}
