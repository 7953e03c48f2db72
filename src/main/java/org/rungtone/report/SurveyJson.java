package org.rungtone.report;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import org.rungtone.analysis.SurveyResult;
import org.rungtone.analysis.SurveyRow;
import org.rungtone.analysis.SurveyTarget;

/**
 * The survey report for machines ({@code docs/schema/survey.schema.json}): how the survey ran, one row per
 * bit depth and rate, the chosen row and the recommendation.
 */
final class SurveyJson {
    private SurveyJson() {
    }

    /** The whole report; paths are relative to the survey's output folder. */
    static Map<String, Object> of(SurveyResult result, SurveyReport.Context c) {
        SurveyReport.Facts f = c.facts();
        Path base = f.outDir();
        Map<String, Object> m = Json.header("survey", c.toolVersion());
        m.put("source", SoundJson.source(f.source(), c.sourceLayout(), base));
        m.put("conditioning", SoundJson.conditioning(f.conditioning(), c.conditioning()));
        Map<String, Object> resampler = new LinkedHashMap<>();
        resampler.put("kind", f.resampler().key());
        resampler.put("description", c.resampler());
        m.put("resampler", resampler);
        m.put("levels", SoundJson.levels(f.deepestLevels(), c.levels()));
        m.put("dither", c.dither());
        m.put("shaping", c.shaping());
        m.put("seed", c.seed());
        Map<String, Object> filter = SoundJson.filter(f.filter());
        filter.put("description", c.filter());
        m.put("filter", filter);
        Map<String, Object> target = null;
        if (result.target() != null) {
            target = new LinkedHashMap<>();
            target.put("figure", result.target().kind() == SurveyTarget.Kind.SINAD_DB ? "sinad_db"
                    : "enob_full_scale_bits");
            target.put("value", result.target().value());
        }
        m.put("target", target);
        m.put("flash_budget_bytes", result.flashBudgetBytes());
        m.put("packed", result.packed());
        m.put("rows", result.rows().stream().map(r -> row(r, c.previews())).toList());
        m.put("chosen", result.chosen().map(r -> row(r, c.previews())).orElse(null));
        m.put("recommendation", SurveyReport.recommendation(result));
        m.put("files", Json.paths(c.files(), base));
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
        m.put("heard_signal_to_error_db", r.listenerSnrDb());
        m.put("heard_a_weighted_signal_to_error_db", r.listenerAWeightedSnrDb());
        m.put("clipped_samples", r.clippedSamples());
        m.put("flash_bytes_unpacked", r.flashBytesUnpacked());
        m.put("flash_bytes_packed", r.flashBytesPacked());
        m.put("fits", r.fits());
        m.put("reaches_target", r.reachesTarget());
        m.put("chosen", r.chosen());
        m.put("storage", r.codec().map(f -> f.optionName()).orElse(null));
        m.put("preview", previews ? "previews/" + SurveyReport.previewFileName(r) : null);
        return m;
    }
}
