package org.rungtone.firmware;

import java.util.Objects;
import org.rungtone.internal.Checks;
import org.rungtone.quantize.Codes;

/**
 * One sound of a firmware project: its name (made into a C symbol), its codes and its loop points.
 *
 * @param name the user's name for the sound; {@link CNames#symbol} turns it into a C symbol
 * @param codes the DAC codes
 * @param loopStart first sample of the loop (used by {@link PlaybackEngine#LOOP})
 * @param loopEnd one past the last sample of the loop; the loop replays samples loopStart .. loopEnd − 1
 */
public record SoundClip(String name, Codes codes, int loopStart, int loopEnd) {
    /** Checks the loop points. */
    public SoundClip {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(codes, "codes");
        Checks.checkInput(codes.length() > 0, "sound '%s' has no samples", name);
        Checks.checkInput(loopStart >= 0 && loopStart < loopEnd && loopEnd <= codes.length(),
                "sound '%s': loop %d..%d must satisfy 0 <= start < end <= %d (samples)", name, loopStart,
                loopEnd, codes.length());
    }

    /** A sound whose loop, if looped, is the whole sound. */
    public static SoundClip of(String name, Codes codes) {
        return new SoundClip(name, codes, 0, codes.length());
    }

    /** True when the loop covers the whole sound. */
    public boolean loopsWhole() {
        return loopStart == 0 && loopEnd == codes.length();
    }
}
