package org.rungtone.cli;

import java.io.PrintWriter;
import java.util.function.Supplier;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;

/** Options every command has: --quiet and --verbose. */
public final class CommonOptions {
    @Option(names = {"-q", "--quiet"}, description = "Print nothing but errors.")
    boolean quiet;

    @Option(names = {"-v", "--verbose"}, description = "Print more detail, and stack traces on errors.")
    boolean verbose;

    /** Prints a command's result to its standard output: the JSON with {@code json}, else the text unless quiet. */
    void print(CommandSpec spec, boolean json, Supplier<String> jsonText, Supplier<String> text) {
        PrintWriter out = spec.commandLine().getOut();
        if (json) {
            out.print(jsonText.get());
        } else if (!quiet) {
            out.print(text.get());
        }
        out.flush();
    }
}
