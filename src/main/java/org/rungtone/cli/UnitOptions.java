package org.rungtone.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalInt;
import org.rungtone.calibrate.UnitProfile;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LadderAnalysis;
import org.rungtone.project.Boards;
import org.rungtone.ladder.LevelTable;
import org.rungtone.ladder.Linearity;
import picocli.CommandLine.Option;

/**
 * {@code --unit PROFILE}: the measured levels of one built board (a unit profile from {@code calibrate fit})
 * instead of the ladder model's. Shared by build, survey and ladder. With a ladder description as well,
 * the profile gives the levels and the description the rest (wiring, pin currents); their bit depths must
 * agree.
 */
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

    /**
     * The board from --unit, the ladder options and --bits (see {@link Boards#decide}).
     *
     * @param bitsOrZero the command's --bits, or 0 when not given
     * @param ladder the command's ladder options
     * @param alwaysSpec true to describe a ladder (defaults filled in) even when no ladder option was given
     */
    public Boards.Board resolve(int bitsOrZero, LadderOptions ladder, boolean alwaysSpec) {
        return Boards.decide(path(), ladder, bitsOrZero == 0 ? OptionalInt.empty() : OptionalInt.of(bitsOrZero),
                alwaysSpec);
    }

    /**
     * The analysis of a modelled ladder with the profile's measured levels in place of the modelled ones:
     * linearity is recomputed against the same ideal transfer; wiring and pin currents stay modelled.
     *
     * @throws InputError when the profile's first and last levels are equal (no span to measure against)
     */
    static LadderAnalysis withLevels(LadderAnalysis a, UnitProfile p) {
        LevelTable levels = p.levels();
        if (levels.volts(0) == levels.volts(levels.size() - 1)) {
            throw new InputError(unitName(p) + ": the first and last levels are equal; there is no span to"
                    + " measure linearity against");
        }
        Linearity lin = Linearity.of(levels, a.ideal());
        List<String> w = new ArrayList<>();
        w.add("levels, linearity and plots are the measured ones of " + unitName(p) + "; wiring and pin currents"
                + " are modelled");
        if (!lin.isMonotonic()) {
            int worst = lin.worstDnlCode();
            w.add(String.format(Locale.ROOT, "the measured board is not monotonic: %d inverted steps, worst DNL"
                    + " %+.3f LSB at code %d", lin.invertedSteps().length, lin.dnlLsb(worst), worst));
        }
        for (String s : a.warnings()) {
            if (!s.startsWith("not monotonic")) {
                w.add(s);
            }
        }
        return new LadderAnalysis(a.ladder(), levels, a.ideal(), lin, a.pinCurrents(), a.minOutputOhms(),
                a.maxOutputOhms(), a.pinLimitAmps(), w.size() > LadderAnalysis.MAX_WARNINGS
                        ? w.subList(0, LadderAnalysis.MAX_WARNINGS) : w);
    }

    private static String unitName(UnitProfile p) {
        return "unit " + p.board() + " (" + p.date() + ")";
    }
}
