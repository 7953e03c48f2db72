package org.rungtone.ladder;

import java.util.Optional;

/**
 * A ladder as a user described it (a file, a project's table, command-line keys on top of either), not yet
 * fixed to a bit depth. Whoever knows where the keys were typed implements it, so that its errors name that
 * place.
 */
public interface LadderDescription {
    /** True when a ladder file, a table or any ladder key was given. */
    boolean given();

    /** True when the description itself fixes a bit depth (bits, or a per-bit resistor list). */
    boolean statesBits();

    /**
     * The ladder, defaults filling what was not given.
     *
     * @param bitsOrZero a bit depth fixed elsewhere, or 0 to keep the description's own
     * @throws org.rungtone.internal.InputError naming where the faulty key was typed
     */
    LadderSpec spec(int bitsOrZero);

    /**
     * This description on top of a table given elsewhere (a project's {@code [ladder]}): a ladder file named
     * here replaces the table; keys given here override it. The default: the table as written.
     */
    default LadderDescription over(LadderTable base) {
        return of(base);
    }

    /** The ladder when one was described. */
    default Optional<LadderSpec> specIfGiven(int bitsOrZero) {
        return given() ? Optional.of(spec(bitsOrZero)) : Optional.empty();
    }

    /** No description: the default ladder at the given bit depth. */
    static LadderDescription none() {
        return new LadderDescription() {
            @Override
            public boolean given() {
                return false;
            }

            @Override
            public boolean statesBits() {
                return false;
            }

            @Override
            public LadderSpec spec(int bitsOrZero) {
                LadderSpec.Builder b = LadderSpec.builder();
                if (bitsOrZero != 0) {
                    b.bits(bitsOrZero);
                }
                return b.build();
            }
        };
    }

    /** A table as written, with a bit depth fixed elsewhere replacing its own. */
    static LadderDescription of(LadderTable table) {
        return new LadderDescription() {
            @Override
            public boolean given() {
                return true;
            }

            @Override
            public boolean statesBits() {
                return table.statesBits();
            }

            @Override
            public LadderSpec spec(int bitsOrZero) {
                LadderSpec s = table.spec();
                return bitsOrZero != 0 && bitsOrZero != s.bits() ? s.toBuilder().bits(bitsOrZero).build() : s;
            }
        };
    }
}
