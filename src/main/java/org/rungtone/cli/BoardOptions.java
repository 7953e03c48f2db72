package org.rungtone.cli;

import picocli.CommandLine.Option;

/** The name and date of a fitted board, shared by 'calibrate fit' and 'listen'. */
public final class BoardOptions {
    @Option(names = "--board", paramLabel = "NAME",
            description = "The board's name in the profile and its file name (default: the input's file name).")
    String board;

    @Option(names = "--date", paramLabel = "YYYY-MM-DD", description = "Date of the measurement (default: today).")
    String date;
}
