package org.rungtone.source;

/**
 * The expansion of 8-bit A-law and µ-law code words to linear values, as ITU-T Recommendation G.711 (11/1988),
 * "Pulse code modulation (PCM) of voice frequencies", defines it: Table 1/G.711 (A-law) and Table 2/G.711
 * (µ-law) give the decoder output value of every code word; the formulas below reproduce those tables.
 *
 * <p>µ-law: all eight bits of the character signal are inverted for transmission; after inverting back, bit 7
 * is the sign (0 positive), bits 6..4 the segment e and bits 3..0 the step m, and the decoder output is
 * ±(((2m + 33) · 2^e) − 33) in 14-bit units (magnitudes 0 .. 8031 of the 8159-unit range).
 *
 * <p>A-law: the even bits are inverted for transmission (XOR 0x55); after inverting back, bit 7 is the sign
 * (1 positive), bits 6..4 the segment s and bits 3..0 the step m, and the decoder output is ±(2m + 1) for
 * s = 0 and ±((2m + 33) · 2^(s−1)) above, in 13-bit units (magnitudes 1 .. 4032 of the 4096-unit range).
 *
 * <p>Full scale [-1, 1] divides by 2^13 (µ-law) and 2^12 (A-law), the ranges' powers of two, so the largest
 * code words reach 0.980 and 0.984 of full scale.
 */
final class G711 {
    private static final double[] MU_LAW = new double[256];
    private static final double[] A_LAW = new double[256];

    static {
        for (int c = 0; c < 256; c++) {
            MU_LAW[c] = muLawLinear(c) / 8192.0;
            A_LAW[c] = aLawLinear(c) / 4096.0;
        }
    }

    private G711() {
    }

    /** The decoder output of a µ-law code word in 14-bit units, -8031 .. 8031 (Table 2/G.711). */
    static int muLawLinear(int codeWord) {
        int u = ~codeWord & 0xFF;
        int segment = (u >> 4) & 0x7;
        int step = u & 0x0F;
        int magnitude = ((2 * step + 33) << segment) - 33;
        return (u & 0x80) != 0 ? -magnitude : magnitude;
    }

    /** The decoder output of an A-law code word in 13-bit units, -4032 .. 4032 (Table 1/G.711). */
    static int aLawLinear(int codeWord) {
        int a = (codeWord ^ 0x55) & 0xFF;
        int segment = (a >> 4) & 0x7;
        int step = a & 0x0F;
        int magnitude = segment == 0 ? 2 * step + 1 : (2 * step + 33) << (segment - 1);
        return (a & 0x80) != 0 ? magnitude : -magnitude;
    }

    /** A µ-law code word (its low eight bits) in full-scale units. */
    static double muLaw(int codeWord) {
        return MU_LAW[codeWord & 0xFF];
    }

    /** An A-law code word (its low eight bits) in full-scale units. */
    static double aLaw(int codeWord) {
        return A_LAW[codeWord & 0xFF];
    }
}
