package org.rungtone.firmware;

import java.util.Arrays;
import java.util.Objects;
import java.util.Optional;
import org.rungtone.codec.TreadStream;
import org.rungtone.internal.Checks;
import org.rungtone.quantize.Codes;

/**
 * One sound of a firmware project: its name (made into a C symbol), its codes, its loop points and, for the
 * Tread stores, the stream the player decodes those codes from.
 *
 * @param name the user's name for the sound; {@link CNames#symbol} turns it into a C symbol
 * @param codes the DAC codes (for a Tread store, what its stream decodes to)
 * @param loopStart first sample of the loop (used by {@link PlaybackEngine#LOOP})
 * @param loopEnd one past the last sample of the loop; the loop replays samples loopStart .. loopEnd − 1
 * @param stream the Tread stream whose decoded codes are {@code codes}, if the sound was encoded
 */
public record SoundClip(String name, Codes codes, int loopStart, int loopEnd, Optional<TreadStream> stream) {
    /**
     * Checks the loop points and that the stream decodes to the codes.
     *
     * @throws IllegalArgumentException when the stream does not decode to the codes
     */
    public SoundClip {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(codes, "codes");
        Objects.requireNonNull(stream, "stream");
        Checks.checkInput(codes.length() > 0, "sound '%s' has no samples", name);
        Checks.checkInput(loopStart >= 0 && loopStart < loopEnd && loopEnd <= codes.length(),
                "sound '%s': loop %d..%d must satisfy 0 <= start < end <= %d (samples)", name, loopStart,
                loopEnd, codes.length());
        stream.ifPresent(s -> Checks.checkArgument(s.ladderBits() == codes.bits()
                && s.sampleRateHz() == codes.sampleRateHz() && Arrays.equals(s.decoded().unsafeCodes(),
                        codes.unsafeCodes()), "sound '%s': its Tread stream does not decode to its codes", name));
    }

    /** A sound without a stream. */
    public SoundClip(String name, Codes codes, int loopStart, int loopEnd) {
        this(name, codes, loopStart, loopEnd, Optional.empty());
    }

    /** A sound whose loop, if looped, is the whole sound. */
    public static SoundClip of(String name, Codes codes) {
        return new SoundClip(name, codes, 0, codes.length());
    }

    /** A sound stored as its Tread stream: its codes are what the stream decodes to. */
    public static SoundClip encoded(String name, TreadStream stream, int loopStart, int loopEnd) {
        return new SoundClip(name, stream.decoded(), loopStart, loopEnd, Optional.of(stream));
    }

    /** True when the loop covers the whole sound. */
    public boolean loopsWhole() {
        return loopStart == 0 && loopEnd == codes.length();
    }
}
