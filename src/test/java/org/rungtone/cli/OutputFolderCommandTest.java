package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.testing.Cli;
import org.rungtone.testing.WavFixtures;

/** Output folders as users meet them: replaced whole, their own files kept, readings never lost. */
class OutputFolderCommandTest {
    @TempDir
    Path dir;

    private Path bell() throws IOException {
        Path wav = dir.resolve("bell.wav");
        Files.write(wav, WavFixtures.sine16(44_100, 0.5, 523.25, 0.5));
        return wav;
    }

    /** Every file below {@code root} with a hash of its bytes; every hidden entry beside it too. */
    private static Map<String, Integer> snapshot(Path root) throws IOException {
        Map<String, Integer> m = new TreeMap<>();
        try (Stream<Path> s = Files.walk(root.getParent())) {
            for (Path p : s.filter(Files::isRegularFile).toList()) {
                String rel = root.getParent().relativize(p).toString();
                if (rel.startsWith(root.getFileName().toString()) || rel.startsWith(".")) {
                    m.put(rel, Arrays.hashCode(Files.readAllBytes(p)));
                }
            }
        }
        return m;
    }

    @Test
    void aLaterBuildRemovesTheFilesOfAnEarlierOneAndKeepsTheUsers() throws IOException {
        Path out = dir.resolve("chime");
        Cli.Run player = Cli.run("build", bell().toString(), "--name", "bell", "--target", "generic", "--pins",
                "PB0-PB5", "--bits", "6", "--out", out.toString(), "-q");
        assertEquals(0, player.exitCode(), player.err());
        assertTrue(Files.exists(out.resolve("bell_data.c")));
        Files.writeString(out.resolve("notes.txt"), "sounded fine at 40 % volume");
        Cli.Run array = Cli.run("build", bell().toString(), "--name", "bell", "--bits", "6", "--out",
                out.toString(), "-q");
        assertEquals(0, array.exitCode(), array.err());
        assertFalse(Files.exists(out.resolve("bell_data.c")), "the player's data file is gone");
        assertTrue(Files.exists(out.resolve("bell.c")));
        assertEquals("sounded fine at 40 % volume", Files.readString(out.resolve("notes.txt")));
    }

    @Test
    void aRefusedBuildLeavesTheFolderExactlyAsItWas() throws IOException {
        Path out = dir.resolve("chime");
        assertEquals(0, Cli.run("build", bell().toString(), "--bits", "6", "--out", out.toString(), "-q")
                .exitCode());
        Files.writeString(out.resolve("notes.txt"), "mine");
        Map<String, Integer> before = snapshot(out);
        // refused by the AVR compiler limits only after the sound was rendered
        Cli.Run r = Cli.run("build", bell().toString(), "--bits", "6", "--out", out.toString(), "--target", "avr",
                "--pins", "PB0-PB5", "--cpu-clock", "16MHz", "--flash-budget", "100");
        assertEquals(1, r.exitCode(), r.err());
        assertEquals(before, snapshot(out));
    }

    @Test
    void aPlanHoldingReadingsIsNeverOverwritten() throws IOException {
        Path out = dir.resolve("cal");
        String[] plan = {"calibrate", "plan", "--bits", "4", "--topology", "r2r", "--out", out.toString(), "-q"};
        assertEquals(0, Cli.run(plan).exitCode());
        Path csv = out.resolve("plan.csv");
        String filled = Files.readString(csv).replaceFirst("(?m)^(0,0000,[0-9.]+),$", "$1,0.002");
        Files.writeString(csv, filled);
        Cli.Run again = Cli.run(plan);
        assertEquals(1, again.exitCode());
        assertEquals("rungtone: error: " + csv + ": already holds 1 reading; rename it (e.g. to readings.csv) to"
                + " keep it, or write the new plan elsewhere (--out)\n", again.err());
        assertEquals(filled, Files.readString(csv));
    }

    @Test
    void commandsSharingAFolderKeepEachOthersFiles() throws IOException {
        Path out = dir.resolve("cal");
        assertEquals(0, Cli.run("calibrate", "plan", "--bits", "4", "--topology", "r2r", "--out", out.toString(),
                "-q").exitCode());
        assertEquals(0, Cli.run("calibrate", "simulate", "--bits", "4", "--topology", "r2r", "--out",
                out.toString(), "-q").exitCode());
        assertTrue(Files.exists(out.resolve("plan.csv")), "the plan stays beside the simulated readings");
        assertTrue(Files.exists(out.resolve("readings.csv")));
    }
}
