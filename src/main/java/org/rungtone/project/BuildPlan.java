package org.rungtone.project;

import java.nio.file.Path;
import java.util.OptionalDouble;
import org.rungtone.internal.Checks;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;

/**
 * Everything one build of one sound needs, validated once, up front. Immutable.
 *
 * @param source the WAV file or .rung script
 * @param channel 0 to mix all channels down, 1..C to pick one
 * @param symbol the C symbol prefix (already sanitized)
 * @param outDir where the outputs go
 * @param bits DAC bit depth 1..16
 * @param rateHz target sample rate; empty means the script's declared rate, else 16 kHz
 * @param dither dither kind
 * @param shaping error-feedback filter
 * @param seed seed of every random process
 * @param removeDc subtract the mean before anything else
 * @param trimDbfs trim leading/trailing audio below this level
 * @param gainDb fixed gain
 * @param normalizeDbfs peak normalization target
 * @param fadeInSeconds fade-in
 * @param fadeOutSeconds fade-out
 * @param resampler "kaiser" (default) or "tarsos"
 * @param fullScaleVolts the ideal DAC's reference voltage, for reports
 * @param flashQualifier attribute that keeps arrays in flash
 */
public record BuildPlan(Path source, int channel, String symbol, Path outDir, int bits, OptionalDouble rateHz,
        Dither dither, ErrorFilter shaping, long seed, boolean removeDc, OptionalDouble trimDbfs,
        OptionalDouble gainDb, OptionalDouble normalizeDbfs, double fadeInSeconds, double fadeOutSeconds,
        String resampler, double fullScaleVolts, String flashQualifier) {

    /** Default sample rate when neither the user nor a script names one. */
    public static final double DEFAULT_RATE_HZ = 16_000;

    /** Validates the plan. */
    public BuildPlan {
        Checks.checkBits(bits);
        rateHz.ifPresent(r -> Checks.checkInput(Double.isFinite(r) && r >= 1 && r <= 384_000,
                "--rate must be 1 Hz..384 kHz: %s", r));
        Checks.checkInput(channel >= 0 && channel <= 8, "--channel must be 0 (mix down) or 1..8: %d", channel);
        Checks.checkInput(resampler.equals("kaiser") || resampler.equals("tarsos"),
                "--resampler must be kaiser or tarsos: %s", resampler);
        Checks.checkInput(Double.isFinite(fullScaleVolts) && fullScaleVolts > 0,
                "--full-scale must be a positive voltage: %s", fullScaleVolts);
    }
}
