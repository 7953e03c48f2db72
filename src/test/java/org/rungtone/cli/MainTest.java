package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.List;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;

/** The top command builds only the subcommand a run names, and everything when it needs the others. */
class MainTest {
    private static List<String> names(String... args) {
        return List.copyOf(Main.newCommandLine(args).getSubcommands().keySet());
    }

    @Test
    void aNamedCommandIsBuiltAlone() {
        assertEquals(List.of("build"), names("build", "x.wav"));
        assertEquals(List.of("ladder"), names("ladder", "--help"));
    }

    /** The plotting machinery is loaded ahead only for runs that draw: not for help or the version. */
    @Test
    void onlyABuildOrDemoThatRunsWarmsUpThePlots() {
        assertTrue(Main.drawsPlots(new String[] {"build", "x.wav", "--bits", "8"}));
        assertTrue(Main.drawsPlots(new String[] {"demo"}));
        assertFalse(Main.drawsPlots(new String[] {"build", "--help"}));
        assertFalse(Main.drawsPlots(new String[] {"build", "x.wav", "-h"}));
        assertFalse(Main.drawsPlots(new String[] {"demo", "-V"}));
        assertFalse(Main.drawsPlots(new String[] {"ladder", "--bits", "8"}));
        assertFalse(Main.drawsPlots(new String[0]));
    }

    @Test
    void helpCompletionAndUnknownWordsSeeEveryCommand() {
        List<String> all = List.of("build", "calibrate", "demo", "init", "ladder", "survey", "completion", "help");
        assertEquals(all, names());
        assertEquals(all, names("help", "build"));
        assertEquals(all, names("completion", "bash"));
        assertEquals(all, names("biuld"));
        assertEquals(all, names("--help"));
    }

    @Test
    void aMistypedCommandStillGetsASuggestion() {
        CommandLine cl = Main.newCommandLine(new String[] {"biuld"});
        StringWriter err = new StringWriter();
        cl.setErr(new PrintWriter(err));
        int code = cl.execute("biuld");
        assertEquals(Main.EXIT_USAGE, code);
        assertTrue(err.toString().contains("build"), err.toString());
    }
}
