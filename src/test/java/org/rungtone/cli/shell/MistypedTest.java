package org.rungtone.cli.shell;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import org.rungtone.testing.Cli;

/** A word a command does not know: one line naming it and the nearest of the command's own, exit 2 (usage). */
class MistypedTest {
    @Test
    void aMistypedOptionGetsTheNearestOfTheCommandsOwn() {
        Cli.Run r = Cli.run("build", "chime.wav", "--bitz", "6");
        assertEquals(2, r.exitCode());
        assertEquals("rungtone: error: unknown option '--bitz'; did you mean --bits?\n"
                + "Try 'rungtone build --help' for the options.\n", r.err());
    }

    @Test
    void theValueAfterAnEqualsSignIsNotPartOfTheName() {
        Cli.Run r = Cli.run("survey", "chime.wav", "--normalise=-3");
        assertEquals("rungtone: error: unknown option '--normalise'; did you mean --normalize?\n"
                + "Try 'rungtone survey --help' for the options.\n", r.err());
    }

    @Test
    void onlyTheCommandsOwnOptionsAreSuggested() {
        // --bits-list belongs to survey, not to ladder
        assertEquals("rungtone: error: unknown option '--bits-lst'\n"
                + "Try 'rungtone ladder --help' for the options.\n", Cli.run("ladder", "--bits-lst", "4").err());
        assertEquals("rungtone: error: unknown option '--bits-lst'; did you mean --bits-list?\n"
                + "Try 'rungtone survey --help' for the options.\n", Cli.run("survey", "x.wav", "--bits-lst", "4")
                .err());
    }

    @Test
    void equallyNearOptionsAreAllNamed() {
        assertEquals("rungtone: error: unknown option '--out-m'; did you mean --out-min, --out-max or --out?\n"
                + "Try 'rungtone ladder --help' for the options.\n", Cli.run("ladder", "--out-m", "1V").err());
    }

    @Test
    void aMistypedCommandGetsTheNearestCommand() {
        Cli.Run r = Cli.run("biuld", "chime.wav");
        assertEquals(2, r.exitCode());
        assertEquals("rungtone: error: unknown command 'biuld'; did you mean build?\n"
                + "Try 'rungtone --help' for the options.\n", r.err());
        assertEquals("rungtone: error: unknown command 'pln'; did you mean plan?\n"
                + "Try 'rungtone calibrate --help' for the options.\n", Cli.run("calibrate", "pln").err());
    }

    @Test
    void aWordFarFromEveryNameIsOnlyNamed() {
        assertEquals("rungtone: error: unknown option '--colour'\nTry 'rungtone build --help' for the options.\n",
                Cli.run("build", "chime.wav", "--colour").err());
        assertEquals("rungtone: error: unknown command 'frobnicate'\nTry 'rungtone --help' for the options.\n",
                Cli.run("frobnicate").err());
    }

    @Test
    void anExtraOperandKeepsThePlainMessage() {
        assertEquals("rungtone: error: Unmatched argument at index 2: 'b.wav'\n"
                + "Try 'rungtone build --help' for the options.\n", Cli.run("build", "a.wav", "b.wav").err());
    }
}
