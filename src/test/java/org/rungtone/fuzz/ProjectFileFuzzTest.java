package org.rungtone.fuzz;

import com.code_intelligence.jazzer.junit.FuzzTest;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.project.Project;
import org.rungtone.project.ProjectFile;

/**
 * Fuzz target: any text given to the project-file reader (and its {@code [ladder]} table to the ladder reader
 * and solver) either gives a {@link Project} with at least one sound and a ladder with finite levels, or
 * raises {@link InputError} with a one-line message naming the file; nothing else may escape. In
 * {@code mvn verify} this replays the seed corpus in
 * {@code src/test/resources/org/rungtone/fuzz/ProjectFileFuzzTestInputs/} (files named {@code regression-*}
 * are inputs that once escaped); {@code ./fuzz project 300} fuzzes it.
 */
class ProjectFileFuzzTest {
    private static final Path FILE = Path.of("fuzz.toml");

    @FuzzTest(maxDuration = "10m")
    void readsOrRejectsCleanly(byte[] data) {
        String text = new String(data, StandardCharsets.UTF_8);
        try {
            Project p = ProjectFile.parse(text, FILE);
            if (p.sounds().isEmpty()) {
                throw new AssertionError("accepted a project without sounds");
            }
            if (p.ladder().isPresent()) {
                LadderSpec ladder = p.ladder().get().spec();
                for (double v : ladder.levels().levels()) {
                    if (!Double.isFinite(v)) {
                        throw new AssertionError("non-finite level from an accepted ladder");
                    }
                }
            }
        } catch (InputError e) {
            FuzzMessages.checkMessage(e, FILE.toString());
        }
    }
}
