package org.rungtone.report;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import org.rungtone.analysis.SeamlessLoop;
import org.rungtone.internal.Units;

/** How the reports show a loop found in a sound: one line for people, one JSON object for machines. */
final class LoopFigures {
    private LoopFigures() {
    }

    /**
     * "samples 1920 .. 30320 (28400 samples, 1.775 s), period 36.364 samples (440.00 Hz, 781 periods), seam
     * 66.0 dB below the signal after a 128-sample linear crossfade; preview.wav plays it 4 times".
     */
    static String line(SeamlessLoop l, double rateHz) {
        return String.format(Locale.ROOT, "samples %d .. %d (%d samples, %.3f s), period %.3f samples (%s, %d"
                + " periods), seam %.1f dB below the signal after a %d-sample linear crossfade; preview.wav plays"
                + " it %d times", l.start(), l.end(), l.lengthSamples(), l.lengthSamples() / rateHz,
                l.periodSamples(), Units.format(l.pitchHz(rateHz), "Hz"), l.periods(), -l.seamLevelDb(),
                l.crossfadeSamples(), SeamlessLoop.PREVIEW_PASSES);
    }

    /** The JSON object: points and length in samples and seconds, period, seam level (dB, negative), crossfade. */
    static Map<String, Object> json(SeamlessLoop l, double rateHz) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("start_sample", l.start());
        m.put("end_sample", l.end());
        m.put("length_samples", l.lengthSamples());
        m.put("start_s", l.start() / rateHz);
        m.put("length_s", l.lengthSamples() / rateHz);
        m.put("period_samples", l.periodSamples());
        m.put("pitch_hz", l.pitchHz(rateHz));
        m.put("periods", l.periods());
        m.put("seam_db", l.seamLevelDb());
        m.put("crossfade_samples", l.crossfadeSamples());
        m.put("crossfade_shape", "linear");
        m.put("preview_passes", SeamlessLoop.PREVIEW_PASSES);
        return m;
    }
}
