package org.rungtone.report;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.rungtone.analysis.QualityReport;
import org.rungtone.analysis.ToneReport;

/**
 * The build report for machines ({@code docs/schema/build.schema.json}): a sound's settings, source and
 * conditioning, the figures of every ladder case, the preview, the firmware and the files, every figure named
 * for what it is and with its unit in its name.
 */
final class BuildJson {
    private BuildJson() {
    }

    /** The report of one build; paths are relative to its output folder. */
    static Map<String, Object> of(BuildSummary s) {
        Map<String, Object> m = Json.header("build", s.toolVersion());
        m.putAll(sound(s, s.facts().outDir()));
        return m;
    }

    /** One sound's fields, paths relative to {@code base} (the build's folder, or the project's). */
    static Map<String, Object> sound(BuildSummary s, Path base) {
        BuildFacts f = s.facts();
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("symbol", s.symbol());
        m.put("source", SoundJson.source(f.source(), s.sourceLayout(), base));
        m.put("bits", s.bits());
        m.put("rate_hz", s.rateHz());
        m.put("samples", s.samples());
        m.put("duration_s", s.durationSeconds());
        m.put("dither", s.dither());
        m.put("shaping", s.shaping());
        m.put("seed", s.seed());
        m.put("conditioning", SoundJson.conditioning(f.conditioning(), s.conditioning()));
        m.put("resampler", SoundJson.resampler(f.resampler(), s.resampler()));
        Map<String, Object> levels = SoundJson.levels(f.levels(), s.ladder());
        levels.put("board", f.board());
        levels.put("compensated", f.compensated());
        m.put("levels", levels);
        m.put("emitted_case", s.emittedCase());
        m.put("clipped_samples", s.clippedSamples());
        m.put("sinad_db", s.emitted().sinadDb());
        m.put("quality", s.quality().stream().map(BuildJson::quality).toList());
        m.put("shaping_in_band_gain_db", s.shapingGainDb().orElse(null));
        m.put("tone", s.tone().map(BuildJson::tone).orElse(null));
        m.put("auto_loop", s.autoLoop().map(l -> LoopFigures.json(l, s.rateHz())).orElse(null));
        Map<String, Object> pm = new LinkedHashMap<>();
        Map<String, Object> filter = SoundJson.filter(f.filter());
        filter.put("description", s.preview().filter());
        pm.put("filter", filter);
        pm.put("rate_hz", s.preview().rateHz());
        pm.put("zoh_droop_db", s.preview().zohDroopDb());
        pm.put("droop_at_hz", s.preview().passbandTopHz());
        pm.put("peak_full_scale", s.preview().peak());
        m.put("preview", pm);
        m.put("firmware", f.firmware().map(FirmwareJson::of).orElse(null));
        m.put("flash_bytes", s.flashBytes());
        m.put("files", Json.paths(s.files(), base));
        m.put("warnings", List.copyOf(s.warnings()));
        m.put("stage_ms", s.stageMillis());
        return m;
    }

    private static Map<String, Object> quality(QualityReport r) {
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
        m.put("code_use", r.codeUse().map(u -> {
            Map<String, Object> um = new LinkedHashMap<>();
            um.put("end_code_samples", u.endCodeSamples());
            um.put("end_code_fraction", u.endCodeFraction());
            um.put("overload_samples", u.overloadSamples());
            um.put("headroom_gain_db", u.headroomGainDb());
            um.put("headroom_kept", u.headroomKept());
            um.put("feedback_excursion_lsb", u.feedbackExcursionLsb());
            return um;
        }).orElse(null));
        m.put("listener", r.listener().map(l -> {
            Map<String, Object> lm = new LinkedHashMap<>();
            lm.put("signal_to_error_db", l.snrDb());
            lm.put("a_weighted_signal_to_error_db", l.aWeightedSnrDb());
            lm.put("band_low_hz", l.bandLowHz());
            lm.put("band_top_hz", l.bandTopHz());
            lm.put("analysis_rate_hz", l.analysisRateHz());
            lm.put("analyzed_s", l.analysedSeconds());
            lm.put("delay_s", l.delaySeconds());
            return lm;
        }).orElse(null));
        return m;
    }

    private static Map<String, Object> tone(ToneReport t) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("fundamental_hz", t.fundamentalHz());
        m.put("sinad_db", t.sinadDb());
        m.put("snr_db", t.snrDb());
        m.put("thd_db", t.thdDb());
        m.put("thd_below_noise", t.thdBelowNoise());
        m.put("sfdr_db", t.sfdrDb());
        m.put("sfdr_limited_by_noise", t.sfdrLimitedByNoise());
        m.put("enob_full_scale_bits", t.enobFullScaleBits());
        m.put("enob_signal_bits", t.enobSignalBits());
        return m;
    }
}
