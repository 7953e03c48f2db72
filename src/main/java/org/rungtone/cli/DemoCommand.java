package org.rungtone.cli;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.InputError;
import org.rungtone.project.Build;
import org.rungtone.project.BuildPlan;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;
import org.rungtone.report.BuildReport;
import org.rungtone.report.BuildSummary;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code rungtone demo}: builds the bundled greenhouse scenario end to end. */
@Command(name = "demo", mixinStandardHelpOptions = true,
        description = {"Build the bundled example: the door chime of a greenhouse controller, played by a 6-bit",
            "ladder at 16 kHz. Copies the scenario's sources next to the outputs so you can rerun it by hand."},
        footerHeading = "%nExample:%n",
        footer = {"  rungtone demo --out /tmp/demo"})
public final class DemoCommand implements Callable<Integer> {
    static final String SCENARIO = "greenhouse";
    static final String[] FILES = {"door-chime.wav"};

    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Option(names = "--out", paramLabel = "<dir>", defaultValue = "rungtone-out/demo",
            description = "Output folder (default ${DEFAULT-VALUE}).")
    Path out;

    @Override
    public Integer call() throws IOException {
        Path scenario = out.resolve("scenario");
        AtomicFiles.checkFolderUsable(out);
        for (String f : FILES) {
            AtomicFiles.writeBytes(scenario.resolve(f), resource("examples/" + SCENARIO + "/" + f));
        }
        BuildPlan plan = new BuildPlan(scenario.resolve("door-chime.wav"), 0, "door_chime", out.resolve("door_chime"),
                6, OptionalDouble.of(16_000), Dither.TPDF, ErrorFilter.NONE, 1, true, OptionalDouble.of(-60),
                OptionalDouble.empty(), OptionalDouble.of(-1), 0.002, 0.02, "kaiser", 5.0, "");
        BuildSummary s = new Build(Version.get()).run(plan);
        PrintWriter w = spec.commandLine().getOut();
        if (!common.quiet) {
            w.print(BuildReport.text(s));
            w.println();
            w.println("Demo done. Outputs are in " + out.resolve("door_chime").toAbsolutePath());
            w.println("The scenario's sources were copied to " + scenario.toAbsolutePath());
        }
        w.flush();
        return 0;
    }

    static byte[] resource(String name) throws IOException {
        try (InputStream in = DemoCommand.class.getClassLoader().getResourceAsStream(name)) {
            if (in == null) {
                throw new InputError("the demo scenario file " + name + " is missing from this build of Rungtone");
            }
            return in.readAllBytes();
        }
    }
}
