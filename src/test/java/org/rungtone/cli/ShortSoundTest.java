package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.testing.Cli;
import org.rungtone.testing.WavFixtures;

/**
 * Sounds too short for the quality figures, wavetables and silence build: the figures that cannot be measured
 * are left out with a warning, a wavetable's cycle is measured repeated, and only a sound of fewer than two
 * samples is refused, with a line that says why.
 */
class ShortSoundTest {
    @TempDir
    Path dir;

    private Path wav(String name, double seconds, double amplitude) throws IOException {
        Path f = dir.resolve(name);
        Files.write(f, WavFixtures.sine16(16_000, seconds, 1000, amplitude));
        return f;
    }

    private Cli.Run build(String... args) {
        String[] all = new String[args.length + 2];
        System.arraycopy(args, 0, all, 0, args.length);
        all[args.length] = "--out";
        all[args.length + 1] = dir.resolve("out").toString();
        return Cli.run(all);
    }

    private String report() throws IOException {
        return Files.readString(dir.resolve("out").resolve("report.txt"));
    }

    @Test
    void aTenSampleSoundBuildsWithoutFigures() throws IOException {
        Cli.Run r = build("build", wav("ten.wav", 10 / 16_000.0, 0.5).toString(), "--rate", "16k");
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(report().contains("quality figures need at least 16 samples and this sound has 10: they are"
                + " left out"), report());
        assertTrue(report().contains("ideal ladder  n/a"), report());
        assertTrue(Files.size(dir.resolve("out").resolve("ten.c")) > 0);
        assertFalse(Files.exists(dir.resolve("out").resolve("error-spectrum.png")), "no plot of an unmeasured error");
    }

    @Test
    void aRateOfOneHertzBuildsTwoSamples() throws IOException {
        Cli.Run r = build("build", wav("bell.wav", 1.6, 0.5).toString(), "--rate", "1");
        assertEquals(0, r.exitCode(), r.err());
        // 1.6 s at 1 Hz: floor(1.6) + the resampler's rounding = 2 samples
        assertTrue(report().contains("this sound has 2: they are left out"), report());
    }

    @Test
    void aScriptOfHalfAMillisecondBuilds() throws IOException {
        Path script = dir.resolve("blip.rung");
        Files.writeString(script, "duration 0.5ms\nrate 16kHz\nout sine(1kHz)\n");
        Cli.Run r = build("build", script.toString());
        assertEquals(0, r.exitCode(), r.err());
        // 0.5 ms at 16 kHz = 8 samples
        assertTrue(report().contains("this sound has 8: they are left out"), report());
    }

    @Test
    void aWavetableOfEightSamplesIsMeasuredOverItsRepeatedCycle() throws IOException {
        Path script = dir.resolve("cycle.rung");
        Files.writeString(script, "wavetable 8 samples\nout sine(1)\n");
        Cli.Run r = build("build", script.toString(), "--bits", "8");
        assertEquals(0, r.exitCode(), r.err());
        String report = report();
        assertFalse(report.contains("n/a"), report);
        java.util.regex.Matcher m = java.util.regex.Pattern.compile("ideal ladder +(-?[0-9.]+)").matcher(report);
        assertTrue(m.find(), report);
        // a sine's 8 samples on 8 bits with TPDF dither: far above 6-bit quality and below the 49.9 dB of an
        // undithered full-scale 8-bit sine (6.02 N + 1.76 dB, Bennett 1948)
        double sinad = Double.parseDouble(m.group(1));
        assertTrue(sinad > 30 && sinad < 50, report);
    }

    @Test
    void silenceBuildsWithAWarningInsteadOfFigures() throws IOException {
        Cli.Run r = build("build", wav("quiet.wav", 0.2, 0).toString());
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(report().contains("the sound is silent (one constant level) after conditioning: it builds as"
                + " that level, and there are no quality figures to measure against it"), report());
    }

    @Test
    void oneSampleIsRefusedNamingTheFileAndTheFix() throws IOException {
        Path one = wav("one.wav", 1 / 16_000.0, 0.5);
        Cli.Run r = build("build", one.toString(), "--rate", "16k");
        assertEquals(1, r.exitCode());
        assertEquals("rungtone: error: " + one + ": the sound is 1 sample at the target rate; a sound needs at"
                + " least 2: give a longer sound or a higher rate\n", r.err());
        assertFalse(Files.exists(dir.resolve("out")), "nothing written");
    }
}
