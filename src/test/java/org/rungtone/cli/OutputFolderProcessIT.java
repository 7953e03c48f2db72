package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.File;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.testing.WavFixtures;

/**
 * Real processes writing one output folder: interrupted with SIGINT halfway, and two at once. The folder must
 * end exactly as one whole run left it, with no staging folder beside it.
 */
class OutputFolderProcessIT {
    @TempDir
    Path dir;

    private Path wav;
    private Path out;

    @BeforeEach
    void longSound() throws IOException {
        wav = dir.resolve("hum.wav");
        // a 90 s tone takes a second or more to build, long enough to interrupt halfway
        Files.write(wav, WavFixtures.sine16(44_100, 90, 220, 0.5));
        out = dir.resolve("out");
    }

    private Process start(String... extra) throws IOException {
        List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java")
                .toString(), "-cp", System.getProperty("java.class.path"), "org.rungtone.cli.Main", "build",
                wav.toString(), "--bits", "8", "--out", out.toString(), "-q"));
        cmd.addAll(Arrays.asList(extra));
        return new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(dir.resolve("log-"
                + System.nanoTime() + ".txt").toFile()).start();
    }

    /** Every file of the output folder (and anything hidden beside it) with a hash of its bytes. */
    private Map<String, Integer> snapshot() throws IOException {
        Map<String, Integer> m = new TreeMap<>();
        try (Stream<Path> s = Files.walk(dir)) {
            for (Path p : s.filter(Files::isRegularFile).toList()) {
                String rel = dir.relativize(p).toString().replace(File.separatorChar, '/');
                if (rel.startsWith("out/") || rel.startsWith(".")) {
                    m.put(rel, Arrays.hashCode(Files.readAllBytes(p)));
                }
            }
        }
        return m;
    }

    @Test
    void anInterruptedBuildLeavesTheFolderAsItWas() throws Exception {
        Process first = start();
        assertEquals(0, first.waitFor());
        Files.writeString(out.resolve("notes.txt"), "mine");
        Map<String, Integer> before = snapshot();
        Process second = start("--dither", "none", "--rate", "22.05k");
        Path staging = dir.resolve(".out.rungtone-new");
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(30);
        // the staging folder appears when the build starts; interrupt while it renders, or once it writes
        while (!Files.exists(staging) && second.isAlive() && System.nanoTime() < deadline) {
            Thread.sleep(2);
        }
        long halfway = System.nanoTime() + TimeUnit.MILLISECONDS.toNanos(400);
        while (second.isAlive() && System.nanoTime() < halfway && !Files.exists(staging.resolve("hum.h"))) {
            Thread.sleep(2);
        }
        assertTrue(second.isAlive(), "the build ended before it could be interrupted; make the sound longer");
        new ProcessBuilder("kill", "-INT", Long.toString(second.pid())).start().waitFor();
        assertTrue(second.waitFor(30, TimeUnit.SECONDS));
        assertEquals(before, snapshot(), "the folder must be exactly as it was");
        assertFalse(Files.exists(staging));
    }

    @Test
    void twoBuildsAtOnceNeverMix() throws Exception {
        Process a = start("--rate", "8k");
        Process b = start("--rate", "16k");
        int ea = a.waitFor();
        int eb = b.waitFor();
        assertTrue(ea == 0 || eb == 0, "at least one build finishes");
        assertTrue((ea == 0 || ea == 1) && (eb == 0 || eb == 1), "exit codes " + ea + ", " + eb);
        for (Path log : Files.list(dir).filter(p -> p.getFileName().toString().startsWith("log-")).toList()) {
            String text = Files.readString(log);
            assertTrue(text.isEmpty() || text.contains("another Rungtone command is writing " + out), text);
        }
        // one whole build: the manifest lists exactly the files there, and the report names one rate
        List<String> listed = Files.readAllLines(out.resolve(".rungtone-build-files")).stream().skip(1).toList();
        try (Stream<Path> s = Files.list(out)) {
            List<String> there = new ArrayList<>(s.map(p -> p.getFileName().toString())
                    .filter(n -> !n.startsWith(".")).sorted().toList());
            assertEquals(listed, there);
        }
        String report = Files.readString(out.resolve("report.txt"));
        assertTrue(report.contains("8 bits at 8kHz,") ^ report.contains("8 bits at 16kHz,"), report);
        assertFalse(Files.exists(dir.resolve(".out.rungtone-new")));
    }
}
