package org.rungtone.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.rungtone.cli.shell.Choices;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.project.StarterProject;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code rungtone init}: writes a commented starter project file. */
@Command(name = "init",
        header = "Write a commented starter project file.", mixinStandardHelpOptions = true,
        description = {"Write a commented starter project file for a target family and ladder. It asks nothing:"
            + " every choice is an option, and the file explains each key so you can edit it."},
        footerHeading = "%nExample:%n",
        footer = {"  rungtone init doorbell.toml --target avr --topology r2r --bits 6 \\",
            "      --name doorbell",
            "  rungtone build doorbell.toml"})
public final class InitCommand implements Callable<Integer> {
    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Parameters(index = "0", paramLabel = "FILE", defaultValue = "rungtone.toml",
            description = "The project file to write (default ${DEFAULT-VALUE}).")
    Path file;

    @Option(names = "--target", paramLabel = "generic|avr|cortexm|rp2040", defaultValue = "generic",
            completionCandidates = Choices.Targets.class, description = "Target family (default ${DEFAULT-VALUE}).")
    String target;

    @Option(names = "--topology", paramLabel = "weighted|r2r", defaultValue = "r2r",
            completionCandidates = Choices.StarterTopologies.class,
            description = "Ladder topology (default ${DEFAULT-VALUE}).")
    String topology;

    @Option(names = "--bits", paramLabel = "<n>", defaultValue = "6",
            description = "Ladder bits (default ${DEFAULT-VALUE}).")
    int bits;

    @Option(names = "--name", paramLabel = "<name>", description = "Project name (default: from the file name).")
    String name;

    @Option(names = "--source", paramLabel = "<file>", defaultValue = "sound.wav",
            description = "The first sound's source, relative to the project file (default ${DEFAULT-VALUE}).")
    String source;

    @Option(names = "--force", description = "Overwrite an existing file.")
    boolean force;

    @Override
    public Integer call() {
        String text = StarterProject.text(new StarterProject.Request(file, target, topology, bits,
                Optional.ofNullable(name), source, force));
        AtomicFiles.writeString(file, text);
        PrintWriter w = spec.commandLine().getOut();
        if (!common.quiet) {
            w.println("Wrote " + file + ". Put your sound next to it as " + source + ", check the pins and the"
                    + " ladder, then run:");
            w.println("  rungtone build " + file);
        }
        w.flush();
        return 0;
    }
}
