package org.rungtone.project;

import java.util.OptionalDouble;
import org.rungtone.condition.Conditioning;
import org.rungtone.condition.ResamplerKind;
import org.rungtone.internal.Setting;

/**
 * How one sound is conditioned before quantizing.
 *
 * @param rateHz target sample rate; empty means the script's declared rate, else {@link BuildPlan#DEFAULT_RATE_HZ}
 * @param removeDc subtract the mean before anything else
 * @param trimDbfs trim leading/trailing audio below this level
 * @param gainDb fixed gain
 * @param normalizeDbfs peak normalization target
 * @param fadeInSeconds fade-in
 * @param fadeOutSeconds fade-out
 * @param resampler the resampler design
 */
public record ConditioningSettings(OptionalDouble rateHz, boolean removeDc, OptionalDouble trimDbfs,
        OptionalDouble gainDb, OptionalDouble normalizeDbfs, double fadeInSeconds, double fadeOutSeconds,
        ResamplerKind resampler) {
    /** Validates the rate. */
    public ConditioningSettings {
        rateHz.ifPresent(r -> Setting.RATE.check(Double.isFinite(r) && r >= 1 && r <= 384_000,
                "must be 1 Hz..384 kHz: %s", r));
    }

    /** The conditioning stage's settings at {@code targetRateHz}. */
    public Conditioning at(double targetRateHz) {
        return new Conditioning(removeDc, trimDbfs, targetRateHz, gainDb, normalizeDbfs, fadeInSeconds,
                fadeOutSeconds);
    }
}
