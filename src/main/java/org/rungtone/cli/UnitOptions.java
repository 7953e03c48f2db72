package org.rungtone.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.rungtone.calibrate.UnitProfile;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LadderFile;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;
import org.tomlj.TomlTable;
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

    /**
     * The board a command works with: its levels, the ladder description (if any) and the bit depth.
     *
     * @param levels the board's real levels, when known (profile, else modelled ladder)
     * @param spec the ladder description, when given (or, with a profile, at the profile's bit depth)
     * @param profile the unit profile, when given
     * @param warnings what the command should tell the user
     */
    public record Board(Optional<LevelTable> levels, Optional<LadderSpec> spec, Optional<UnitProfile> profile,
            List<String> warnings) {
        /** Copies the list. */
        public Board {
            warnings = List.copyOf(warnings);
        }

        /** The bit depth: the profile's, else the description's, else {@code fallback}. */
        public int bits(int fallback) {
            return profile.map(UnitProfile::bits).orElse(spec.map(LadderSpec::bits).orElse(fallback));
        }
    }

    /**
     * Resolves the board from --unit, the ladder options and --bits.
     *
     * @param bitsOrZero the command's --bits, or 0 when not given
     * @param ladder the command's ladder options
     * @param alwaysSpec true to describe a ladder (defaults filled in) even when no ladder option was given
     * @throws InputError when the profile cannot be read or its bit depth disagrees with --bits or the ladder
     */
    public Board resolve(int bitsOrZero, LadderOptions ladder, boolean alwaysSpec) {
        if (unitFile == null) {
            Optional<LadderSpec> spec = alwaysSpec ? Optional.of(ladder.toSpec(bitsOrZero))
                    : ladder.specIfGiven(bitsOrZero);
            return new Board(spec.map(s -> s.levels()), spec,
                    Optional.empty(), List.of());
        }
        UnitProfile p = UnitProfile.load(unitFile);
        if (bitsOrZero != 0 && bitsOrZero != p.bits()) {
            throw new InputError("--bits " + bitsOrZero + " disagrees with the unit profile " + unitFile + ", which"
                    + " has " + p.bits() + " bits; leave --bits out or use this board's profile");
        }
        List<String> warnings = new ArrayList<>();
        Optional<LadderSpec> spec = Optional.empty();
        if (ladder.given()) {
            if (ladderFixesBits(ladder)) {
                LadderSpec stated = ladder.toSpec(bitsOrZero);
                if (stated.bits() != p.bits()) {
                    throw new InputError("the ladder description has " + stated.bits() + " bits but the unit"
                            + " profile " + unitFile + " has " + p.bits() + "; they must describe the same board");
                }
            }
            spec = Optional.of(ladder.toSpec(p.bits()));
            warnings.add("the unit profile " + unitFile + " gives the board's levels; the ladder description is"
                    + " not used for them");
        } else if (alwaysSpec) {
            spec = Optional.of(ladder.toSpec(p.bits()));
        }
        return new Board(Optional.of(p.levels()), spec, Optional.of(p), warnings);
    }

    /** True when the ladder file or options state the bit depth (bits, or a per-bit resistor list). */
    private static boolean ladderFixesBits(LadderOptions ladder) {
        if (ladder.resistors != null) {
            return true;
        }
        if (ladder.ladderFile == null) {
            return false;
        }
        TomlTable t = LadderFile.readTable(ladder.ladderFile);
        return t.contains("bits") || t.contains("resistors");
    }
}
