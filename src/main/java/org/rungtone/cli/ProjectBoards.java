package org.rungtone.cli;

import java.util.Optional;
import org.rungtone.calibrate.UnitProfile;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.project.Project;
import org.rungtone.project.ProjectBuild;

/**
 * Where a project's board levels come from, first match wins: {@code --unit} on the command line, the
 * project's {@code unit} profile, the ladder (the project's {@code [ladder]} table with ladder options on
 * top), else none (the ideal ladder).
 */
final class ProjectBoards {
    private ProjectBoards() {
    }

    /**
     * The resolver for a project.
     *
     * @param unit the command's --unit option, or null when the command has none
     * @param ladder the command's ladder options, or null when the command has none
     */
    static ProjectBuild.BoardResolver of(Project project, UnitOptions unit, LadderOptions ladder) {
        return (table, file, bits) -> {
            if (unit != null && unit.given()) {
                return unit.resolve(bits, ladder == null ? new LadderOptions() : ladder, false).levels();
            }
            if (project.unitProfile().isPresent()) {
                UnitProfile p = UnitProfile.load(project.unitProfile().get());
                if (bits != 0 && bits != p.bits()) {
                    throw new InputError(project.file() + ": project.unit " + project.unitProfile().get()
                            + " has " + p.bits() + " bits but the project asks for " + bits);
                }
                return Optional.of(p.levels());
            }
            boolean options = ladder != null && ladder.given();
            if (table == null && !options) {
                return Optional.empty();
            }
            LadderSpec s = ladder != null ? ladder.toSpec(table, file, bits) : LadderSpec.fromToml(table, file);
            if (ladder == null && bits != 0 && bits != s.bits()) {
                s = s.toBuilder().bits(bits).build();
            }
            return Optional.of(s.levels());
        };
    }
}
