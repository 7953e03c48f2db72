package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.rungtone.testing.Cli;

/** The completion command prints a script for the shell named; the scripts are tried in CompletionInShellsTest. */
class CompletionCommandTest {
    @Test
    void printsABashScriptByDefault() {
        Cli.Run r = Cli.run("completion");
        assertEquals(0, r.exitCode(), r.err());
        assertEquals("", r.err());
        assertTrue(r.out().startsWith("# bash completion for rungtone, written by 'rungtone completion bash'"),
                r.out().substring(0, 80));
        assertTrue(r.out().endsWith("complete -F _rungtone rungtone\n"));
        assertEquals(r.out(), Cli.run("completion", "bash").out());
    }

    @Test
    void printsAScriptForEachShellItsOwnWay() {
        String zsh = Cli.run("completion", "zsh").out();
        assertTrue(zsh.startsWith("#compdef rungtone\n"), zsh.substring(0, 40));
        assertTrue(zsh.contains("'--dither=[Dither before quantizing (default tpdf).]:dither:(none rpdf tpdf)'"));
        String fish = Cli.run("completion", "FISH").out();
        assertTrue(fish.contains("complete -c rungtone -n '__rungtone_at 'build'' -l dither -x -a 'none rpdf tpdf'"
                .replace("'build''", "\\'build\\''")), fish);
    }

    @Test
    void scriptIsTheSameOnEveryRunAndEvenWhenQuiet() {
        assertEquals(Cli.run("completion", "zsh").out(), Cli.run("completion", "zsh", "--quiet").out());
    }

    @Test
    void rejectsAnUnknownShellAsUsage() {
        Cli.Run r = Cli.run("completion", "tcsh");
        assertEquals(2, r.exitCode());
        assertTrue(r.err().startsWith("rungtone: error: Invalid value for positional parameter at index 0 (SHELL)"),
                r.err());
    }
}
