package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.testing.CToolchain;

/**
 * The progress line in a real pseudo-terminal (util-linux {@code script} runs the tool in one): it appears on
 * standard error when that is a terminal, not at all when standard error goes to a file, and never changes
 * the files written or the text on standard output.
 */
class ProgressOnTerminalIT {
    /** A Monte Carlo run of some 2^27 level evaluations, two seconds or more: long enough for the estimate. */
    private static final String LADDER = "ladder --topology r2r --bits 12 --monte-carlo 40000 --seed 3 --out out";
    /** Long enough (several seconds on 2 cores) that the line shows an estimate of the time left. */
    private static final String LONG_LADDER = LADDER.replace("40000", "100000");

    @TempDir
    Path dir;

    @BeforeEach
    void needsScript() {
        CToolchain.require("script");
    }

    private static String java() {
        return "'" + Path.of(System.getProperty("java.home"), "bin", "java") + "' -cp '"
                + System.getProperty("java.class.path") + "' org.rungtone.cli.Main";
    }

    /** What a terminal shows of {@code command} run in {@code folder}, its line ends as the program wrote them. */
    private String inTerminal(Path folder, String command) throws IOException {
        Files.createDirectories(folder);
        return CToolchain.run(folder, List.of("script", "-qefc", command, "/dev/null")).replace("\r\n", "\n");
    }

    @Test
    void aTerminalSeesTheLineAndNothingElseChanges() throws IOException {
        String shown = inTerminal(dir.resolve("terminal"), java() + " " + LONG_LADDER);
        assertTrue(shown.matches("(?s)\rMonte Carlo: 100000 boards  \\d+%  0:\\d\\d elapsed.*"), shown);
        assertTrue(shown.contains(" left"), shown);
        Path plain = Files.createDirectories(dir.resolve("plain"));
        String printed = CToolchain.run(plain, List.of("sh", "-c", java() + " " + LONG_LADDER + " 2>/dev/null"));
        // the line is drawn after carriage returns and blanked before the report
        String withoutLine = shown.replaceAll("\r[^\r\n]*elapsed[^\r\n]*", "").replaceAll("^\r *\r", "");
        assertEquals(printed, withoutLine);
        assertSameFiles(plain.resolve("out"), dir.resolve("terminal").resolve("out"));
    }

    @Test
    void standardErrorElsewhereShowsNoLine() throws IOException {
        Path folder = dir.resolve("redirected");
        String shown = inTerminal(folder, java() + " " + LADDER + " 2> err.txt");
        assertFalse(shown.contains("elapsed"), shown);
        assertEquals("", Files.readString(folder.resolve("err.txt")));
    }

    @Test
    void quietShowsNoLineEvenOnATerminal() throws IOException {
        assertEquals("", inTerminal(dir.resolve("quiet"), java() + " " + LADDER + " --quiet"));
    }

    private static void assertSameFiles(Path expected, Path actual) throws IOException {
        try (Stream<Path> files = Files.list(expected)) {
            for (Path f : files.toList()) {
                assertArrayEquals(Files.readAllBytes(f), Files.readAllBytes(actual.resolve(f.getFileName())),
                        f.getFileName().toString());
            }
        }
    }
}
