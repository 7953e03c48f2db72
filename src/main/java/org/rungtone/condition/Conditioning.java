package org.rungtone.condition;

import java.util.OptionalDouble;
import org.rungtone.internal.Checks;
import org.rungtone.internal.Setting;

/**
 * What to do to a source before quantizing it, applied in this order: DC removal, silence trimming,
 * resampling, gain or peak normalization, fades.
 *
 * @param removeDc subtract the mean
 * @param trimBelowDbfs trim leading and trailing samples whose level stays below this many dBFS (empty: keep)
 * @param targetRateHz the sample rate to produce
 * @param gainDb fixed gain in dB (empty: none); exclusive with normalizeDbfs
 * @param normalizeDbfs scale so the peak reaches this level in dBFS (empty: none)
 * @param fadeInSeconds linear fade-in length
 * @param fadeOutSeconds linear fade-out length
 */
public record Conditioning(boolean removeDc, OptionalDouble trimBelowDbfs, double targetRateHz,
        OptionalDouble gainDb, OptionalDouble normalizeDbfs, double fadeInSeconds, double fadeOutSeconds) {

    /** Validates the settings. */
    public Conditioning {
        Checks.checkInput(Double.isFinite(targetRateHz) && targetRateHz >= 1 && targetRateHz <= 384_000,
                "target rate must be 1 Hz..384 kHz: %s Hz", targetRateHz);
        if (gainDb.isPresent() && normalizeDbfs.isPresent()) {
            throw Setting.GAIN.problem("give either %s or %s, not both", Setting.GAIN.ref(), Setting.NORMALIZE.ref());
        }
        Checks.checkInput(fadeInSeconds >= 0 && fadeOutSeconds >= 0, "fade lengths must not be negative");
        gainDb.ifPresent(g -> Checks.checkInput(Double.isFinite(g) && Math.abs(g) <= 120,
                "gain must be within ±120 dB: %s", g));
        normalizeDbfs.ifPresent(n -> Checks.checkInput(n <= 0 && n >= -120,
                "normalize level must be -120..0 dBFS: %s", n));
        trimBelowDbfs.ifPresent(t -> Checks.checkInput(t < 0 && t >= -160,
                "trim threshold must be below 0 dBFS: %s", t));
    }

    /** Plain conversion to a rate: DC removed, peak normalized to −1 dBFS, nothing else. */
    public static Conditioning toRate(double targetRateHz) {
        return new Conditioning(true, OptionalDouble.empty(), targetRateHz, OptionalDouble.empty(),
                OptionalDouble.of(-1.0), 0, 0);
    }
}
