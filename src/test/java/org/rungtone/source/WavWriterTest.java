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
}
