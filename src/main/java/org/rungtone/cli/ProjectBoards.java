package org.rungtone.cli;

import java.util.Optional;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.project.ProjectBuild;

/** Board resolvers for project builds. */
final class ProjectBoards {
    private ProjectBoards() {
    }

    /** The project's [ladder] table as written, no command-line overrides. */
    static ProjectBuild.BoardResolver fromLadderTable() {
        return (table, file, bits) -> {
            if (table == null) {
                return Optional.empty();
            }
            LadderSpec s = LadderSpec.fromToml(table, file);
            if (bits != 0 && bits != s.bits()) {
                s = s.toBuilder().bits(bits).build();
            }
            return Optional.of(s.levels().withOrigin("modelled " + s.describe()));
        };
    }
}
