package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import picocli.CommandLine;

/**
 * docs/commands.md is generated from the command model: every command's --help, in order. The test fails
 * when the committed page is out of date; run with {@code -Drungtone.regenerate=true} to rewrite it.
 */
class CommandReferenceTest {
    static final Path PAGE = Path.of("docs/commands.md");

    static String page() {
        StringBuilder b = new StringBuilder();
        b.append("# Command reference\n\n");
        b.append("Generated from the command model by `CommandReferenceTest`; do not edit by hand.\n");
        append(b, Main.newCommandLine(), 2);
        return b.toString();
    }

    private static void append(StringBuilder b, CommandLine cl, int level) {
        String name = cl.getCommandSpec().qualifiedName();
        if (name.endsWith(" help")) {
            return;
        }
        b.append('\n').append("#".repeat(level)).append(" `").append(name).append("`\n\n```\n");
        StringWriter w = new StringWriter();
        cl.usage(new PrintWriter(w), CommandLine.Help.Ansi.OFF);
        b.append(w.toString().stripTrailing()).append("\n```\n");
        for (CommandLine sub : cl.getSubcommands().values()) {
            append(b, sub, Math.min(4, level + 1));
        }
    }

    @Test
    void committedReferenceMatchesTheCommands() throws IOException {
        String made = page();
        if (Boolean.getBoolean("rungtone.regenerate")) {
            Files.writeString(PAGE, made);
        }
        assertEquals(made, Files.readString(PAGE), "regenerate with -Drungtone.regenerate=true");
    }
}
