package org.rungtone.source;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.OptionalDouble;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.condition.Conditioner;
import org.rungtone.condition.Conditioning;
import org.rungtone.condition.KaiserResampler;
import org.rungtone.internal.InputError;

/** A WAV file read by range gives exactly what reading it whole gives, and conditioning it does too. */
class WavStreamTest {
    @TempDir
    Path dir;

    /**
     * A buffer holding the canonical 44-byte header (RIFF/WAVE, a 16-byte fmt chunk, the data chunk's header)
     * with room for {@code frames} frames after it.
     */
    private static ByteBuffer header(int tag, int channels, int rate, int bits, int frames) {
        int frameBytes = channels * bits / 8;
        ByteBuffer b = ByteBuffer.allocate(44 + frames * frameBytes).order(ByteOrder.LITTLE_ENDIAN);
        java.nio.charset.Charset ascii = java.nio.charset.StandardCharsets.US_ASCII;
        b.put("RIFF".getBytes(ascii)).putInt(36 + frames * frameBytes).put("WAVE".getBytes(ascii))
                .put("fmt ".getBytes(ascii)).putInt(16).putShort((short) tag).putShort((short) channels)
                .putInt(rate).putInt(rate * frameBytes).putShort((short) frameBytes).putShort((short) bits)
                .put("data".getBytes(ascii)).putInt(frames * frameBytes);
        return b;
    }

    /** A stereo 16-bit PCM file of {@code frames} random frames (canonical 44-byte header). */
    private Path stereo16(int frames, long seed) throws IOException {
        Random rnd = new Random(seed);
        ByteBuffer b = header(1, 2, 44100, 16, frames);
        for (int i = 0; i < frames; i++) {
            double t = i / 44100.0;
            // a 440 Hz tone with some noise, silent for the first and last 1000 frames
            double v = i < 1000 || i >= frames - 1000 ? 0 : 0.5 * Math.sin(2 * Math.PI * 440 * t);
            b.putShort((short) Math.round(32767 * v + rnd.nextInt(64) - 32));
            b.putShort((short) Math.round(32767 * v));
        }
        Path f = dir.resolve("s" + seed + ".wav");
        Files.write(f, b.array());
        return f;
    }

    @Test
    void rangesReadTheSameSamplesAsTheWholeFile() throws IOException {
        Path f = stereo16(50_000, 1);
        double[] whole = WavReader.read(f).signal().unsafeSamples();
        try (WavReader.Stream s = WavReader.open(f, 0)) {
            assertEquals(50_000, s.length());
            assertEquals(44100, s.sampleRateHz(), 0);
            for (int[] r : new int[][] {{0, 1}, {0, 50_000}, {12_345, 20_000}, {49_999, 1}, {33_000, 0}}) {
                double[] part = new double[r[1] + 3];
                s.read(r[0], part, 3, r[1]);
                assertArrayEquals(Arrays.copyOfRange(whole, r[0], r[0] + r[1]),
                        Arrays.copyOfRange(part, 3, part.length), 0);
            }
            assertThrows(IllegalArgumentException.class, () -> s.read(49_999, new double[2], 0, 2));
        }
        try (WavReader.Stream s = WavReader.open(f, 2)) {
            double[] right = new double[10];
            s.read(5000, right, 0, 10);
            assertArrayEquals(Arrays.copyOfRange(WavReader.readChannels(f)[1], 5000, 5010), right, 0);
        }
    }

    @Test
    void conditioningAStreamEqualsConditioningTheDecodedSignal() throws IOException {
        Path f = stereo16(100_000, 2);
        Conditioner conditioner = new Conditioner(KaiserResampler.forBits(8));
        Conditioning c = new Conditioning(true, OptionalDouble.of(-50), 16000, OptionalDouble.empty(),
                OptionalDouble.of(-1), 0.01, 0.02);
        Conditioner.Conditioned whole = conditioner.apply(WavReader.read(f).signal(), c);
        try (WavReader.Stream s = WavReader.open(f, 0)) {
            Conditioner.Conditioned streamed = conditioner.apply(s, c);
            assertArrayEquals(whole.signal().unsafeSamples(), streamed.signal().unsafeSamples(), 0);
            assertEquals(whole.trimmedStartSeconds(), streamed.trimmedStartSeconds(), 0);
            assertEquals(whole.trimmedEndSeconds(), streamed.trimmedEndSeconds(), 0);
            assertTrue(streamed.trimmedStartSeconds() > 0.02, "the leading silence was trimmed");
        }
    }

    @Test
    void aDamagedSampleIsReportedAtItsPositionWhenStreamed() throws IOException {
        // float32 mono with NaN at two places: the earlier one is named whatever block meets it first
        int frames = 200_000;
        ByteBuffer b = header(3, 1, 48000, 32, frames);
        for (int i = 0; i < frames; i++) {
            b.putFloat(i == 123_456 || i == 190_000 ? Float.NaN : 0.1f);
        }
        Path f = dir.resolve("nan.wav");
        Files.write(f, b.array());
        Conditioning c = new Conditioning(true, OptionalDouble.empty(), 16000, OptionalDouble.empty(),
                OptionalDouble.empty(), 0, 0);
        try (WavReader.Stream s = WavReader.open(f, 0)) {
            InputError e = assertThrows(InputError.class,
                    () -> new Conditioner(KaiserResampler.forBits(8)).apply(s, c));
            assertTrue(e.getMessage().contains("sample 123456 of channel 1 (at 2.572 s) is NaN"), e.getMessage());
        }
    }
}
