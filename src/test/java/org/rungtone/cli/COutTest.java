package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.testing.Cli;
import org.rungtone.testing.WavFixtures;

/**
 * {@code --c-out} and the project key {@code c_out}: the C files go to a folder of their own, which follows the
 * output folder's rules (replaced as a whole, the user's files kept, a failed build leaves it as it was).
 */
class COutTest {
    @TempDir
    Path dir;

    private Path wav() throws IOException {
        Path wav = dir.resolve("bell.wav");
        Files.write(wav, WavFixtures.sine16(16_000, 0.25, 440, 0.5));
        return wav;
    }

    /** Every file below {@code root} with its bytes' hash. */
    private static Map<String, Integer> snapshot(Path root) throws IOException {
        Map<String, Integer> m = new TreeMap<>();
        try (Stream<Path> s = Files.walk(root)) {
            for (Path p : s.filter(Files::isRegularFile).toList()) {
                m.put(root.relativize(p).toString(), java.util.Arrays.hashCode(Files.readAllBytes(p)));
            }
        }
        return m;
    }

    @Test
    void theCFilesGoApartFromReportsAndPreviews() throws IOException {
        Path out = dir.resolve("out");
        Path c = dir.resolve("fw/sound");
        Cli.Run r = Cli.run("build", wav().toString(), "--bits", "6", "--rate", "8k", "--target", "avr", "--pins",
                "PD2-PD7", "--cpu-clock", "16MHz", "--out", out.toString(), "--c-out", c.toString());
        assertEquals(0, r.exitCode(), r.err());
        assertEquals(List.of(".rungtone-c-files", "bell.c", "bell.h", "bell_data.c"), List.copyOf(snapshot(c)
                .keySet()));
        assertTrue(Files.isRegularFile(out.resolve("report.txt")));
        assertTrue(Files.isRegularFile(out.resolve("preview.wav")));
        assertFalse(Files.exists(out.resolve("bell.c")), "no C beside the reports");
        assertTrue(r.out().contains(c.resolve("bell.h").toString()), "the report lists the C files where they are");
        // the C files are those a build into one folder writes
        Path one = dir.resolve("one");
        Cli.run("build", wav().toString(), "--bits", "6", "--rate", "8k", "--target", "avr", "--pins", "PD2-PD7",
                "--cpu-clock", "16MHz", "--out", one.toString());
        for (String f : List.of("bell.c", "bell.h", "bell_data.c")) {
            assertArrayEquals(Files.readAllBytes(one.resolve(f)), Files.readAllBytes(c.resolve(f)), f);
        }
    }

    @Test
    void theCFolderIsReplacedAsAWholeAndAFailedBuildLeavesItAsItWas() throws IOException {
        Path out = dir.resolve("out");
        Path c = dir.resolve("c");
        assertEquals(0, Cli.run("build", wav().toString(), "--name", "bell", "--out", out.toString(), "--c-out",
                c.toString()).exitCode());
        Files.writeString(c.resolve("main.c"), "int main(void) { return 0; }\n");
        Map<String, Integer> before = snapshot(c);
        Cli.Run failed = Cli.run("build", wav().toString(), "--name", "chime", "--bits", "8", "--flash-budget", "100",
                "--out", out.toString(), "--c-out", c.toString());
        assertEquals(1, failed.exitCode(), failed.err());
        assertEquals(before, snapshot(c), "the C folder is exactly as it was");
        try (Stream<Path> s = Files.list(dir)) {
            assertEquals(List.of(), s.map(p -> p.getFileName().toString()).filter(n -> n.startsWith("."))
                    .toList(), "no staging folder left");
        }
        assertEquals(0, Cli.run("build", wav().toString(), "--name", "chime", "--out", out.toString(), "--c-out",
                c.toString()).exitCode());
        assertEquals(List.of(".rungtone-c-files", "chime.c", "chime.h", "main.c"), List.copyOf(snapshot(c)
                .keySet()), "the earlier build's C files are gone, the user's file is kept");
    }

    @Test
    void aCFolderThatHoldsTheOutputFolderOrIsAFileIsBadInput() throws IOException {
        Cli.Run r = Cli.run("build", wav().toString(), "--out", dir.resolve("c/out").toString(), "--c-out",
                dir.resolve("c").toString());
        assertEquals(1, r.exitCode());
        assertEquals("rungtone: error: --c-out " + dir.resolve("c") + " holds the output folder " + dir.resolve(
                "c/out") + "; give the C files a folder of their own, or put it inside the output folder\n", r.err());
        Path file = Files.writeString(dir.resolve("taken"), "x");
        Cli.Run r2 = Cli.run("build", wav().toString(), "--out", dir.resolve("o").toString(), "--c-out",
                file.toString());
        assertEquals(1, r2.exitCode());
        assertEquals("rungtone: error: " + file + ": output folder cannot be created, " + file
                + " is a file; choose another output folder (--c-out)\n", r2.err());
        assertFalse(Files.exists(dir.resolve("o")), "nothing written");
    }

    @Test
    void aCFolderInsideTheOutputFolderIsPartOfIt() throws IOException {
        Path out = dir.resolve("out");
        Cli.Run r = Cli.run("build", wav().toString(), "--out", out.toString(), "--c-out", out.resolve("src")
                .toString());
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(Files.isRegularFile(out.resolve("src/bell.c")));
        assertTrue(Files.readString(out.resolve(".rungtone-build-files")).contains("src/bell.c"));
    }

    @Test
    void theProjectKeyPlacesAProjectsCFilesAndTheOptionOverridesIt() throws IOException {
        Path project = dir.resolve("board.toml");
        Files.writeString(project, """
                [project]
                name = "board"
                out = "build/report"
                c_out = "firmware/sound"

                [target]
                family = "generic"
                pins = "PA0-PA5"

                [quantize]
                bits = 6
                rate = "8k"

                [[sound]]
                name = "bell"
                source = "bell.wav"
                """);
        wav();
        Cli.Run r = Cli.run("build", project.toString());
        assertEquals(0, r.exitCode(), r.err());
        Path c = dir.resolve("firmware/sound");
        assertEquals(List.of(".rungtone-c-files", "board.c", "board.h", "board_data.c"), List.copyOf(snapshot(c)
                .keySet()));
        assertTrue(Files.isRegularFile(dir.resolve("build/report/bell/preview.wav")));
        assertTrue(r.out().matches("(?s).*\\n  c_out +" + Pattern.quote(c + "  (project file)") + "\\n.*"), r.out());
        assertFalse(Files.readString(c.resolve("board.c")).contains(dir.toString()), "the C names no folder");
        Path moved = dir.resolve("elsewhere");
        Cli.Run o = Cli.run("build", project.toString(), "--c-out", moved.toString());
        assertEquals(0, o.exitCode(), o.err());
        assertArrayEquals(Files.readAllBytes(c.resolve("board.c")), Files.readAllBytes(moved.resolve("board.c")));
        assertTrue(o.out().contains(moved + "  (command line)"), o.out());
    }
}
