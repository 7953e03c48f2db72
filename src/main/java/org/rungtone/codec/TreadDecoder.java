package org.rungtone.codec;

import org.rungtone.internal.Checks;

/**
 * The reference Tread decoder for one format and ladder depth: the arithmetic of {@link TreadFormat}, step by
 * step, exactly as the emitted C does it in the player's tick. Immutable and thread-safe.
 */
public final class TreadDecoder {
    private final TreadFormat format;
    private final int ladderBits;
    private final int maxCode;
    private final int maxIndex;
    private final int magnitudes;
    private final int signBit;
    /** difference[k · M + m]: the difference of magnitude m at step index k, in ladder codes. */
    private final int[] difference;
    /** nextIndex[k · M + m]: the step index after a code of magnitude m at step index k. */
    private final int[] nextIndex;

    /**
     * A decoder to {@code ladderBits}-bit codes.
     *
     * @throws org.rungtone.internal.SettingError when the format cannot decode to that depth
     */
    public TreadDecoder(TreadFormat format, int ladderBits) {
        format.checkLadderBits(ladderBits);
        this.format = format;
        this.ladderBits = ladderBits;
        maxCode = (1 << ladderBits) - 1;
        maxIndex = format.maxIndex(ladderBits);
        magnitudes = format.magnitudes();
        signBit = magnitudes;
        difference = new int[(maxIndex + 1) * magnitudes];
        nextIndex = new int[difference.length];
        for (int k = 0; k <= maxIndex; k++) {
            for (int m = 0; m < magnitudes; m++) {
                difference[k * magnitudes + m] = TreadFormat.difference(k, m);
                nextIndex[k * magnitudes + m] = Math.min(maxIndex, Math.max(0, k + format.adaptation(m)));
            }
        }
    }

    /** The format decoded. */
    public TreadFormat format() {
        return format;
    }

    /** The ladder depth N decoded to. */
    public int ladderBits() {
        return ladderBits;
    }

    /** The largest step index, kmax. */
    public int maxIndex() {
        return maxIndex;
    }

    /** The largest ladder code, 2^N − 1. */
    public int maxCode() {
        return maxCode;
    }

    /**
     * Checks that {@code state} is one this decoder can be in.
     *
     * @throws IllegalArgumentException when the predictor or the step index is out of range
     */
    public void checkState(TreadState state) {
        Checks.checkArgument(state.last() >= 0 && state.last() <= maxCode && state.previous() >= 0
                && state.previous() <= maxCode, "codes %d, %d of the state are outside 0..%d", state.last(),
                state.previous(), maxCode);
        Checks.checkArgument(state.index() >= 0 && state.index() <= maxIndex, "step index %d is outside 0..%d",
                state.index(), maxIndex);
    }

    /**
     * The ladder code that {@code code} puts out after {@code last} and {@code previous} at step index
     * {@code index}.
     */
    int output(int last, int previous, int index, int code) {
        int d = difference[index * magnitudes + (code & (magnitudes - 1))];
        int q = 2 * last - previous;
        q = q < 0 ? 0 : q > maxCode ? maxCode : q;
        int y = (code & signBit) != 0 ? q - d : q + d;
        return y < 0 ? 0 : y > maxCode ? maxCode : y;
    }

    /** The step index after {@code code} at step index {@code index}. */
    int nextIndex(int index, int code) {
        return nextIndex[index * magnitudes + (code & (magnitudes - 1))];
    }

    /** The state after {@code code} from {@code state}. */
    public TreadState next(TreadState state, int code) {
        return new TreadState(output(state.last(), state.previous(), state.index(), code), state.last(),
                nextIndex(state.index(), code));
    }

    /**
     * The ladder codes of a stream of Tread codes decoded from {@code start}.
     *
     * @throws IllegalArgumentException when the start state or a code is out of range
     */
    public int[] decode(TreadState start, int[] codes) {
        checkState(start);
        int[] out = new int[codes.length];
        int y1 = start.last();
        int y2 = start.previous();
        int k = start.index();
        int top = (1 << format.codeBits()) - 1;
        for (int i = 0; i < codes.length; i++) {
            int c = codes[i];
            if (c < 0 || c > top) {
                throw new IllegalArgumentException("Tread code " + c + " at " + i + " is outside 0.." + top);
            }
            int y = output(y1, y2, k, c);
            k = nextIndex(k, c);
            y2 = y1;
            y1 = y;
            out[i] = y;
        }
        return out;
    }

    /**
     * The state before code {@code index} of a stream decoded from {@code start}: the state a player loads to
     * start playing there.
     *
     * @throws IllegalArgumentException when {@code index} is outside 0..codes.length
     */
    public TreadState stateAt(TreadState start, int[] codes, int index) {
        Checks.checkArgument(index >= 0 && index <= codes.length, "index %d is outside 0..%d", index,
                codes.length);
        TreadState s = start;
        checkState(s);
        for (int i = 0; i < index; i++) {
            s = next(s, codes[i]);
        }
        return s;
    }
}
