package org.rungtone.cli;

import java.io.PrintWriter;
import java.util.List;
import org.rungtone.cli.shell.HelpSections;
import org.rungtone.cli.shell.Mistyped;
import org.rungtone.cli.shell.Terminal;
import org.rungtone.internal.InputError;
import org.rungtone.report.PlotWarmUp;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.ParseResult;

/** The {@code rungtone} command: lists the subcommands and maps failures to exit codes. */
@Command(name = "rungtone",
        mixinStandardHelpOptions = true,
        versionProvider = Version.Provider.class,
        description = {"Turns sounds and waveform scripts into firmware for resistor-ladder DACs on GPIO pins, "
            + "and tells you how the result will sound on your board.", ""},
        exitCodeListHeading = "%nExit codes:%n",
        exitCodeList = {" 0:done", " 1:bad input (a file or value you can fix; one line says which)",
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
        if (drawsPlots(args)) {
            PlotWarmUp.start(); // these draw plots: load that machinery on the other core while options parse
        }
        int code;
        try {
            CommandLine cl = newCommandLine(args);
            Terminal.fitHelp(cl, System.getenv());
            code = cl.execute(args);
        } catch (OutOfMemoryError e) {
            System.err.println("rungtone: error: out of memory for this input; give Java more with"
                    + " RUNGTONE_JAVA_OPTS=-Xmx4g (or shorten the sound)");
            if (List.of(args).contains("--verbose")) {
                e.printStackTrace();
            }
            code = EXIT_INTERNAL;
        }
        System.exit(code);
    }

    /** True for a build or demo that will draw plots: not one that only asks for its help or the version. */
    static boolean drawsPlots(String[] args) {
        boolean plots = args.length > 0 && (args[0].equals("build") || args[0].equals("demo"));
        for (String a : args) {
            plots &= !(a.equals("-h") || a.equals("--help") || a.equals("-V") || a.equals("--version"));
        }
        return plots;
    }

    /**
     * The subcommands in help order, added in code so that a run of one command builds only that command's
     * model (picocli reads every option annotation of every class it is given: a tenth of a second at start),
     * and made by a switch, as a map of constructor references would load every command class at start.
     */
    private static final List<String> SUBCOMMANDS = List.of("build", "calibrate", "demo", "init", "ladder", "survey",
            "completion", "help");

    private static Object subcommand(String name) {
        return switch (name) {
            case "build" -> new BuildCommand();
            case "calibrate" -> new CalibrateCommand();
            case "demo" -> new DemoCommand();
            case "init" -> new InitCommand();
            case "ladder" -> new LadderCommand();
            case "survey" -> new SurveyCommand();
            case "completion" -> new CompletionCommand();
            default -> new CommandLine.HelpCommand();
        };
    }

    /** A configured command line with every subcommand, for tests that capture its output. */
    public static CommandLine newCommandLine() {
        return newCommandLine(new String[0]);
    }

    /**
     * A configured command line for {@code args}: when the first argument names a command that needs no
     * view of the others (not help or completion), only that command is added.
     */
    static CommandLine newCommandLine(String[] args) {
        CommandLine cl = new CommandLine(new Main());
        String first = args.length > 0 ? args[0] : "";
        boolean alone = SUBCOMMANDS.contains(first) && !first.equals("help") && !first.equals("completion");
        for (String name : SUBCOMMANDS) {
            if (!alone || name.equals(first)) {
                cl.addSubcommand(name, subcommand(name));
            }
        }
        cl.setExecutionExceptionHandler(Main::handleFailure);
        cl.setParameterExceptionHandler(Main::handleUsage);
        cl.setExitCodeExceptionMapper(t -> t instanceof CommandLine.ParameterException ? EXIT_USAGE
                : t instanceof InputError ? EXIT_INPUT : EXIT_INTERNAL);
        cl.setCaseInsensitiveEnumValuesAllowed(true);
        Converters.registerChoices(cl);
        HelpSections.install(cl);
        return cl;
    }

    private static int handleFailure(Exception e, CommandLine cl, ParseResult parsed) {
        PrintWriter err = cl.getErr();
        boolean verbose = isVerbose(parsed);
        if (e instanceof InputError) {
            // a setting's error names the option the user typed it with
            err.println("rungtone: error: " + (e instanceof org.rungtone.internal.SettingError failed
                    ? failed.render(OptionNames::of) : e.getMessage()));
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
        err.println("rungtone: error: " + (e instanceof CommandLine.UnmatchedArgumentException u
                ? Mistyped.message(u).orElse(e.getMessage()) : e.getMessage()));
        err.println("Try '" + cl.getCommandSpec().qualifiedName() + " --help' for the options.");
        err.flush();
        return EXIT_USAGE;
    }

    private static boolean isVerbose(ParseResult parsed) {
        return parsed != null && (parsed.hasMatchedOption("--verbose") || isVerbose(parsed.subcommand()));
    }
}
