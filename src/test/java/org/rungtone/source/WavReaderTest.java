package org.rungtone.source;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import javax.sound.sampled.AudioFormat;
import javax.sound.sampled.AudioInputStream;
import javax.sound.sampled.AudioSystem;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;
import org.rungtone.internal.InputError;
import org.rungtone.testing.WavFixtures;
import org.rungtone.testing.WavFixtures.Layout;

/** WAV layouts per the RIFF specification (Microsoft/IBM 1991) and the extensible-format note. */
class WavReaderTest {
    @TempDir
    Path dir;

    /** Values exactly representable in every layout (multiples of 1/128 within range). */
    static final double[] VALUES = {0, 0.5, -0.5, 0.25, -1, 0.9921875, -0.0078125, 0.125};

    static Stream<Arguments> layouts() {
        return Stream.of(Layout.values()).flatMap(l -> Stream.of(1, 2, 3, 6, 8)
                .map(c -> Arguments.of(l, c)));
    }

    private Path write(String name, byte[] bytes) throws IOException {
        Path p = dir.resolve(name);
        Files.write(p, bytes);
        return p;
    }

    private static double[] interleave(int channels) {
        double[] x = new double[VALUES.length * channels];
        for (int i = 0; i < VALUES.length; i++) {
            for (int c = 0; c < channels; c++) {
                // channel c carries the values scaled by 1/(c+1) rounded to 1/128, distinct per channel
                x[i * channels + c] = Math.round(VALUES[i] * 128 / (c + 1)) / 128.0;
            }
        }
        return x;
    }

    @ParameterizedTest
    @MethodSource("layouts")
    void decodesEveryLayoutAndChannelCount(Layout layout, int channels) throws IOException {
        double[] x = interleave(channels);
        Path p = write("l.wav", WavFixtures.wav().layout(layout, channels, 44_100, x).bytes());
        double[][] ch = WavReader.readChannels(p);
        assertEquals(channels, ch.length);
        for (int c = 0; c < channels; c++) {
            for (int i = 0; i < VALUES.length; i++) {
                assertEquals(x[i * channels + c], ch[c][i], 0.0, layout + " ch" + c + " sample " + i);
            }
        }
        WavReader.Decoded d = WavReader.read(p);
        for (int i = 0; i < VALUES.length; i++) {
            double mean = 0;
            for (int c = 0; c < channels; c++) {
                mean += x[i * channels + c];
            }
            assertEquals(mean / channels, d.signal().sample(i), 1e-15);
        }
        assertEquals(44_100, d.signal().sampleRateHz());
    }

    @ParameterizedTest
    @MethodSource("layouts")
    void decodesExtensibleFiles(Layout layout, int channels) throws IOException {
        double[] x = interleave(channels);
        int valid = layout == Layout.S24 ? 20 : 0;
        Path p = write("x.wav", WavFixtures.wav().layout(layout, channels, 48_000, x).extensible(valid).bytes());
        WavReader.Decoded d = WavReader.read(p, 1);
        assertEquals(0xFFFE, d.format().formatTag());
        for (int i = 0; i < VALUES.length; i++) {
            assertEquals(x[i * channels], d.signal().sample(i), 0.0);
        }
    }

    @Test
    void pcm8IsUnsignedWithZeroAt128() throws IOException {
        byte[] f = WavFixtures.wav().layout(Layout.U8, 1, 8000, new double[] {0, -1, 0.5}).bytes();
        assertEquals((byte) 128, f[44]);
        assertEquals(0, f[45]);
        double[] s = WavReader.read(write("u8.wav", f)).signal().samples();
        assertArrayEquals(new double[] {0, -1, 0.5}, s, 0.0);
    }

    @Test
    void agreesWithJavaSoundOnLayoutsItReads() throws Exception {
        double[] x = new double[500];
        for (int i = 0; i < x.length; i++) {
            x[i] = 0.7 * Math.sin(i * 0.1);
        }
        for (Layout l : new Layout[] {Layout.U8, Layout.S16, Layout.S24}) {
            Path p = write("js.wav", WavFixtures.wav().layout(l, 1, 22_050, x).bytes());
            double[] ours = WavReader.read(p).signal().samples();
            try (AudioInputStream in = AudioSystem.getAudioInputStream(p.toFile())) {
                byte[] raw = in.readAllBytes();
                int bytes = l.ordinal() == 0 ? 1 : l == Layout.S16 ? 2 : 3;
                assertEquals(ours.length * bytes, raw.length);
                for (int i = 0; i < ours.length; i++) {
                    double v;
                    if (bytes == 1) {
                        v = ((raw[i] & 0xFF) - 128) / 128.0;
                    } else if (bytes == 2) {
                        v = (short) ((raw[2 * i] & 0xFF) | (raw[2 * i + 1] << 8)) / 32768.0;
                    } else {
                        v = ((raw[3 * i] & 0xFF) | ((raw[3 * i + 1] & 0xFF) << 8) | (raw[3 * i + 2] << 16))
                                / 8388608.0;
                    }
                    assertEquals(v, ours[i], 0.0, l + " sample " + i);
                }
            }
        }
    }

    /** Every code word once, in order 0x00 .. 0xFF. */
    private static byte[] allCodeWords(int channels) {
        byte[] b = new byte[256 * channels];
        for (int i = 0; i < b.length; i++) {
            b[i] = (byte) (i / channels);
        }
        return b;
    }

    /**
     * A-law (tag 6) and µ-law (tag 7) files, plain and extensible with the G.711 sub-format, decode every code
     * word to its ITU-T G.711 decoder output value (Tables 1 and 2/G.711) over 2^12 and 2^13: µ-law 0x80 is
     * +8031/8192, 0xFF is 0; A-law 0xAA is +4032/4096, 0xD5 is +1/4096.
     */
    @ParameterizedTest
    @CsvSource({"6, false, 1", "7, false, 1", "6, true, 1", "7, true, 2", "7, false, 2"})
    void decodesG711CodeWords(int tag, boolean extensible, int channels) throws IOException {
        WavFixtures.Builder b = WavFixtures.wav().raw(tag, 8, channels, 8000, allCodeWords(channels));
        if (extensible) {
            b.extensible(8);
        }
        WavReader.Decoded d = WavReader.read(write("g711.wav", b.bytes()));
        assertEquals(tag == 6 ? WavFormat.Encoding.A_LAW : WavFormat.Encoding.MU_LAW, d.format().encoding());
        assertEquals(256, d.signal().length());
        for (int c = 0; c < 256; c++) {
            double expected = tag == 6 ? G711.aLawLinear(c) / 4096.0 : G711.muLawLinear(c) / 8192.0;
            assertEquals(expected, d.signal().sample(c), 0.0, "code word " + c);
        }
        double[] s = d.signal().samples();
        if (tag == 7) {
            assertEquals(8031 / 8192.0, s[0x80], 0.0);
            assertEquals(-8031 / 8192.0, s[0x00], 0.0);
            assertEquals(0.0, s[0xFF], 0.0);
        } else {
            assertEquals(4032 / 4096.0, s[0xAA], 0.0);
            assertEquals(1 / 4096.0, s[0xD5], 0.0);
            assertEquals(-1 / 4096.0, s[0x55], 0.0);
        }
        assertEquals(tag == 6 ? "A-law 8-bit" : "mu-law 8-bit", d.format().describe().split(",")[0]
                .replace(" (extensible)", ""));
    }

    /**
     * A round trip through a second implementation: the JDK encodes a sine as µ-law and A-law and writes a WAV
     * file of it; read back, every sample equals the JDK's own decoding of that file, and the sine comes back
     * within G.711's quantization error (the largest step, 256 of 8192 units in µ-law's top segment, is
     * 3.1 % of full scale, so no sample is off by more than half of it).
     */
    @ParameterizedTest
    @CsvSource({"ULAW, 7", "ALAW, 6"})
    void javaSoundG711FilesRoundTrip(String encoding, int tag) throws Exception {
        int n = 4000;
        byte[] pcm = new byte[2 * n];
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = 0.8 * Math.sin(2 * Math.PI * 440 * i / 8000.0);
            short v = (short) Math.round(x[i] * 32767);
            pcm[2 * i] = (byte) v;
            pcm[2 * i + 1] = (byte) (v >> 8);
        }
        AudioFormat linear = new AudioFormat(8000, 16, 1, true, false);
        AudioFormat g711 = new AudioFormat(new AudioFormat.Encoding(encoding), 8000, 8, 1, 1, 8000, false);
        Path p = dir.resolve("jdk-" + encoding + ".wav");
        try (AudioInputStream in = new AudioInputStream(new java.io.ByteArrayInputStream(pcm), linear, n);
                AudioInputStream coded = AudioSystem.getAudioInputStream(g711, in)) {
            AudioSystem.write(coded, javax.sound.sampled.AudioFileFormat.Type.WAVE, p.toFile());
        }
        WavReader.Decoded d = WavReader.read(p);
        assertEquals(tag, d.format().formatTag());
        assertEquals(n, d.signal().length());
        try (AudioInputStream back = AudioSystem.getAudioInputStream(linear, AudioSystem.getAudioInputStream(
                p.toFile()))) {
            byte[] raw = back.readAllBytes();
            for (int i = 0; i < n; i++) {
                double jdk = (short) ((raw[2 * i] & 0xFF) | (raw[2 * i + 1] << 8)) / 32768.0;
                assertEquals(jdk, d.signal().sample(i), 0.0, "sample " + i);
                assertEquals(x[i], d.signal().sample(i), 128 / 8192.0, "sample " + i);
            }
        }
    }

    /** The path "-" reads standard input; errors name it "standard input". */
    @Test
    void dashReadsStandardInput() {
        java.io.InputStream saved = System.in;
        try {
            byte[] wav = WavFixtures.wav().layout(Layout.S16, 1, 8000, new double[] {0.5, -0.25}).bytes();
            System.setIn(new java.io.ByteArrayInputStream(wav));
            WavReader.Decoded d = WavReader.read(Path.of("-"));
            assertArrayEquals(new double[] {0.5, -0.25}, d.signal().samples(), 0.0);
            // read again (a survey reads its source once per rate): the bytes are held
            assertArrayEquals(new double[] {0.5, -0.25}, WavReader.read(Path.of("-")).signal().samples(), 0.0);
            System.setIn(new java.io.ByteArrayInputStream("not audio at all".getBytes()));
            assertEquals("standard input: is not a WAV file (no RIFF header at byte 0)",
                    assertThrows(InputError.class, () -> WavReader.read(Path.of("-"))).getMessage());
        } finally {
            System.setIn(saved);
        }
    }

    @Test
    void skipsUnknownOddSizedChunks() throws IOException {
        byte[] f = WavFixtures.wav().layout(Layout.S16, 1, 8000, new double[] {0.5, -0.5})
                .extraChunk(new byte[] {1, 2, 3}).bytes();
        assertArrayEquals(new double[] {0.5, -0.5}, WavReader.read(write("odd.wav", f)).signal().samples(), 0);
    }

    @Test
    void unknownDataSizeReadsToEndWithWarning() throws IOException {
        byte[] f = WavFixtures.wav().layout(Layout.S16, 1, 8000, new double[] {0.5, -0.5, 0.25})
                .dataSizeField(0xFFFFFFFFL).bytes();
        WavReader.Decoded d = WavReader.read(write("ff.wav", f));
        assertArrayEquals(new double[] {0.5, -0.5, 0.25}, d.signal().samples(), 0);
        assertEquals(1, d.warnings().size());
        assertTrue(d.warnings().get(0).contains("reading to the end of the file"), d.warnings().get(0));
    }

    @Test
    void dataSizePastEndOfFileReadsWhatIsThere() throws IOException {
        byte[] f = WavFixtures.wav().layout(Layout.S16, 1, 8000, new double[] {0.5, -0.5}).dataSizeField(4000)
                .bytes();
        WavReader.Decoded d = WavReader.read(write("long.wav", f));
        assertEquals(2, d.signal().length());
        assertEquals(1, d.warnings().size());
    }

    @Test
    void picksOneChannel() throws IOException {
        byte[] f = WavFixtures.wav().layout(Layout.S16, 2, 8000, new double[] {0.5, -0.25, 0.125, 0.75}).bytes();
        Path p = write("st.wav", f);
        assertArrayEquals(new double[] {-0.25, 0.75}, WavReader.read(p, 2).signal().samples(), 0);
        InputError e = assertThrows(InputError.class, () -> WavReader.read(p, 3));
        assertEquals(p + ": has 2 channel(s); sound.channel must be 0 (mix down) or 1..2: 3", e.getMessage());
    }

    static Stream<Arguments> badFiles() {
        double[] x = {0.1, 0.2};
        WavFixtures.Builder ok = WavFixtures.wav().layout(Layout.S16, 1, 8000, x);
        byte[] good = ok.bytes();
        byte[] truncated = java.util.Arrays.copyOf(good, 30);
        return Stream.of(
                Arguments.of("empty", new byte[0], "is too short to be a WAV file (0 bytes; a RIFF header needs 12)"),
                Arguments.of("text", "hello, this is not audio".getBytes(),
                        "is not a WAV file (no RIFF header at byte 0)"),
                Arguments.of("truncated", truncated, "fmt chunk at byte 12 is truncated or too short (16 bytes)"),
                Arguments.of("adpcm", WavFixtures.wav().layout(Layout.S16, 1, 8000, x).tag(2).bytes(),
                        "uses format tag 0x0002 (Microsoft ADPCM); Rungtone reads PCM (1), IEEE float (3), A-law"
                                + " (6), mu-law (7) and extensible (0xFFFE); convert it to 16-bit PCM"),
                Arguments.of("alaw16", WavFixtures.wav().raw(6, 16, 1, 8000, new byte[4]).bytes(),
                        "A-law with 16 bits per sample is not supported (8)"),
                Arguments.of("zero-channels", WavFixtures.wav().layout(Layout.S16, 1, 8000, x).channels(0)
                        .blockAlign(2).bytes(), "says it has 0 channels"),
                Arguments.of("absurd-rate", WavFixtures.wav().layout(Layout.S16, 1, 8000, x).rate(5_000_000).bytes(),
                        "has an unusable sample rate of 5000000 Hz (1 Hz..384 kHz)"),
                Arguments.of("zero-rate", WavFixtures.wav().layout(Layout.S16, 1, 8000, x).rate(0).bytes(),
                        "has an unusable sample rate of 0 Hz (1 Hz..384 kHz)"),
                Arguments.of("no-data", WavFixtures.wav().layout(Layout.S16, 1, 8000, new double[0]).bytes(),
                        "has no audio samples (empty data chunk)"),
                Arguments.of("bad-align", WavFixtures.wav().layout(Layout.S16, 1, 8000, x).blockAlign(3).bytes(),
                        "block align is 3 but 1 channel(s) of 16 bits need 2 (corrupt header)"),
                Arguments.of("rifx", WavFixtures.wav().layout(Layout.S16, 1, 8000, x).magic("RIFX").bytes(),
                        "is a RIFX file; convert it to a plain RIFF WAV (little-endian)"),
                Arguments.of("data-first", WavFixtures.wav().layout(Layout.S16, 1, 8000, x).dataBeforeFmt().bytes(),
                        "data chunk at byte 12 comes before any fmt chunk"),
                Arguments.of("nan", WavFixtures.wav().layout(Layout.F32, 1, 8000, new double[] {0, Double.NaN})
                        .bytes(), "sample 1 of channel 1 (at 0.000 s) is NaN; the file is damaged or was written"
                        + " without clipping"),
                Arguments.of("inf", WavFixtures.wav().layout(Layout.F64, 1, 8000,
                        new double[] {Double.POSITIVE_INFINITY}).bytes(), "sample 0 of channel 1 (at 0.000 s) is"
                        + " infinite; the file is damaged or was written without clipping"));
    }

    @ParameterizedTest
    @MethodSource("badFiles")
    void badFilesGiveOneClearLine(String name, byte[] bytes, String expected) throws IOException {
        Path p = write(name + ".wav", bytes);
        InputError e = assertThrows(InputError.class, () -> WavReader.read(p));
        assertEquals(p + ": " + expected, e.getMessage());
    }

    @Test
    void missingFileIsNamed() {
        Path p = dir.resolve("nope.wav");
        assertEquals(p + ": no such file", assertThrows(InputError.class, () -> WavReader.read(p)).getMessage());
    }
}
