package org.rungtone.cli;

import java.util.Optional;
import java.util.concurrent.Callable;
import org.rungtone.cli.shell.Heading;
import org.rungtone.cli.shell.Section;
import org.rungtone.project.CalibrationPlan;
import org.rungtone.project.CalibrationRuns;
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
    @Option(names = "--hold", paramLabel = "<time>", converter = Converters.Seconds.class,
            description = "How long the sweep holds each code (default 2s; 40ms with --recording).")
    Double holdSeconds;

    @Section(Heading.FIRMWARE)
    @Option(names = "--recording", description = "Make the sweep for a sound card's recording (see 'calibrate"
            + " listen'): every code up to 10 bits, held briefly, between two patterns the fit finds.")
    boolean recording;

    @Section(Heading.FIRMWARE)
    @Option(names = "--button", paramLabel = "PIN", description = "Step to the next code on each press of a button"
            + " on this pin (to ground) instead, e.g. PB0.")
    String button;

    @Mixin
    FirmwareOptions firmware;

    @Section(Heading.FIRMWARE)
    @Option(names = "--name", paramLabel = "<symbol>", defaultValue = "sweep", description = "C symbol prefix of"
            + " the sweep program (default ${DEFAULT-VALUE}).")
    String name;

    @Mixin
    CalibrationFolder output;

    @Override
    public Integer call() {
        CalibrationPlan.checkSweepOptions(Optional.ofNullable(firmware.engine), firmware.loop != null
                || firmware.ddsFrequencyHz != null);
        double hold = holdSeconds != null ? holdSeconds : CalibrationPlan.defaultHoldSeconds(recording);
        CalibrationRuns.Written<CalibrationReport.Plan> w = CalibrationRuns.plan(new CalibrationPlan.Request(
                codes.spec(), codes.choice(), firmware.request(), name, Version.get(), hold,
                Optional.ofNullable(button), output.out, recording));
        common.print(spec, output.json, () -> Json.toJson(CalibrationReport.planJson(w.result(), w.files(), output.out,
                Version.get())), () -> CalibrationReport.planText(w.result(), w.files()));
        return 0;
    }
}
