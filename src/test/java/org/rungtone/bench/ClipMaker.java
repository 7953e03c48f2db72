package org.rungtone.bench;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.SplittableRandom;

/**
 * Writes a stereo 16-bit 44.1 kHz benchmark clip of a given length: a few drifting chords and a little noise,
 * invented data. Usage: {@code ClipMaker FILE SECONDS}.
 */
public final class ClipMaker {
    private ClipMaker() {
    }

    /** Writes the clip. */
    public static void write(Path file, double seconds) throws IOException {
        int rate = 44_100;
        long frames = Math.round(seconds * rate);
        long dataBytes = frames * 4;
        SplittableRandom rnd = new SplittableRandom(11);
        try (OutputStream out = new BufferedOutputStream(Files.newOutputStream(file), 1 << 16)) {
            out.write("RIFF".getBytes());
            le32(out, 36 + dataBytes);
            out.write("WAVEfmt ".getBytes());
            le32(out, 16);
            le16(out, 1);
            le16(out, 2);
            le32(out, rate);
            le32(out, rate * 4L);
            le16(out, 4);
            le16(out, 16);
            out.write("data".getBytes());
            le32(out, dataBytes);
            double[] f = {220, 277.18, 329.63, 440};
            for (long i = 0; i < frames; i++) {
                double t = (double) i / rate;
                double l = 0;
                double r = 0;
                for (int k = 0; k < f.length; k++) {
                    double drift = 1 + 0.01 * Math.sin(0.1 * t + k);
                    double v = Math.sin(2 * Math.PI * f[k] * drift * t) * (0.5 + 0.5 * Math.sin(0.7 * t + k));
                    l += v * (k % 2 == 0 ? 0.2 : 0.1);
                    r += v * (k % 2 == 0 ? 0.1 : 0.2);
                }
                l += 0.01 * (rnd.nextDouble() - 0.5);
                r += 0.01 * (rnd.nextDouble() - 0.5);
                le16(out, (int) Math.round(l * 32767));
                le16(out, (int) Math.round(r * 32767));
            }
        }
    }

    private static void le16(OutputStream o, int v) throws IOException {
        o.write(v & 0xFF);
        o.write((v >>> 8) & 0xFF);
    }

    private static void le32(OutputStream o, long v) throws IOException {
        le16(o, (int) (v & 0xFFFF));
        le16(o, (int) ((v >>> 16) & 0xFFFF));
    }

    /** Entry point: FILE SECONDS. */
    public static void main(String[] args) throws IOException {
        write(Path.of(args[0]), Double.parseDouble(args[1]));
    }
}
