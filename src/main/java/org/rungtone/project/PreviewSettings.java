package org.rungtone.project;

import org.rungtone.analysis.ReconstructionFilter;
import org.rungtone.internal.Setting;

/**
 * What the preview and the figures model after the DAC.
 *
 * @param filter the reconstruction filter after the DAC, for the preview and the in-band figures
 * @param rateHz the preview WAV's sample rate (44.1 or 48 kHz)
 * @param seconds the longest preview rendered (the first seconds of the sound); infinite for all
 * @param fullScaleVolts the ideal DAC's reference voltage, for reports
 */
public record PreviewSettings(ReconstructionFilter filter, double rateHz, double seconds, double fullScaleVolts) {
    /** Validates the settings. */
    public PreviewSettings {
        Setting.PREVIEW_RATE.check(rateHz == 44_100 || rateHz == 48_000, "must be 44.1k or 48k: %s", rateHz);
        Setting.PREVIEW_LENGTH.check(seconds > 0, "must be positive: %s", seconds);
        Setting.FULL_SCALE.check(Double.isFinite(fullScaleVolts) && fullScaleVolts > 0,
                "must be a positive voltage: %s", fullScaleVolts);
    }
}
