package org.rungtone.codec;

import java.util.Locale;
import org.rungtone.internal.Setting;

/**
 * Tread, Rungtone's adaptive differential code for ladder codes: 2, 3 or 4 bits per sample that a decoder
 * turns back into N-bit ladder codes (N up to {@value #MAX_LADDER_BITS}) with a few integer operations. The
 * layout is documented for decoder writers in {@code docs/tread.md}; this class holds its tables.
 *
 * <p>The method follows the published adaptive differential PCM coders: a prediction plus a difference whose
 * size is a step from a small table, indexed by a step index that each code moves up or down, as in the
 * IMA/DVI ADPCM recommended practice (Interactive Multimedia Association, 1992); ITU-T G.726 adapts its
 * scale factor the same way in the log domain and predicts from the past two outputs with a second-order
 * section. Tread's prediction is fixed: the straight line through the last two codes put out. A b-bit code
 * holds a sign bit (bit b − 1) and a magnitude m (the low b − 1 bits). With the state (last code y1, the
 * code before it y2, step index k):
 * <pre>
 *   d  = (STEP[k] · (2m + 1)) &gt;&gt; 4               the difference, in ladder codes
 *   q  = min(2^N − 1, max(0, 2·y1 − y2))              the prediction
 *   y  = min(2^N − 1, max(0, sign ? q − d : q + d))  the code put out
 *   y2 = y1, y1 = y, k = min(kmax, max(0, k + ADAPT[m]))
 * </pre>
 * {@code STEP[k] = round(8 · 2^(k/4))}: eighths of a code, four steps per octave, from one code at k = 0.
 * {@code kmax} is the largest k whose largest difference stays below 2^N, so every product fits 16 bits.
 */
public enum TreadFormat {
    /** 2 bits per sample: sign and one magnitude bit. */
    TREAD2(2, new int[] {-1, 2}),
    /** 3 bits per sample: sign and two magnitude bits. */
    TREAD3(3, new int[] {-1, -1, 1, 4}),
    /** 4 bits per sample: sign and three magnitude bits. */
    TREAD4(4, new int[] {-1, -1, -1, -1, 1, 2, 4, 6});

    /** The widest ladder code a Tread stream decodes to. */
    public static final int MAX_LADDER_BITS = 12;
    /** Codes per block: eight codes of b bits fill b whole bytes. */
    public static final int BLOCK_CODES = 8;
    /** Fractional bits of the step table: a step of 8 is one ladder code (see the class comment). */
    static final int DIFFERENCE_SHIFT = 4;

    private static final int[] STEPS = {
        8, 10, 11, 13, 16, 19, 23, 27, 32, 38, 45, 54, 64, 76, 91, 108,
        128, 152, 181, 215, 256, 304, 362, 431, 512, 609, 724, 861, 1024, 1218, 1448, 1722,
        2048, 2435, 2896, 3444, 4096, 4871, 5793, 6889, 8192, 9742, 11585, 13777, 16384, 19484,
    };

    private final int codeBits;
    private final int[] adapt;

    TreadFormat(int codeBits, int[] adapt) {
        this.codeBits = codeBits;
        this.adapt = adapt;
    }

    /** Bits per stored code, b. */
    public int codeBits() {
        return codeBits;
    }

    /** Magnitudes per sign, M = 2^(b − 1). */
    public int magnitudes() {
        return 1 << (codeBits - 1);
    }

    /** The option spelling: {@code tread2}, {@code tread3}, {@code tread4}. */
    public String optionName() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** How the step index moves after a code of magnitude {@code m}. */
    public int adaptation(int m) {
        return adapt[m];
    }

    /** Entries of the whole step table, STEP[0 .. 45]. */
    public static int stepCount() {
        return STEPS.length;
    }

    /** STEP[k], in eighths of a ladder code. */
    public static int step(int k) {
        return STEPS[k];
    }

    /** The largest step index for {@code ladderBits}-bit codes: the last k with STEP[k]·(2M − 1) &lt; 16·2^N. */
    public int maxIndex(int ladderBits) {
        long limit = (1L << DIFFERENCE_SHIFT) << ladderBits;
        int k = -1;
        while (k + 1 < STEPS.length && (long) STEPS[k + 1] * (2L * magnitudes() - 1) < limit) {
            k++;
        }
        return k;
    }

    /** The difference of magnitude {@code m} at step index {@code k}, in ladder codes. */
    public static int difference(int k, int m) {
        return STEPS[k] * (2 * m + 1) >> DIFFERENCE_SHIFT;
    }

    /** The lowest ladder depth this format decodes to: one bit more than it stores. */
    public int minLadderBits() {
        return codeBits + 1;
    }

    /**
     * Checks that this format can decode to {@code ladderBits}-bit codes.
     *
     * @throws org.rungtone.internal.SettingError naming the bit depth when it is outside
     *     {@link #minLadderBits()} .. {@value #MAX_LADDER_BITS}
     */
    public void checkLadderBits(int ladderBits) {
        Setting.BITS.check(ladderBits <= MAX_LADDER_BITS, "%d is above the %d-bit limit of %s storage; use at"
                + " most %d bits, or %s packed", ladderBits, MAX_LADDER_BITS, optionName(), MAX_LADDER_BITS,
                Setting.STORAGE.ref());
        Setting.BITS.check(ladderBits >= minLadderBits(), "%d is too few for %s storage, which stores %d bits"
                + " per sample itself; use at least %d bits, or %s packed", ladderBits, optionName(), codeBits,
                minLadderBits(), Setting.STORAGE.ref());
    }

    /** Bytes of the stream for {@code samples} codes: ceil(samples · b / 8). */
    public long streamBytes(long samples) {
        return (samples * codeBits + 7) / 8;
    }

    /**
     * Bytes of the decoder's tables for {@code ladderBits}-bit codes: the step table up to kmax (two bytes
     * each) and the adaptation table (one byte per magnitude).
     */
    public long tableBytes(int ladderBits) {
        return 2L * (maxIndex(ladderBits) + 1) + magnitudes();
    }

    /** Bytes of one stored decoder state: the last two codes (16 bits each) and the step index (8 bits). */
    public static long stateBytes() {
        return 5;
    }

    /**
     * Bytes of the decoder's tables in a Rungtone player for {@code ladderBits}-bit codes: up to 8 bits one
     * table of a difference and the next row (a byte each) per step index and magnitude, 2·M·(kmax + 1);
     * past 8 bits the step table and the adaptation table ({@link #tableBytes}).
     */
    public long playerTableBytes(int ladderBits) {
        return ladderBits <= 8 ? 2L * magnitudes() * (maxIndex(ladderBits) + 1) : tableBytes(ladderBits);
    }

    /** Bytes of one reset point in a Rungtone player: three bytes up to 8-bit codes, else {@link #stateBytes}. */
    public static long resetBytes(int ladderBits) {
        return ladderBits <= 8 ? 3 : stateBytes();
    }

    /**
     * Parses the option spelling.
     *
     * @throws IllegalArgumentException when the text names no format
     */
    public static TreadFormat parse(String text) {
        for (TreadFormat f : values()) {
            if (f.optionName().equalsIgnoreCase(text.trim())) {
                return f;
            }
        }
        throw new IllegalArgumentException("no Tread format " + text);
    }
}
