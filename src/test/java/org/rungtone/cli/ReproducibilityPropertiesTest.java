package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.LongRange;
import org.rungtone.testing.Cli;
import org.rungtone.testing.WavFixtures;

/**
 * The same inputs and seed give byte-identical outputs: {@code build} runs twice into the same folder with
 * TPDF dither and a complete AVR player, and every file it writes (C, preview WAV, PNG plots, text, JSON and
 * HTML reports) must match byte for byte. The one exception is report.json's {@code stage_ms} object, which
 * holds wall-clock stage timings; it is cut out of both copies before they are compared.
 */
class ReproducibilityPropertiesTest {
    private static final String TIMINGS = "(?s),?\\s*\"stage_ms\": \\{[^}]*\\}";

    @Property(tries = 2)
    void sameInputsAndSeedGiveIdenticalFiles(@ForAll @LongRange(min = -1000, max = 1000) long seed,
            @ForAll @IntRange(min = 3, max = 8) int bits) throws IOException {
        Path dir = Files.createTempDirectory("rungtone-repro");
        try {
            Path wav = dir.resolve("tone.wav");
            Files.write(wav, WavFixtures.sine16(22_050, 0.2, 660, 0.4));
            Path out = dir.resolve("out");
            String[] args = {"build", wav.toString(), "--bits", Integer.toString(bits), "--rate", "8k",
                "--dither", "tpdf", "--seed", Long.toString(seed), "--target", "avr", "--pins",
                "PB0-PB" + (bits - 1), "--cpu-clock", "16MHz", "--storage", "packed", "--out", out.toString(),
                "--quiet"};
            Cli.Run first = Cli.run(args);
            assertEquals(0, first.exitCode(), first.err());
            Map<String, byte[]> before = contents(out);
            Cli.Run second = Cli.run(args);
            assertEquals(0, second.exitCode(), second.err());
            Map<String, byte[]> after = contents(out);

            assertEquals(before.keySet(), after.keySet());
            assertTrue(before.keySet().containsAll(List.of("tone.c", "tone.h", "preview.wav", "report.json",
                    "report.txt", "report.html", "spectrum.png")), before.keySet().toString());
            for (String name : before.keySet()) {
                if (name.equals("report.json")) {
                    String a = new String(before.get(name), StandardCharsets.UTF_8);
                    String b = new String(after.get(name), StandardCharsets.UTF_8);
                    assertTrue(!a.replaceAll(TIMINGS, "").contains("stage_ms"), "timings cut out");
                    assertEquals(a.replaceAll(TIMINGS, ""), b.replaceAll(TIMINGS, ""), name);
                } else {
                    assertArrayEquals(before.get(name), after.get(name), name + " differs between runs");
                }
            }
        } finally {
            delete(dir);
        }
    }

    private static Map<String, byte[]> contents(Path folder) throws IOException {
        Map<String, byte[]> m = new TreeMap<>();
        try (Stream<Path> s = Files.list(folder)) {
            for (Path p : s.toList()) {
                m.put(p.getFileName().toString(), Files.readAllBytes(p));
            }
        }
        return m;
    }

    private static void delete(Path dir) throws IOException {
        try (Stream<Path> s = Files.walk(dir)) {
            for (Path p : s.sorted((a, b) -> b.getNameCount() - a.getNameCount()).toList()) {
                Files.deleteIfExists(p);
            }
        }
    }
}
