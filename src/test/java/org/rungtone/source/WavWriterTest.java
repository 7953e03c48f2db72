package org.rungtone.source;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class WavWriterTest {
    @TempDir
    Path dir;

    @Test
    void float32RoundTripsExactlyForFloatValues() {
        double[] x = {0, 0.5f, -0.123f, 1.5f, -2};
        Path p = dir.resolve("f.wav");
        WavWriter.write(p, Signal.of(x, 48_000), WavWriter.Format.FLOAT32);
        WavReader.Decoded d = WavReader.read(p);
        assertEquals(WavFormat.Encoding.FLOAT32, d.format().encoding());
        assertArrayEquals(x, d.signal().samples(), 0);
        assertEquals(48_000, d.signal().sampleRateHz());
    }

    @Test
    void pcm16RoundsAndClips() {
        double[] x = {0, 0.5, -1, 1.5, 1.0 / 65536 * 3};
        Path p = dir.resolve("p.wav");
        WavWriter.write(p, Signal.of(x, 8000), WavWriter.Format.PCM16);
        double[] back = WavReader.read(p).signal().samples();
        assertArrayEquals(new double[] {0, 0.5, -1, 32767 / 32768.0, 2 / 32768.0}, back, 0);
    }

    /** The rounding that 16-bit samples had when every one went through Math.round. */
    private static int byMathRound(double v) {
        return (int) Math.max(-32768, Math.min(32767, Math.round(v * 32768.0)));
    }

    @Test
    void pcm16RoundsAsMathRoundDid() {
        double[] edges = {0, -0.0, 0.49999999999999994 / 32768, -0.49999999999999994 / 32768, 0.5 / 32768,
            -0.5 / 32768, 1.5 / 32768, -1.5 / 32768, 2.5 / 32768, -2.5 / 32768, 32766.5 / 32768,
            32766.499999999996 / 32768, 32767.0 / 32768, 32767.5 / 32768, -32767.5 / 32768, -32767.6 / 32768,
            -32768.0 / 32768, -32768.5 / 32768, 1, -1, 7, -7, Double.NaN, Double.POSITIVE_INFINITY,
            Double.NEGATIVE_INFINITY, Double.MIN_VALUE, -Double.MIN_VALUE, Math.nextDown(0.5 / 32768),
            Math.nextUp(-0.5 / 32768), Math.nextDown(-0.5 / 32768)};
        for (double v : edges) {
            assertEquals(byMathRound(v), WavWriter.pcm16(v), "sample " + v);
        }
        java.util.Random random = new java.util.Random(3);
        for (int i = 0; i < 200_000; i++) {
            double v = (random.nextDouble() * 2.2 - 1.1);
            double half = (Math.floor(random.nextDouble() * 65536) - 32768 + 0.5) / 32768;
            assertEquals(byMathRound(v), WavWriter.pcm16(v), "sample " + v);
            assertEquals(byMathRound(half), WavWriter.pcm16(half), "sample " + half);
            assertEquals(byMathRound(Math.nextUp(half)), WavWriter.pcm16(Math.nextUp(half)));
            assertEquals(byMathRound(Math.nextDown(half)), WavWriter.pcm16(Math.nextDown(half)));
        }
    }

    @Test
    void longSignalsWriteEverySampleOnce() {
        double[] x = new double[70_001];
        for (int i = 0; i < x.length; i++) {
            x[i] = ((i * 37) % 65536 - 32768) / 32768.0;
        }
        Path p = dir.resolve("long.wav");
        WavWriter.write(p, Signal.of(x, 8000), WavWriter.Format.PCM16);
        assertArrayEquals(x, WavReader.read(p).signal().samples(), 0);
        WavWriter.write(p, Signal.of(x, 8000), WavWriter.Format.FLOAT32);
        assertArrayEquals(x, WavReader.read(p).signal().samples(), 0);
    }
}
