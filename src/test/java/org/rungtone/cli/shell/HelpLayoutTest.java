package org.rungtone.cli.shell;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.util.List;
import java.util.Map;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import org.rungtone.cli.Main;
import picocli.CommandLine;
import picocli.CommandLine.Model.OptionSpec;

/** Help lists options under headings and fits the width it is given. */
class HelpLayoutTest {
    private static String help(Map<String, String> env, String... command) {
        CommandLine cl = Main.newCommandLine();
        Terminal.fitHelp(cl, env);
        for (String name : command) {
            cl = cl.getSubcommands().get(name);
        }
        StringWriter w = new StringWriter();
        cl.usage(new PrintWriter(w), CommandLine.Help.Ansi.OFF);
        return w.toString();
    }

    private static int widest(String text) {
        return text.lines().mapToInt(String::length).max().orElse(0);
    }

    @Test
    void buildListsItsOptionsUnderHeadingsInTheirOrder() {
        String help = help(Map.of(), "build");
        List<String> headings = help.lines().filter(l -> l.matches("[A-Z][a-z ]+:")).toList();
        assertEquals(List.of("Input:", "Conditioning:", "Ladder:", "Quantizing:", "Firmware:", "Output:", "Example:"),
                headings);
        String input = help.substring(help.indexOf("Input:"), help.indexOf("Conditioning:"));
        assertTrue(input.contains("SOURCE") && input.contains("--channel"), input);
        String quantizing = help.substring(help.indexOf("Quantizing:"), help.indexOf("Firmware:"));
        for (String option : List.of("--bits", "--dither", "--shaping", "--seed", "--compensation", "--span")) {
            assertTrue(quantizing.contains(option + "="), option);
        }
        assertTrue(help.substring(help.indexOf("Output:")).contains("-h, --help"));
    }

    @Test
    void everyOptionIsListedOnce() {
        CommandLine build = Main.newCommandLine().getSubcommands().get("build");
        String help = help(Map.of(), "build");
        String list = help.substring(help.indexOf("Input:"), help.indexOf("Example:"));
        for (OptionSpec o : build.getCommandSpec().options()) {
            String name = o.longestName();
            int first = list.indexOf(" " + name + (o.arity().max() > 0 ? "=" : ""));
            assertTrue(first >= 0, name);
            assertEquals(-1, list.indexOf(" " + name + (o.arity().max() > 0 ? "=" : " "), first + 1), name);
        }
    }

    @Test
    void aCommandWhoseOptionsNameNoHeadingKeepsOnePlainList() {
        String help = help(Map.of(), "init");
        assertFalse(help.contains("Output:") || help.contains("Input:"), help);
        assertTrue(help.contains("  -h, --help"), help);
    }

    @Test
    void helpFitsTheColumnsItIsGiven() {
        assertTrue(widest(help(Map.of(), "survey")) <= 80);
        String wide = help(Map.of("COLUMNS", "132"), "survey");
        assertTrue(widest(wide) <= 132 && widest(wide) > 100, "widest line " + widest(wide));
        // picocli's narrowest help is 55 columns
        assertTrue(widest(help(Map.of("COLUMNS", "30"), "ladder")) <= 55);
    }

    @Test
    void columnsComeFromAPositiveNumberOnly() {
        assertEquals(OptionalInt.of(100), Terminal.columns(Map.of("COLUMNS", " 100")));
        assertEquals(OptionalInt.empty(), Terminal.columns(Map.of("COLUMNS", "wide")));
        assertEquals(OptionalInt.empty(), Terminal.columns(Map.of("COLUMNS", "0")));
        assertEquals(OptionalInt.empty(), Terminal.columns(Map.of()));
    }

    @Test
    void standardErrorOfATestRunIsNoTerminal() {
        // surefire gives the test JVM pipes, not a terminal
        assertFalse(Terminal.stderrIsTerminal());
    }
}
