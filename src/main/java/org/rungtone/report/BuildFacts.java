package org.rungtone.report;

import java.nio.file.Path;
import java.util.Optional;
import org.rungtone.analysis.ReconstructionFilter;
import org.rungtone.condition.ResamplerKind;
import org.rungtone.firmware.FirmwareFacts;
import org.rungtone.ladder.LevelTable;

/**
 * What a build report states beyond its figures, as values for machine-readable reports: the source, the
 * conditioning, the levels played, the preview filter, the firmware, and the folder every path is relative to.
 *
 * @param source what was read
 * @param conditioning how it was conditioned
 * @param resampler the resampler design chosen
 * @param levels the levels the board plays
 * @param board true when the levels are a board's (ladder model or unit profile), not the ideal ladder
 * @param compensated true when the codes were quantized onto the board's levels
 * @param filter the preview's reconstruction filter
 * @param firmware the player's facts, when a player was emitted for this sound alone
 * @param outDir the sound's output folder
 */
public record BuildFacts(SourceFacts source, ConditioningFacts conditioning, ResamplerKind resampler,
        LevelTable levels, boolean board, boolean compensated, ReconstructionFilter filter,
        Optional<FirmwareFacts> firmware, Path outDir) {
}
