package org.rungtone.testing;

import java.io.PrintWriter;
import java.io.StringWriter;
import org.rungtone.cli.Main;
import picocli.CommandLine;

/** Runs the command line in-process with captured output, as picocli's own tests do. */
public final class Cli {
    private Cli() {
    }

    /**
     * The outcome of one run.
     *
     * @param exitCode the exit code
     * @param out what went to stdout
     * @param err what went to stderr
     */
    public record Run(int exitCode, String out, String err) {
    }

    /** Runs {@code rungtone ARGS...}. */
    public static Run run(String... args) {
        CommandLine cl = Main.newCommandLine();
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        cl.setOut(new PrintWriter(out));
        cl.setErr(new PrintWriter(err));
        int code = cl.execute(args);
        return new Run(code, out.toString(), err.toString());
    }
}
