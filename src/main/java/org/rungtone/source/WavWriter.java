package org.rungtone.source;

import java.io.DataOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Path;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.Checks;

/**
 * Writes mono WAV files (RIFF, Microsoft/IBM "Multimedia Programming Interface and Data Specifications
 * 1.0", 1991): 16-bit PCM (format tag 1, samples rounded and clipped to [-1, 1)) or 32-bit IEEE float
 * (format tag 3, with the fact chunk that format requires). Written atomically.
 */
public final class WavWriter {
    /** Sample layout of the written file. */
    public enum Format {
        /** 16-bit signed PCM. */
        PCM16,
        /** 32-bit IEEE float. */
        FLOAT32
    }

    private WavWriter() {
    }

    /** Writes {@code signal} to {@code file}; the rate is rounded to whole hertz. */
    public static void write(Path file, Signal signal, Format format) {
        AtomicFiles.write(file, out -> write(out, signal, format));
    }

    /** Writes {@code signal} as a WAV stream. */
    public static void write(OutputStream stream, Signal signal, Format format) throws IOException {
        long rate = Math.round(signal.sampleRateHz());
        Checks.checkArgument(rate >= 1 && rate <= Integer.MAX_VALUE, "rate not writable: %d", rate);
        int bytesPer = format == Format.PCM16 ? 2 : 4;
        long dataBytes = (long) signal.length() * bytesPer;
        Checks.checkArgument(dataBytes < 0xFFFF_FFF0L - 64, "too long for a WAV file: %d samples",
                signal.length());
        boolean isFloat = format == Format.FLOAT32;
        int fmtSize = isFloat ? 18 : 16;
        int factSize = isFloat ? 12 : 0;
        long riffSize = 4 + (8 + fmtSize) + factSize + 8 + dataBytes + (dataBytes & 1);
        DataOutputStream out = new DataOutputStream(stream);
        out.writeBytes("RIFF");
        le32(out, riffSize);
        out.writeBytes("WAVE");
        out.writeBytes("fmt ");
        le32(out, fmtSize);
        le16(out, isFloat ? 3 : 1);
        le16(out, 1);
        le32(out, rate);
        le32(out, rate * bytesPer);
        le16(out, bytesPer);
        le16(out, bytesPer * 8);
        if (isFloat) {
            le16(out, 0);
            out.writeBytes("fact");
            le32(out, 4);
            le32(out, signal.length());
        }
        out.writeBytes("data");
        le32(out, dataBytes);
        double[] s = signal.unsafeSamples();
        byte[] buf = new byte[1 << 15];
        int perBlock = buf.length / bytesPer;
        for (int from = 0; from < s.length; from += perBlock) {
            int to = Math.min(s.length, from + perBlock);
            if (isFloat) {
                floats(s, from, to, buf);
            } else {
                pcm16(s, from, to, buf);
            }
            out.write(buf, 0, (to - from) * bytesPer);
        }
        if ((dataBytes & 1) != 0) {
            out.write(0);
        }
        out.flush();
    }

    /** Samples {@code from .. to} as little-endian 32-bit floats into {@code buf}. */
    private static void floats(double[] s, int from, int to, byte[] buf) {
        int pos = 0;
        for (int i = from; i < to; i++) {
            int bits = Float.floatToIntBits((float) s[i]);
            buf[pos] = (byte) bits;
            buf[pos + 1] = (byte) (bits >>> 8);
            buf[pos + 2] = (byte) (bits >>> 16);
            buf[pos + 3] = (byte) (bits >>> 24);
            pos += 4;
        }
    }

    /** Samples {@code from .. to} as little-endian 16-bit PCM into {@code buf}. */
    private static void pcm16(double[] s, int from, int to, byte[] buf) {
        int pos = 0;
        for (int i = from; i < to; i++) {
            int i16 = pcm16(s[i]);
            buf[pos] = (byte) i16;
            buf[pos + 1] = (byte) (i16 >>> 8);
            pos += 2;
        }
    }

    /** {@code v × 32768} rounded to the nearest whole number (halves upwards) and clipped to [-32768, 32767]. */
    static int pcm16(double v) {
        long q = Math.round(v * 32768.0);
        return q < -32768 ? -32768 : q > 32767 ? 32767 : (int) q;
    }

    private static void le16(DataOutputStream out, int v) throws IOException {
        out.write(v & 0xFF);
        out.write((v >>> 8) & 0xFF);
    }

    private static void le32(DataOutputStream out, long v) throws IOException {
        out.write((int) (v & 0xFF));
        out.write((int) ((v >>> 8) & 0xFF));
        out.write((int) ((v >>> 16) & 0xFF));
        out.write((int) ((v >>> 24) & 0xFF));
    }
}
