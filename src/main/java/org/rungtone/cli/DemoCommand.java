package org.rungtone.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import org.rungtone.calibrate.OutputSpan;
import org.rungtone.cli.shell.ProgressMeter;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.OutputFolder;
import org.rungtone.project.BuildProgress;
import org.rungtone.project.DemoScenario;
import org.rungtone.project.Project;
import org.rungtone.project.ProjectBuild;
import org.rungtone.project.ProjectFile;
import org.rungtone.report.ProjectReport;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code rungtone demo}: builds the bundled greenhouse scenario end to end. */
@Command(name = "demo",
        header = "Build the bundled greenhouse example end to end.", mixinStandardHelpOptions = true,
        description = {"Build the bundled example: a greenhouse controller (8-bit AVR) that plays a door chime"
            + " and a looping frost alarm through a 6-bit R-2R ladder of 5 %% resistors on pins PD2-PD7,"
            + " compensated with the board's measured levels (a simulated calibration).",
            "The scenario's files are copied next to the outputs so you can change and rebuild them."},
        footerHeading = "%nExample:%n",
        footer = {"  rungtone demo --out /tmp/demo",
            "  rungtone build /tmp/demo/scenario/greenhouse.toml   (after editing the copy)"})
public final class DemoCommand implements Callable<Integer> {
    @Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Option(names = "--out", paramLabel = "<dir>", defaultValue = "rungtone-out/demo",
            description = "Output folder (default ${DEFAULT-VALUE}).")
    Path out;

    @Override
    public Integer call() {
        Path scenario = out.resolve("scenario");
        ProjectBuild.Result r;
        try (OutputFolder folder = OutputFolder.open(out, "demo");
                ProgressMeter meter = ProgressMeter.onStandardError(spec.commandLine().getErr(), common.quiet)) {
            r = run(scenario, (step, done) -> meter.show("demo", step, done));
            folder.commit();
        }
        PrintWriter w = spec.commandLine().getOut();
        if (!common.quiet) {
            w.print(ProjectReport.text(r.report()));
            w.println();
            w.println("Demo done. Outputs are in " + r.outDir());
            w.println("Open report.html there, listen to the preview.wav files (start with the volume low),\nand look"
                    + " at greenhouse.h for the player's API. The scenario is in " + scenario.toAbsolutePath());
        }
        w.flush();
        return 0;
    }

    /** Writes the scenario into the (staged) demo folder and builds it there. */
    private static ProjectBuild.Result run(Path scenario, BuildProgress progress) {
        DemoScenario.files().forEach((name, bytes) -> AtomicFiles.writeBytes(scenario.resolve(name), bytes));
        Project project = ProjectFile.load(scenario.resolve(DemoScenario.PROJECT_FILE));
        return new ProjectBuild(Version.get(), OutputSpan.FULL, progress).run(project, ProjectBuild.Overrides.none());
    }
}
