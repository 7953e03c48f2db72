package org.rungtone.condition;

import java.util.OptionalDouble;
import org.rungtone.internal.Checks;
import org.rungtone.internal.Setting;
import org.rungtone.internal.Units;

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

    /**
     * Validates the settings.
     *
     * @throws org.rungtone.internal.SettingError naming the gain, level, trim or fade setting at fault
     * @throws org.rungtone.internal.InputError when the target rate is outside 1 Hz..384 kHz
     */
    public Conditioning {
        Checks.checkInput(Double.isFinite(targetRateHz) && targetRateHz >= 1 && targetRateHz <= 384_000,
                "target rate must be 1 Hz..384 kHz: %s Hz", targetRateHz);
        if (gainDb.isPresent() && normalizeDbfs.isPresent()) {
            throw Setting.GAIN.problem("give either %s or %s, not both", Setting.GAIN.ref(), Setting.NORMALIZE.ref());
        }
        checkFade(Setting.FADE_IN, fadeInSeconds);
        checkFade(Setting.FADE_OUT, fadeOutSeconds);
        gainDb.ifPresent(g -> Setting.GAIN.check(Double.isFinite(g) && Math.abs(g) <= 120,
                "must be within ±120 dB: %s", g));
        normalizeDbfs.ifPresent(n -> Setting.NORMALIZE.check(n <= 0 && n >= -120,
                "must be -120..0 dBFS: %s", n));
        trimBelowDbfs.ifPresent(t -> Setting.TRIM.check(t < 0 && t >= -160,
                "must be below 0 dBFS (at least -160): %s", t));
    }

    private static void checkFade(Setting fade, double seconds) {
        fade.check(seconds >= 0 && seconds < Double.POSITIVE_INFINITY, "must be a finite time of 0 s or more: %s",
                Double.isFinite(seconds) ? Units.format(seconds, "s") : Double.toString(seconds));
    }

    /** Plain conversion to a rate: DC removed, peak normalized to −1 dBFS, nothing else. */
    public static Conditioning toRate(double targetRateHz) {
        return new Conditioning(true, OptionalDouble.empty(), targetRateHz, OptionalDouble.empty(),
                OptionalDouble.of(-1.0), 0, 0);
    }
}
