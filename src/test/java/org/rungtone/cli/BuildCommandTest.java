package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.rungtone.testing.Cli;
import org.rungtone.testing.WavFixtures;

class BuildCommandTest {
    @TempDir
    Path dir;

    Path fixture() throws IOException {
        Path wav = dir.resolve("bell.wav");
        Files.write(wav, WavFixtures.sine16(44_100, 0.5, 523.25, 0.5));
        return wav;
    }

    @Test
    void writesAllOutputs() throws IOException {
        Path out = dir.resolve("out");
        Cli.Run r = Cli.run("build", fixture().toString(), "--bits", "6", "--rate", "16k", "--out", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        assertEquals("", r.err());
        List<String> expected = List.of("bell.h", "bell.c", "preview.wav", "error-spectrum.png", "spectrum.png",
                "report.txt", "report.json", "report.html");
        for (String f : expected) {
            assertTrue(Files.size(out.resolve(f)) > 0, f);
        }
        assertTrue(r.out().contains("6 bits at 16kHz, 8000 samples, 0.500 s"), r.out());
        String json = Files.readString(out.resolve("report.json"));
        assertTrue(json.contains("\"samples\": 8000"), json);
        try (Stream<Path> s = Files.list(out)) {
            List<String> withManifest = new java.util.ArrayList<>(expected);
            withManifest.add(".rungtone-build-files");
            assertEquals(withManifest.stream().sorted().toList(),
                    s.map(p -> p.getFileName().toString()).sorted().toList(), "no temporary files left behind");
        }
        // the manifest lists exactly the files the build wrote
        assertEquals(expected.stream().sorted().toList(), Files.readAllLines(out.resolve(".rungtone-build-files"))
                .stream().skip(1).toList());
        // the fixture is C5, 523.25 Hz: the fitted frequency shows as 523.2 or 523.3 depending on the dither
        java.util.regex.Matcher tone = java.util.regex.Pattern.compile("single tone at 523\\.[23]Hz: SINAD"
                + " (-?[0-9.]+) dB").matcher(r.out());
        assertTrue(tone.find(), r.out());
        // a single tone gets the IEEE 1241 figures: 6 bits, 6.02·6 + 1.76 dB (Bennett 1948) less 4.77 dB for
        // TPDF dither (Lipshitz, Wannamaker & Vanderkooy 1992) less 1 dB for the −1 dBFS normalization
        assertEquals(6.02 * 6 + 1.76 - 4.77 - 1.0, Double.parseDouble(tone.group(1)), 0.4);
    }

    @Test
    void quantizedSnrIsNearTheoryForASine() throws IOException {
        Path out = dir.resolve("o");
        Cli.Run r = Cli.run("build", fixture().toString(), "--bits", "10", "--dither", "none", "--json",
                "--out", out.toString());
        assertEquals(0, r.exitCode(), r.err());
        double snr = com.google.gson.JsonParser.parseString(r.out()).getAsJsonObject().getAsJsonObject("tone")
                .get("snr_db").getAsDouble();
        // Bennett 1948: 6.02*10 + 1.76 = 61.96 dB for a full-scale sine; normalized to -1 dBFS it is 1 dB less.
        assertEquals(61.96 - 1, snr, 1.0);
    }

    @Test
    void sameInputsGiveIdenticalOutputs() throws IOException {
        Path wav = fixture();
        Cli.run("build", wav.toString(), "--out", dir.resolve("a").toString(), "--seed", "5");
        Cli.run("build", wav.toString(), "--out", dir.resolve("b").toString(), "--seed", "5");
        assertEquals(Files.readString(dir.resolve("a/bell.c")), Files.readString(dir.resolve("b/bell.c")));
    }

    static Stream<Arguments> badInputs() {
        return Stream.of(
                Arguments.of("missing", null, List.of("--bits", "6"), "missing.wav: no such file"),
                Arguments.of("notriff.wav", "just some text, no audio".getBytes(), List.of(), "is not a WAV file"),
                Arguments.of("trunc.wav", new byte[] {'R', 'I', 'F', 'F', 0, 0, 0, 0, 'W', 'A', 'V', 'E', 'f', 'm'},
                        List.of(), "has no fmt chunk (truncated header?)"),
                Arguments.of("adpcm.wav", WavFixtures.wav().layout(WavFixtures.Layout.U8, 1, 8000, new double[] {0})
                        .tag(0x11).bytes(), List.of(), "uses format tag 0x0011 (IMA ADPCM)"),
                Arguments.of("nochan.wav", WavFixtures.wav().layout(WavFixtures.Layout.S16, 1, 8000,
                        new double[] {0}).channels(0).blockAlign(2).bytes(), List.of(), "says it has 0 channels"),
                Arguments.of("rate.wav", WavFixtures.wav().layout(WavFixtures.Layout.S16, 1, 8000,
                        new double[] {0}).rate(1_000_000).bytes(), List.of(), "unusable sample rate"),
                Arguments.of("bits.wav", WavFixtures.sine16(8000, 0.1, 440, 0.5), List.of("--bits", "17"),
                        "--bits: bit depth must be 1..16, got 17"),
                Arguments.of("song.mp3", new byte[] {1, 2, 3}, List.of(),
                        "is not a source Rungtone reads; give a .wav file or a .rung script"));
    }

    @ParameterizedTest
    @MethodSource("badInputs")
    void badInputGivesOneLineExitOneAndNoFiles(String name, byte[] bytes, List<String> extra, String message)
            throws IOException {
        Path src = dir.resolve(name.contains(".") ? name : name + ".wav");
        if (bytes != null) {
            Files.write(src, bytes);
        }
        Path out = dir.resolve("out-" + name);
        List<String> args = new java.util.ArrayList<>(List.of("build", src.toString(), "--out", out.toString()));
        args.addAll(extra);
        Cli.Run r = Cli.run(args.toArray(new String[0]));
        assertEquals(1, r.exitCode(), r.err());
        assertTrue(r.err().startsWith("rungtone: error: "), r.err());
        assertTrue(r.err().contains(message), r.err());
        assertEquals(1, r.err().strip().split("\n").length, "one line: " + r.err());
        assertFalse(r.err().contains("Exception"), r.err());
        assertFalse(Files.exists(out), "no output folder");
    }

    @Test
    void outputFolderThatIsAFileIsBadInput() throws IOException {
        Path file = dir.resolve("taken");
        Files.writeString(file, "x");
        Cli.Run r = Cli.run("build", fixture().toString(), "--out", file.toString());
        assertEquals(1, r.exitCode());
        assertEquals("rungtone: error: " + file + ": output folder cannot be created, " + file
                + " is a file; choose another output folder (--out)\n", r.err());
        Cli.Run r2 = Cli.run("build", fixture().toString(), "--out", file.resolve("sub").toString());
        assertEquals(1, r2.exitCode());
        assertEquals("x", Files.readString(file));
    }

    @Test
    void emitsACompletePlayerForATarget() throws IOException {
        Path out = dir.resolve("avr");
        Cli.Run r = Cli.run("build", fixture().toString(), "--bits", "6", "--target", "avr", "--cpu-clock", "16MHz",
                "--pins", "PD2-PD7", "--out", out.toString(), "--name", "bell");
        assertEquals(0, r.exitCode(), r.err());
        for (String f : List.of("bell.h", "bell.c", "bell_data.c")) {
            assertTrue(Files.exists(out.resolve(f)), f);
        }
        // 16 MHz / 16 kHz = 1000 cycles: prescaler 1, compare value 999, exact (hand-computed)
        assertTrue(r.out().contains("prescaler 1, OCR1A = 999"), r.out());
    }

    @Test
    void aDdsOptionOverridesOnlyItsOwnProjectSetting() throws IOException {
        // the bench generator project asks for 1 kHz with a 32-bit accumulator; the option moves the frequency
        Path project = Path.of("examples/bench-generator/bench-generator.toml").toAbsolutePath();
        Cli.Run r = Cli.run("build", project.toString(), "--dds-frequency", "440", "--out",
                dir.resolve("bg").toString(), "--json");
        assertEquals(0, r.exitCode(), r.err());
        com.google.gson.JsonObject dds = com.google.gson.JsonParser.parseString(r.out()).getAsJsonObject()
                .getAsJsonObject("firmware").getAsJsonObject("dds");
        assertEquals(32, dds.get("phase_bits").getAsInt());
        assertEquals(440, dds.get("requested_hz").getAsDouble(), 0);
        assertTrue(Files.readString(dir.resolve("bg").resolve("report.txt")).contains("32-bit phase accumulator"));
    }

    @Test
    void flashBudgetOverflowIsBadInputWithAProposal() throws IOException {
        Path out = dir.resolve("over");
        Cli.Run r = Cli.run("build", fixture().toString(), "--bits", "8", "--flash-budget", "4000", "--out",
                out.toString());
        assertEquals(1, r.exitCode(), r.err());
        assertTrue(r.err().startsWith("rungtone: error: the samples need 8,000 bytes"), r.err());
        assertTrue(r.err().contains("would fit"), r.err());
        assertFalse(Files.exists(out));
    }

    @Test
    void badPinsAreBadInput() throws IOException {
        Path out = dir.resolve("pins");
        Cli.Run r = Cli.run("build", fixture().toString(), "--bits", "6", "--pins", "PB0-PB4", "--out",
                out.toString());
        assertEquals(1, r.exitCode(), r.err());
        assertEquals(1, r.err().strip().split("\n").length, r.err());
        assertFalse(Files.exists(out));
    }

    @Test
    void unknownOptionIsUsageError() throws IOException {
        Cli.Run r = Cli.run("build", fixture().toString(), "--bitz", "6");
        assertEquals(2, r.exitCode());
        assertEquals("rungtone: error: unknown option '--bitz'; did you mean --bits?\n"
                + "Try 'rungtone build --help' for the options.\n", r.err());
    }

    @Test
    void badUnitIsUsageError() throws IOException {
        Cli.Run r = Cli.run("build", fixture().toString(), "--rate", "5V");
        assertEquals(2, r.exitCode());
        assertTrue(r.err().contains("'5V' is not a frequency"), r.err());
    }

    @Test
    void helpShowsAnExample() {
        Cli.Run r = Cli.run("build", "--help");
        assertEquals(0, r.exitCode());
        assertTrue(r.out().contains("Example:"), r.out());
    }
}
