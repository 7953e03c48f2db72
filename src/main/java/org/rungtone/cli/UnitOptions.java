package org.rungtone.cli;

import java.nio.file.Path;
import java.util.Optional;
import java.util.OptionalInt;
import org.rungtone.cli.shell.Heading;
import org.rungtone.cli.shell.Section;
import org.rungtone.project.Boards;
import picocli.CommandLine.Option;

/**
 * {@code --unit PROFILE}: the measured levels of one built board (a unit profile from {@code calibrate fit})
 * instead of the ladder model's. Shared by build, survey and ladder. With a ladder description as well,
 * the profile gives the levels and the description the rest (wiring, pin currents); their bit depths must
 * agree.
 */
@Section(Heading.LADDER)
public final class UnitOptions {
    @Option(names = "--unit", paramLabel = "PROFILE",
            description = "Use the measured levels of your board: a unit profile written by 'rungtone calibrate"
                    + " fit'.")
    Path unitFile;

    /** True when --unit was given. */
    public boolean given() {
        return unitFile != null;
    }

    /** The profile, when given. */
    public Optional<Path> path() {
        return Optional.ofNullable(unitFile);
    }

    /** The board from --unit, the ladder options and --bits when given ({@link Boards#decide}). */
    public Boards.Board resolve(Integer bits, LadderOptions ladder, boolean alwaysSpec) {
        int given = LadderOptions.bitsOrZero(bits);
        return Boards.decide(path(), ladder, given == 0 ? OptionalInt.empty() : OptionalInt.of(given), alwaysSpec);
    }
}
