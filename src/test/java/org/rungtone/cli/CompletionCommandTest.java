package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;

class CompletionCommandTest {
    private record Run(int exit, String out, String err) {
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        CommandLine cl = Main.newCommandLine();
        cl.setOut(new PrintWriter(out));
        cl.setErr(new PrintWriter(err));
        int exit = cl.execute(args);
        return new Run(exit, out.toString(), err.toString());
    }

    @Test
    void printsABashScriptCoveringTheCommandModel() {
        Run r = run("completion");
        assertEquals(0, r.exit(), r.err());
        assertEquals("", r.err());
        String script = r.out();
        assertTrue(script.startsWith("#!/usr/bin/env bash"), script.substring(0, 40));
        // the function is registered for the tool's own name
        assertTrue(script.contains("complete -F _complete_rungtone"), "no complete -F line");
        for (String command : new String[] {"build", "ladder", "demo", "completion"}) {
            assertTrue(script.contains(command), command);
        }
        for (String option : new String[] {"--bits", "--rate", "--dither", "--out", "--shell"}) {
            assertTrue(script.contains(option), option);
        }
    }

    @Test
    void setsZshUpThroughBashcompinit() {
        Run r = run("completion", "--shell", "zsh");
        assertEquals(0, r.exit(), r.err());
        assertTrue(r.out().contains("bashcompinit"));
        assertEquals(run("completion").out(), r.out());
    }

    @Test
    void scriptIsTheSameOnEveryRunAndEvenWhenQuiet() {
        assertEquals(run("completion").out(), run("completion", "--quiet").out());
    }

    @Test
    void rejectsAnUnknownShellAsUsage() {
        Run r = run("completion", "--shell", "fish");
        assertEquals(2, r.exit());
        assertTrue(r.err().startsWith("rungtone: error: Invalid value for option '--shell'"), r.err());
    }
}
