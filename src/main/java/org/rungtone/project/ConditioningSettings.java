package org.rungtone.project;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import org.rungtone.condition.Conditioning;
import org.rungtone.condition.ResamplerKind;
import org.rungtone.internal.Setting;

/**
 * How one sound is conditioned before quantizing.
 *
 * @param rateHz target sample rate; empty means the script's declared rate, else {@link Defaults#RATE_HZ}
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
    /**
     * Validates the rate and, through the conditioning they make, the level, trim and fade settings.
     *
     * @throws org.rungtone.internal.SettingError naming the setting at fault
     */
    public ConditioningSettings {
        rateHz.ifPresent(r -> Setting.RATE.check(Double.isFinite(r) && r >= 1 && r <= 384_000,
                "must be 1 Hz..384 kHz: %s", r));
        if (gainDb.isEmpty() || normalizeDbfs.isEmpty()) {
            // both together are refused where both are known, with the lines that set them
            new Conditioning(removeDc, trimDbfs, rateHz.orElse(Defaults.RATE_HZ), gainDb, normalizeDbfs,
                    fadeInSeconds, fadeOutSeconds);
        }
    }

    /** The conditioning stage's settings at {@code targetRateHz}. */
    public Conditioning at(double targetRateHz) {
        return new Conditioning(removeDc, trimDbfs, targetRateHz, gainDb, normalizeDbfs, fadeInSeconds,
                fadeOutSeconds);
    }

    /** The settings in words, for reports: "DC removed, normalized to -1.0 dBFS, trim below -50.0 dBFS". */
    public String describe() {
        List<String> parts = new ArrayList<>();
        parts.add(removeDc ? "DC removed" : "DC kept");
        trimDbfs.ifPresent(t -> parts.add(String.format(Locale.ROOT, "trim below %.1f dBFS", t)));
        gainDb.ifPresent(g -> parts.add(String.format(Locale.ROOT, "gain %+.1f dB", g)));
        normalizeDbfs.ifPresent(n -> parts.add(String.format(Locale.ROOT, "normalized to %.1f dBFS", n)));
        if (fadeInSeconds > 0 || fadeOutSeconds > 0) {
            parts.add(String.format(Locale.ROOT, "fades %.0f/%.0f ms", 1000 * fadeInSeconds, 1000 * fadeOutSeconds));
        }
        return String.join(", ", parts);
    }
}
