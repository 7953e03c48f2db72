package org.rungtone.source;

import java.util.Locale;

/**
 * The layout of a WAV file's audio data, as read from its fmt chunk.
 *
 * @param formatTag 1 (PCM), 3 (IEEE float), 6 (A-law), 7 (µ-law) or 0xFFFE (extensible)
 * @param encoding the effective sample encoding after resolving the extensible sub-format
 * @param channels 1..8
 * @param sampleRateHz samples per second per channel
 * @param bitsPerSample container bits per sample
 * @param validBits valid bits per sample (extensible files may use fewer than the container)
 * @param blockAlign bytes per frame
 * @param frames number of frames in the data chunk (as read)
 */
public record WavFormat(int formatTag, Encoding encoding, int channels, int sampleRateHz, int bitsPerSample,
        int validBits, int blockAlign, long frames) {

    /** Sample encodings Rungtone decodes. */
    public enum Encoding {
        /** Unsigned 8-bit PCM, 128 is zero. */
        PCM_U8,
        /** Signed little-endian 16-bit PCM. */
        PCM_S16,
        /** Signed little-endian 24-bit PCM. */
        PCM_S24,
        /** Signed little-endian 32-bit PCM. */
        PCM_S32,
        /** IEEE 754 single precision. */
        FLOAT32,
        /** IEEE 754 double precision. */
        FLOAT64,
        /** 8-bit A-law code words, ITU-T G.711. */
        A_LAW,
        /** 8-bit µ-law code words, ITU-T G.711. */
        MU_LAW;

        /**
         * The encoding of a format tag (1 PCM, 3 IEEE float, 6 A-law, 7 µ-law) and sample width, or null when
         * there is none.
         */
        static Encoding of(int tag, int bits) {
            if (tag == 6 || tag == 7) {
                return bits != 8 ? null : tag == 6 ? A_LAW : MU_LAW;
            }
            if (tag == 1) {
                return bits == 8 ? PCM_U8 : bits == 16 ? PCM_S16 : bits == 24 ? PCM_S24 : bits == 32 ? PCM_S32 : null;
            }
            if (tag == 3) {
                return bits == 32 ? FLOAT32 : bits == 64 ? FLOAT64 : null;
            }
            return null;
        }
    }

    /** Duration in seconds. */
    public double durationSeconds() {
        return (double) frames / sampleRateHz;
    }

    /** A one-line description: "PCM 16-bit, 2 ch, 44100 Hz, 3.20 s". */
    public String describe() {
        String kind;
        switch (encoding) {
            case FLOAT32:
            case FLOAT64:
                kind = "float " + bitsPerSample + "-bit";
                break;
            case PCM_U8:
                kind = "PCM 8-bit unsigned";
                break;
            case A_LAW:
                kind = "A-law 8-bit";
                break;
            case MU_LAW:
                kind = "mu-law 8-bit";
                break;
            default:
                kind = "PCM " + bitsPerSample + "-bit";
                break;
        }
        if (formatTag == 0xFFFE) {
            kind += " (extensible" + (validBits != bitsPerSample ? ", " + validBits + " valid bits" : "") + ")";
        }
        return String.format(Locale.ROOT, "%s, %d ch, %d Hz, %.2f s", kind, channels, sampleRateHz,
                durationSeconds());
    }
}
