package org.rungtone.project;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.function.IntFunction;
import org.rungtone.calibrate.UnitProfile;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;
import org.rungtone.ladder.LadderDescription;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;

/**
 * Decides which levels a board produces, for every command alike: a measured unit profile wins, else the
 * described ladder's model, else none (the ideal ladder). The bit depth follows: the one asked for, else the
 * profile's, else the ladder's, else {@link LadderSpec#DEFAULT_BITS}.
 */
public final class Boards {
    private Boards() {
    }

    /**
     * The board a command works with.
     *
     * @param levels the board's real levels, when known (profile, else modelled ladder)
     * @param spec the ladder description, when given (or, with a profile, at the profile's bit depth)
     * @param profile the unit profile, when given
     * @param warnings what the user should be told
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

        /** The bit depth: the profile's, else the description's, else {@link LadderSpec#DEFAULT_BITS}. */
        public int bits() {
            return bits(LadderSpec.DEFAULT_BITS);
        }
    }

    /**
     * The board of one sound, one ladder or one calibration.
     *
     * @param profile a measured unit profile, when given
     * @param ladder the ladder description ({@link LadderDescription#none()} when there is none)
     * @param bits the bit depth asked for, when asked
     * @param alwaysSpec describe a ladder (defaults filled in) even when none was given
     * @throws InputError when the profile cannot be read or its bit depth disagrees with the asked one or the
     *     ladder's
     */
    public static Board decide(Optional<Path> profile, LadderDescription ladder, OptionalInt bits,
            boolean alwaysSpec) {
        int bitsOrZero = bits.orElse(0);
        if (profile.isEmpty()) {
            Optional<LadderSpec> spec = alwaysSpec ? Optional.of(ladder.spec(bitsOrZero))
                    : ladder.specIfGiven(bitsOrZero);
            return new Board(spec.map(LadderSpec::levels), spec, Optional.empty(), List.of());
        }
        Path file = profile.get();
        UnitProfile p = UnitProfile.load(file);
        if (bitsOrZero != 0 && bitsOrZero != p.bits()) {
            throw Setting.BITS.problem("%s %d disagrees with the unit profile %s, which has %d bits; leave %s out"
                    + " or use this board's profile", Setting.BITS.ref(), bitsOrZero, file, p.bits(),
                    Setting.BITS.ref());
        }
        List<String> warnings = new ArrayList<>();
        Optional<LadderSpec> spec = Optional.empty();
        if (ladder.given()) {
            if (ladder.statesBits()) {
                LadderSpec stated = ladder.spec(bitsOrZero);
                if (stated.bits() != p.bits()) {
                    throw new InputError("the ladder description has " + stated.bits() + " bits but the unit"
                            + " profile " + file + " has " + p.bits() + "; they must describe the same board");
                }
            }
            spec = Optional.of(ladder.spec(p.bits()));
            warnings.add("the unit profile " + file + " gives the board's levels; the ladder description is"
                    + " not used for them");
        } else if (alwaysSpec) {
            spec = Optional.of(ladder.spec(p.bits()));
        }
        return new Board(Optional.of(p.levels()), spec, Optional.of(p), warnings);
    }

    /**
     * The levels of a project's board, first match wins: a unit profile given on the command line, the
     * project's {@code unit}, the project's {@code [ladder]} table with the command line's ladder keys on top,
     * else none (the ideal ladder).
     *
     * @param unitOverride a unit profile given on the command line
     * @param ladder the command line's ladder description, {@link LadderDescription#none()} when none
     * @param bitsOrZero bits fixed by the command line or {@code [quantize]}, 0 when open
     */
    public static Optional<LevelTable> ofProject(Project project, Optional<Path> unitOverride,
            LadderDescription ladder, int bitsOrZero) {
        if (unitOverride.isPresent()) {
            return decide(unitOverride, ladder, bitsOrZero == 0 ? OptionalInt.empty() : OptionalInt.of(bitsOrZero),
                    false).levels();
        }
        if (project.unitProfile().isPresent()) {
            UnitProfile p = UnitProfile.load(project.unitProfile().get());
            if (bitsOrZero != 0 && bitsOrZero != p.bits()) {
                throw new InputError(project.file() + ": project.unit " + project.unitProfile().get()
                        + " has " + p.bits() + " bits but the project asks for " + bitsOrZero);
            }
            return Optional.of(p.levels());
        }
        if (project.ladder().isEmpty() && !ladder.given()) {
            return Optional.empty();
        }
        LadderDescription d = project.ladder().map(ladder::over).orElse(ladder);
        return Optional.of(d.spec(bitsOrZero).levels());
    }

    /**
     * The level table at each bit depth a survey tries: a unit profile's (at its own depth only), the
     * described ladder's at each depth, else the ideal ladder with {@code idealFullScaleVolts}.
     *
     * @throws InputError when the profile cannot be read; the function throws for a depth the board cannot have
     */
    public static IntFunction<LevelTable> perDepth(Optional<Path> profile, LadderDescription ladder,
            double idealFullScaleVolts) {
        if (profile.isPresent()) {
            LevelTable measured = decide(profile, ladder, OptionalInt.empty(), false).levels().orElseThrow();
            return b -> {
                if (b != measured.bits()) {
                    throw Setting.SURVEY_BITS.problem("the unit profile has %d bits; survey it with %s %d",
                            measured.bits(), Setting.SURVEY_BITS.ref(), measured.bits());
                }
                return measured;
            };
        }
        if (!ladder.given()) {
            return b -> LevelTable.ideal(b, idealFullScaleVolts);
        }
        LadderSpec base = ladder.spec(0);
        return b -> {
            if (b != base.bits() && !base.resistors().isEmpty()) {
                throw new InputError("the ladder lists " + base.resistors().size() + " resistors, so it can only"
                        + " be surveyed at " + base.bits() + " bits; give base_r instead of resistors to survey"
                        + " other depths");
            }
            LadderSpec s = b == base.bits() ? base : base.toBuilder().bits(b).build();
            // one description for every depth, so the report names the ladder once
            return s.levels().withOrigin("modelled " + s.describe().replaceFirst(" \\d+-bit", ""));
        };
    }
}
