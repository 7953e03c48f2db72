package org.rungtone.cli;

import java.io.PrintWriter;
import org.rungtone.internal.InputError;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.ParseResult;

/** The {@code rungtone} command: lists the subcommands and maps failures to exit codes. */
@Command(name = "rungtone",
        mixinStandardHelpOptions = true,
        versionProvider = Version.Provider.class,
        description = {"Turns sounds and waveform scripts into firmware for resistor-ladder DACs on GPIO pins, "
            + "and tells you how the result will sound on your board.", ""},
        subcommands = {
            BuildCommand.class,
            CalibrateCommand.class,
            DemoCommand.class,
            InitCommand.class,
            LadderCommand.class,
            SurveyCommand.class,
            CompletionCommand.class,
            CommandLine.HelpCommand.class},
        exitCodeListHeading = "%nExit codes:%n",
        exitCodeList = {
            " 0:done",
            " 1:bad input (a file or value you can fix; one line says which)",
            " 2:bad usage (unknown option, missing argument)",
            " 3:internal error (please report it with --verbose output)"},
        footer = {"%nRun 'rungtone COMMAND --help' for the options of a command; start with 'rungtone demo'."})
public final class Main implements Runnable {
    /** Exit code: bad input the user can fix. */
    public static final int EXIT_INPUT = 1;
    /** Exit code: bad usage. */
    public static final int EXIT_USAGE = 2;
    /** Exit code: internal error. */
    public static final int EXIT_INTERNAL = 3;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    private Main() {
    }

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    /** Runs the tool and exits with its exit code. */
    public static void main(String[] args) {
        if (args.length == 1 && (args[0].equals("--version") || args[0].equals("-V"))) {
            // Build scripts ask this often: answer before building the whole command model (lazy start).
            for (String line : new Version.Provider().getVersion()) {
                System.out.println(line);
            }
            System.exit(0);
        }
        int code;
        try {
            code = newCommandLine().execute(args);
        } catch (OutOfMemoryError e) {
            System.err.println("rungtone: error: out of memory for this input; give Java more with"
                    + " RUNGTONE_JAVA_OPTS=-Xmx4g (or shorten the sound)");
            if (java.util.Arrays.asList(args).contains("--verbose")) {
                e.printStackTrace();
            }
            code = EXIT_INTERNAL;
        }
        System.exit(code);
    }

    /** A configured command line, for {@link #main} and for tests that capture its output. */
    public static CommandLine newCommandLine() {
        CommandLine cl = new CommandLine(new Main());
        cl.setExecutionExceptionHandler(Main::handleFailure);
        cl.setParameterExceptionHandler(Main::handleUsage);
        cl.setExitCodeExceptionMapper(t -> t instanceof CommandLine.ParameterException ? EXIT_USAGE
                : t instanceof InputError ? EXIT_INPUT : EXIT_INTERNAL);
        cl.setCaseInsensitiveEnumValuesAllowed(true);
        return cl;
    }

    private static int handleFailure(Exception e, CommandLine cl, ParseResult parsed) {
        PrintWriter err = cl.getErr();
        boolean verbose = isVerbose(parsed);
        if (e instanceof InputError) {
            err.println("rungtone: error: " + e.getMessage());
            if (e instanceof org.rungtone.script.ScriptError se) {
                // under the one-line message: the script line and a caret at the column
                for (String line : se.excerpt()) {
                    err.println("  " + line);
                }
            }
            if (verbose) {
                e.printStackTrace(err);
            }
            err.flush();
            return EXIT_INPUT;
        }
        err.println("rungtone: internal error: " + e);
        if (verbose) {
            e.printStackTrace(err);
        } else {
            err.println("rungtone: run again with --verbose for details, and please report it");
        }
        err.flush();
        return EXIT_INTERNAL;
    }

    private static int handleUsage(CommandLine.ParameterException e, String[] args) {
        CommandLine cl = e.getCommandLine();
        PrintWriter err = cl.getErr();
        err.println("rungtone: error: " + e.getMessage());
        CommandLine.UnmatchedArgumentException.printSuggestions(e, err);
        err.println("Try '" + cl.getCommandSpec().qualifiedName() + " --help' for the options.");
        err.flush();
        return EXIT_USAGE;
    }

    private static boolean isVerbose(ParseResult parsed) {
        for (ParseResult p = parsed; p != null; p = p.subcommand()) {
            if (p.hasMatchedOption("--verbose")) {
                return true;
            }
        }
        return false;
    }
}
