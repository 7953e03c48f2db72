package org.rungtone.project;

import java.nio.file.Path;
import java.util.Optional;
import java.util.OptionalDouble;
import org.rungtone.analysis.ReconstructionFilter;
import org.rungtone.condition.Resampler;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.internal.Checks;
import org.rungtone.ladder.LevelTable;
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
 * @param board the levels the real board produces (modelled ladder or measured unit profile), if known
 * @param compensate quantize onto the board's real levels (true) or emit plain binary codes (false)
 * @param filter the reconstruction filter after the DAC, for the preview and the in-band figures
 * @param previewRateHz the preview WAV's sample rate (44.1 or 48 kHz)
 * @param firmware the player to emit around the samples (everything but the sounds), or empty for the
 *     sample array alone
 * @param loop loop points of a looped sound
 * @param flashBudgetBytes the most flash the samples may take, 0 for no limit
 * @param previewSeconds the longest preview rendered (the first seconds of the sound); infinite for all
 */
public record BuildPlan(Path source, int channel, String symbol, Path outDir, int bits, OptionalDouble rateHz,
        Dither dither, ErrorFilter shaping, long seed, boolean removeDc, OptionalDouble trimDbfs,
        OptionalDouble gainDb, OptionalDouble normalizeDbfs, double fadeInSeconds, double fadeOutSeconds,
        String resampler, double fullScaleVolts, String flashQualifier, Optional<LevelTable> board,
        boolean compensate, ReconstructionFilter filter, double previewRateHz, Optional<FirmwareRequest> firmware,
        Optional<LoopSpan> loop, long flashBudgetBytes, double previewSeconds) {

    /** Longest preview by default: a minute is plenty to listen to; longer sounds are measured whole. */
    public static final double DEFAULT_PREVIEW_SECONDS = 60;

    /** Default sample rate when neither the user nor a script names one. */
    public static final double DEFAULT_RATE_HZ = 16_000;

    /** Validates the plan. */
    public BuildPlan {
        Checks.checkBits(bits);
        rateHz.ifPresent(r -> Checks.checkInput(Double.isFinite(r) && r >= 1 && r <= 384_000,
                "--rate must be 1 Hz..384 kHz: %s", r));
        Checks.checkInput(channel >= 0 && channel <= 8, "--channel must be 0 (mix down) or 1..8: %d", channel);
        Resampler.named(resampler, bits); // refuses an unknown name while the plan is made
        Checks.checkInput(Double.isFinite(fullScaleVolts) && fullScaleVolts > 0,
                "--full-scale must be a positive voltage: %s", fullScaleVolts);
        board.ifPresent(t -> Checks.checkInput(t.bits() == bits, "the board's level table has %d bits but --bits"
                + " is %d", t.bits(), bits));
        Checks.checkInput(previewSeconds > 0, "--preview-length must be positive: %s", previewSeconds);
        Checks.checkInput(flashBudgetBytes >= 0, "the flash budget (%s) must be positive: %d",
                "--flash-budget or target.flash_budget", flashBudgetBytes);
        Checks.checkInput(previewRateHz == 44_100 || previewRateHz == 48_000,
                "--preview-rate must be 44.1k or 48k: %s", previewRateHz);
    }

    /** A plan for the ideal ladder, no reconstruction filter, preview at 44.1 kHz. */
    public BuildPlan(Path source, int channel, String symbol, Path outDir, int bits, OptionalDouble rateHz,
            Dither dither, ErrorFilter shaping, long seed, boolean removeDc, OptionalDouble trimDbfs,
            OptionalDouble gainDb, OptionalDouble normalizeDbfs, double fadeInSeconds, double fadeOutSeconds,
            String resampler, double fullScaleVolts, String flashQualifier) {
        this(source, channel, symbol, outDir, bits, rateHz, dither, shaping, seed, removeDc, trimDbfs, gainDb,
                normalizeDbfs, fadeInSeconds, fadeOutSeconds, resampler, fullScaleVolts, flashQualifier,
                Optional.empty(), true, ReconstructionFilter.none(), 44_100, Optional.empty(), Optional.empty(), 0,
                DEFAULT_PREVIEW_SECONDS);
    }

    /** The same plan on a board with these real levels. */
    public BuildPlan withBoard(LevelTable levels, boolean compensateOnIt) {
        return new BuildPlan(source, channel, symbol, outDir, bits, rateHz, dither, shaping, seed, removeDc,
                trimDbfs, gainDb, normalizeDbfs, fadeInSeconds, fadeOutSeconds, resampler, fullScaleVolts,
                flashQualifier, Optional.of(levels), compensateOnIt, filter, previewRateHz, firmware, loop,
                flashBudgetBytes, previewSeconds);
    }

    /** The same plan with another reconstruction filter and preview rate. */
    public BuildPlan withPreview(ReconstructionFilter newFilter, double newPreviewRateHz) {
        return new BuildPlan(source, channel, symbol, outDir, bits, rateHz, dither, shaping, seed, removeDc,
                trimDbfs, gainDb, normalizeDbfs, fadeInSeconds, fadeOutSeconds, resampler, fullScaleVolts,
                flashQualifier, board, compensate, newFilter, newPreviewRateHz, firmware, loop, flashBudgetBytes,
                previewSeconds);
    }

    /** The same plan with a player, loop points and flash budget. */
    public BuildPlan withFirmware(Optional<FirmwareRequest> player, Optional<LoopSpan> loopPoints,
            long budgetBytes) {
        return new BuildPlan(source, channel, symbol, outDir, bits, rateHz, dither, shaping, seed, removeDc,
                trimDbfs, gainDb, normalizeDbfs, fadeInSeconds, fadeOutSeconds, resampler, fullScaleVolts,
                flashQualifier, board, compensate, filter, previewRateHz, player, loopPoints, budgetBytes,
                previewSeconds);
    }

    /** The same plan with another preview length limit (infinite: the whole sound). */
    public BuildPlan withPreviewSeconds(double seconds) {
        return new BuildPlan(source, channel, symbol, outDir, bits, rateHz, dither, shaping, seed, removeDc,
                trimDbfs, gainDb, normalizeDbfs, fadeInSeconds, fadeOutSeconds, resampler, fullScaleVolts,
                flashQualifier, board, compensate, filter, previewRateHz, firmware, loop, flashBudgetBytes, seconds);
    }
}
