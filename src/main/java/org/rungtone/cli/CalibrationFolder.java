package org.rungtone.cli;

import java.nio.file.Path;
import picocli.CommandLine.Option;

/** The output folder the calibrate subcommands share (a plan, its readings and fit meet there), and --json. */
public final class CalibrationFolder {
    @Option(names = "--out", paramLabel = "DIR", defaultValue = "rungtone-out/calibration",
            description = "Output folder (default ${DEFAULT-VALUE}).")
    Path out;

    @Option(names = "--json", description = "Print JSON instead of text.")
    boolean json;
}
