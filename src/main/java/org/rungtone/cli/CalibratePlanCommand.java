package org.rungtone.cli;

import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.rungtone.calibrate.CodeChoice;
import org.rungtone.cli.shell.Heading;
import org.rungtone.cli.shell.Section;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.firmware.PlaybackEngine;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.InputError;
import org.rungtone.internal.OutputFolder;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.project.CalibrationPlan;
import org.rungtone.report.CalibrationFiles;
import org.rungtone.report.CalibrationReport;
import org.rungtone.report.Json;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code rungtone calibrate plan}: what to measure on a built board, as a checklist, a CSV and a sweep program. */
@Command(name = "plan", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Say what to measure on a built board; write plan.csv and a sweep program.",
            "Chooses the codes to measure (every code up to 6 bits; else all bits low, all high, each bit alone"
                + " and check codes spread over the range), prints a checklist with the level the model expects"
                + " for each and how to measure it, writes plan.csv to fill in, and with --pins a sweep program"
                + " that puts each code on the pins in turn."},
        footerHeading = "%nExample:%n",
        footer = {"  rungtone calibrate plan \\",
            "      --ladder examples/calibration/greenhouse-r2r.toml \\",
            "      --target avr --pins PD2-PD7 --cpu-clock 16MHz --button PB0 \\",
            "      --out greenhouse-cal",
            "  (writes plan.csv, sweep.h, sweep.c and sweep_data.c into greenhouse-cal/)"})
public final class CalibratePlanCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Mixin
    PlanOptions codes;

    @Section(Heading.FIRMWARE)
    @Option(names = "--hold", paramLabel = "<time>", converter = Converters.Seconds.class, defaultValue = "2s",
            description = "How long the sweep holds each code (default ${DEFAULT-VALUE}).")
    double holdSeconds;

    @Section(Heading.FIRMWARE)
    @Option(names = "--button", paramLabel = "PIN",
            description = "Step to the next code on each press of a button on this pin (to ground) instead,"
                    + " e.g. PB0.")
    String button;

    @Mixin
    FirmwareOptions firmware;

    @Section(Heading.FIRMWARE)
    @Option(names = "--name", paramLabel = "<symbol>", defaultValue = "sweep",
            description = "C symbol prefix of the sweep program (default ${DEFAULT-VALUE}).")
    String name;

    @Mixin
    CalibrationFolder output;

    @Option(names = "--json", description = "Print JSON instead of text.")
    boolean json;

    @Override
    public Integer call() {
        codes.check();
        if (firmware.engine != null && firmware.engine != PlaybackEngine.SWEEP) {
            throw new InputError("--engine " + firmware.engine.name().toLowerCase(java.util.Locale.ROOT)
                    + ": a measurement plan always emits the sweep"
                    + " program; leave --engine out");
        }
        if (firmware.loop != null || firmware.ddsFrequencyHz != null) {
            throw new InputError("--loop and --dds-frequency do not apply to the sweep program; leave them out");
        }
        AtomicFiles.checkFolderUsable(output.out);
        LadderSpec ladderSpec = codes.spec();
        CodeChoice choice = codes.choice();
        CalibrationReport.Plan plan;
        List<Path> files;
        try (OutputFolder folder = OutputFolder.open(output.out, "plan")) {
            plan = CalibrationPlan.run(new CalibrationPlan.Request(ladderSpec, choice, sweepTarget(), name,
                    Version.get(), holdSeconds, Optional.ofNullable(button), output.out));
            files = CalibrationFiles.writePlan(plan, output.out);
            folder.commit();
        }
        common.print(spec, json, () -> Json.toJson(CalibrationReport.planJson(plan, files, output.out, Version.get())),
                () -> CalibrationReport.planText(plan, files));
        return 0;
    }

    /** The sweep program's target settings; a button alone asks for the generic program. */
    private Optional<FirmwareRequest> sweepTarget() {
        Optional<FirmwareRequest> given = firmware.request();
        return given.isEmpty() && button != null ? Optional.of(FirmwareRequest.builder().build()) : given;
    }
}
