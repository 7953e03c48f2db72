package org.rungtone.cli;

import java.nio.file.Path;
import picocli.CommandLine.Option;

/** The output folder every calibrate subcommand shares, so that a plan, its readings and its fit meet there. */
public final class CalibrationFolder {
    @Option(names = "--out", paramLabel = "DIR", defaultValue = "rungtone-out/calibration",
            description = "Output folder (default ${DEFAULT-VALUE}).")
    Path out;
}
