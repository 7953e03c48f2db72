package org.rungtone.source;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.ByteArrayInputStream;
import javax.sound.sampled.AudioFormat;
import javax.sound.sampled.AudioInputStream;
import javax.sound.sampled.AudioSystem;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The G.711 expansion against ITU-T Recommendation G.711 (11/1988): Table 2/G.711 (µ-law, decoder output values
 * in 14-bit units, 0 .. 8031 in eight segments of 16 steps) and Table 1/G.711 (A-law, decoder output values in
 * 13-bit units, 1 .. 4032 in eight segments), and against the JDK's own G.711 codecs as a second
 * implementation.
 */
class G711Test {
    /** Code words as transmitted and the decoder output Table 2/G.711 gives them. */
    @ParameterizedTest
    @CsvSource({
        "0xFF, 0", "0x7F, 0", "0xFE, 2", "0xF0, 30", "0xEF, 33", "0xE0, 93", "0xDF, 99", "0xD0, 219",
        "0xCF, 231", "0xBF, 495", "0xAF, 1023", "0x9F, 2079", "0x90, 3999", "0x8F, 4191", "0x80, 8031",
        "0x00, -8031", "0x0F, -4191", "0x6F, -33", "0x7E, -2"})
    void muLawCodeWordsDecodeAsTable2(String code, int expected) {
        assertEquals(expected, G711.muLawLinear(Integer.decode(code)));
    }

    /** Code words as transmitted (even bits inverted) and the decoder output Table 1/G.711 gives them. */
    @ParameterizedTest
    @CsvSource({
        "0xD5, 1", "0x55, -1", "0xD4, 3", "0xDA, 31", "0xC5, 33", "0xCA, 63", "0xF5, 66", "0xE5, 132",
        "0x95, 264", "0x85, 528", "0xB5, 1056", "0xA5, 2112", "0xAA, 4032", "0x2A, -4032", "0x45, -33"})
    void aLawCodeWordsDecodeAsTable1(String code, int expected) {
        assertEquals(expected, G711.aLawLinear(Integer.decode(code)));
    }

    /**
     * Table 2/G.711: µ-law segment k (k = 1..8) has 16 steps of 2^k units, and the step across a segment
     * boundary is 3 · 2^(k-2) (30 -> 33, 93 -> 99, ...); the positive values rise 0 .. 8031 as the transmitted
     * code word falls from 0xFF to 0x80, and the negative half mirrors them.
     */
    @Test
    void muLawSegmentsDoubleTheirStep() {
        for (int n = 1; n < 128; n++) {
            int k = n / 16 + 1;
            int step = G711.muLawLinear(0xFF - n) - G711.muLawLinear(0xFF - n + 1);
            assertEquals(n % 16 != 0 ? 1 << k : 3 << (k - 2), step, "step into code word " + (0xFF - n));
        }
        for (int c = 0; c < 128; c++) {
            assertEquals(-G711.muLawLinear(c | 0x80), G711.muLawLinear(c));
        }
    }

    /**
     * Table 1/G.711: A-law steps are 2 units in the two lowest segments and 2^s in segment s = 2..7 above
     * them (3 · 2^(s-2) across a boundary); the negative half mirrors the positive one.
     */
    @Test
    void aLawSegmentsDoubleTheirStep() {
        int[] positive = new int[128];
        for (int n = 0; n < 128; n++) {
            positive[n] = G711.aLawLinear((0x80 | n) ^ 0x55);
        }
        assertEquals(1, positive[0]);
        for (int n = 1; n < 128; n++) {
            int s = n / 16;
            int expected = s <= 1 ? 2 : n % 16 != 0 ? 1 << s : 3 << (s - 2);
            assertEquals(expected, positive[n] - positive[n - 1], "step at " + n);
            assertEquals(-positive[n], G711.aLawLinear(n ^ 0x55), "mirror at " + n);
        }
    }

    /**
     * The JDK's own G.711 codecs ({@code javax.sound.sampled}, 16-bit output) give every one of the 256 code
     * words the same value, scaled to 16 bits (µ-law × 4, A-law × 8).
     */
    @Test
    void agreesWithJavaSoundOnAll256CodeWords() throws Exception {
        int[] mu = javaSound(AudioFormat.Encoding.ULAW);
        int[] a = javaSound(AudioFormat.Encoding.ALAW);
        for (int c = 0; c < 256; c++) {
            assertEquals(mu[c], 4 * G711.muLawLinear(c), "mu-law code word " + c);
            assertEquals(a[c], 8 * G711.aLawLinear(c), "A-law code word " + c);
            assertEquals(G711.muLawLinear(c) / 8192.0, G711.muLaw(c));
            assertEquals(G711.aLawLinear(c) / 4096.0, G711.aLaw(c));
        }
    }

    private static int[] javaSound(AudioFormat.Encoding encoding) throws Exception {
        byte[] codes = new byte[256];
        for (int c = 0; c < 256; c++) {
            codes[c] = (byte) c;
        }
        AudioFormat g711 = new AudioFormat(encoding, 8000, 8, 1, 1, 8000, false);
        AudioFormat pcm = new AudioFormat(8000, 16, 1, true, false);
        try (AudioInputStream in = new AudioInputStream(new ByteArrayInputStream(codes), g711, 256);
                AudioInputStream out = AudioSystem.getAudioInputStream(pcm, in)) {
            byte[] b = out.readAllBytes();
            int[] v = new int[256];
            for (int i = 0; i < 256; i++) {
                v[i] = (short) ((b[2 * i] & 0xFF) | (b[2 * i + 1] << 8));
            }
            return v;
        }
    }
}
