package org.rungtone.cli;

import picocli.CommandLine.Option;

/** Options every command has: --quiet and --verbose. */
public final class CommonOptions {
    @Option(names = {"-q", "--quiet"}, description = "Print nothing but errors.")
    boolean quiet;

    @Option(names = {"-v", "--verbose"}, description = "Print more detail, and stack traces on errors.")
    boolean verbose;
}
