package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;
import org.rungtone.codec.TreadFormat;
import org.rungtone.codec.TreadState;
import org.rungtone.codec.TreadStream;
import org.rungtone.internal.Checks;
import org.rungtone.internal.Setting;

/**
 * The Tread part of a player: the format, every sound's Tread codes one after the other, and the reset points
 * the player loads a decoder state from: each sound's start, then (loop engine) each sound's loop start, in
 * sound order (docs/tread.md).
 *
 * @param format the format
 * @param codes the Tread codes of every sound, in sound order
 * @param resets the decoder states of the reset points
 * @param compact true when the codes fit a byte (N &lt;= 8): the player then expands STEP and ADAPT into one
 *     table of a difference and the next row per step index and magnitude, and keeps its state in bytes
 * @param tableBytes flash bytes of the decoder's tables and reset points
 */
record TreadPlan(TreadFormat format, int[] codes, List<TreadState> resets, boolean compact, long tableBytes) {
    /**
     * The plan of a Tread store.
     *
     * @throws org.rungtone.internal.SettingError when the engine cannot play a Tread stream, or a sound is
     *     shorter than one block
     * @throws IllegalArgumentException when a sound carries no stream of this format and depth
     */
    static TreadPlan of(TreadFormat format, PlaybackEngine engine, List<SoundClip> sounds, int bits) {
        Refusal.check(Setting.STORAGE, engine != PlaybackEngine.DDS, "the dds engine reads its wavetable at any"
                + " phase, but a Tread stream (%s %s) decodes only forwards; use %s unpacked or packed",
                Setting.STORAGE.ref(), format.optionName(), Setting.STORAGE.ref());
        format.checkLadderBits(bits);
        long total = 0;
        for (SoundClip s : sounds) {
            Refusal.check(Setting.STORAGE, s.codes().length() >= TreadFormat.BLOCK_CODES, "sound '%s' has %d"
                    + " samples, fewer than one %s block (%d samples in %d bytes); give it at least %d samples,"
                    + " or use %s packed", s.name(), s.codes().length(), format.optionName(),
                    TreadFormat.BLOCK_CODES, format.codeBits(), TreadFormat.BLOCK_CODES, Setting.STORAGE.ref());
            TreadStream t = s.stream().orElseThrow(() -> new IllegalArgumentException("sound '" + s.name()
                    + "' has no Tread stream; encode it (TreadEncoder) for " + format.optionName() + " storage"));
            Checks.checkArgument(t.format() == format && t.ladderBits() == bits, "sound '%s' is %s to %d bits,"
                    + " not %s to %d bits", s.name(), t.format().optionName(), t.ladderBits(), format.optionName(),
                    bits);
            total += t.length();
        }
        int[] codes = new int[(int) total];
        List<TreadState> resets = new ArrayList<>();
        int at = 0;
        for (SoundClip s : sounds) {
            TreadStream t = s.stream().orElseThrow();
            System.arraycopy(t.unsafeCodes(), 0, codes, at, t.length());
            at += t.length();
            resets.add(t.start());
        }
        if (engine == PlaybackEngine.LOOP) {
            for (SoundClip s : sounds) {
                resets.add(s.stream().orElseThrow().stateAt(s.loopStart()));
            }
        }
        long tables = format.playerTableBytes(bits) + TreadFormat.resetBytes(bits) * resets.size();
        return new TreadPlan(format, codes, List.copyOf(resets), bits <= 8, tables);
    }

    /** The packed stream: code i at stream bits i·b .. i·b + b − 1, LSB first. */
    byte[] streamBytes() {
        return SamplePacking.pack(codes, format.codeBits());
    }
}
