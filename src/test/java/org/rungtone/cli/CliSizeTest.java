package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * The command line stays thin: options, converters and one library call per command. Its size is the
 * architecture's guard (common practice, no source): past it, logic is creeping in that belongs in a stage,
 * {@code project} or {@code report}.
 */
class CliSizeTest {
    private static final int MAX_LINES = 2_000;

    @Test
    void theCommandLinePackageStaysUnderItsSize() throws IOException {
        long lines = 0;
        try (Stream<Path> files = Files.list(Path.of("src/main/java/org/rungtone/cli"))) {
            for (Path f : files.filter(p -> p.toString().endsWith(".java")).toList()) {
                lines += Files.readAllLines(f).size();
            }
        }
        assertTrue(lines > 500 && lines <= MAX_LINES, "cli/ has " + lines + " lines; at most " + MAX_LINES);
    }
}
