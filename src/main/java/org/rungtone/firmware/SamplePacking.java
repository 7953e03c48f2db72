package org.rungtone.firmware;

import org.rungtone.internal.Checks;

/**
 * Bit-packs N-bit codes into bytes as one continuous LSB-first stream: sample i occupies stream bits
 * {@code i·N .. i·N + N − 1}, and stream bit b is bit {@code b mod 8} of byte {@code b / 8}. So 4-bit codes go
 * two per byte (first sample in the low nibble), 6-bit codes four per three bytes, 8-bit codes one per byte.
 * The emitted C reads sample i back with the same rule (at most three bytes per sample for N &lt;= 16).
 */
public final class SamplePacking {
    private SamplePacking() {
    }

    /** Bytes needed for {@code samples} codes of {@code bits} bits: ceil(samples·N / 8). */
    public static long packedBytes(long samples, int bits) {
        Checks.checkArgument(bits >= 1 && bits <= 16, "bits must be 1..16: %d", bits);
        return (samples * bits + 7) / 8;
    }

    /**
     * Packs codes into the stream.
     *
     * @throws IllegalArgumentException when a code does not fit in {@code bits} bits or the result would
     *     exceed the largest Java array
     */
    public static byte[] pack(int[] codes, int bits) {
        long size = packedBytes(codes.length, bits);
        Checks.checkArgument(size <= Integer.MAX_VALUE - 8, "too many samples to pack: %d", codes.length);
        byte[] out = new byte[(int) size];
        int max = (1 << bits) - 1;
        long acc = 0;
        int held = 0;
        int o = 0;
        for (int i = 0; i < codes.length; i++) {
            int c = codes[i];
            Checks.checkArgument(c >= 0 && c <= max, "code %d at %d does not fit %d bits", c, i, bits);
            acc |= (long) c << held;
            held += bits;
            while (held >= 8) {
                out[o++] = (byte) acc;
                acc >>>= 8;
                held -= 8;
            }
        }
        if (held > 0) {
            out[o] = (byte) acc;
        }
        return out;
    }

    /**
     * Reads {@code count} codes of {@code bits} bits back from a packed stream.
     *
     * @throws IllegalArgumentException when the stream is too short
     */
    public static int[] unpack(byte[] packed, int bits, int count) {
        Checks.checkArgument(packedBytes(count, bits) <= packed.length,
                "%d bytes hold fewer than %d codes of %d bits", packed.length, count, bits);
        int[] out = new int[count];
        int mask = (1 << bits) - 1;
        long acc = 0;
        int held = 0;
        int in = 0;
        for (int i = 0; i < count; i++) {
            while (held < bits) {
                acc |= (long) (packed[in++] & 0xFF) << held;
                held += 8;
            }
            out[i] = (int) (acc & mask);
            acc >>>= bits;
            held -= bits;
        }
        return out;
    }

    /** Reads code {@code index} directly, the way the emitted C does (random access). */
    public static int read(byte[] packed, int bits, long index) {
        long bit = index * bits;
        int at = (int) (bit >>> 3);
        int shift = (int) (bit & 7);
        long w = packed[at] & 0xFF;
        if (shift + bits > 8) {
            w |= (long) (packed[at + 1] & 0xFF) << 8;
        }
        if (shift + bits > 16) {
            w |= (long) (packed[at + 2] & 0xFF) << 16;
        }
        return (int) ((w >>> shift) & ((1 << bits) - 1));
    }
}
