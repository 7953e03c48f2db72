package org.rungtone.cli;

import java.util.concurrent.Callable;
import org.rungtone.calibrate.BoardSimulation;
import org.rungtone.calibrate.SimulatedBoard.Meter;
import org.rungtone.cli.shell.Heading;
import org.rungtone.cli.shell.Section;
import org.rungtone.project.CalibrationRuns;
import org.rungtone.report.CalibrationReport;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/** {@code rungtone calibrate}: measure a built board and fit a unit profile of it. */
@Command(name = "calibrate", mixinStandardHelpOptions = true,
        description = {"Measure a built ladder and fit a profile of it.",
            "'plan' says what to measure and writes a sweep program; 'fit' turns the readings into a unit"
                + " profile that 'build --unit' quantizes onto; 'listen' does so from a sound card's recording of"
                + " the sweep of 'plan --recording'; 'simulate' makes readings of a drawn board to try it out."},
        subcommands = {CalibratePlanCommand.class, CalibrateFitCommand.class, CalibrateListenCommand.class,
            CalibrateCommand.Simulate.class},
        footerHeading = "%nExample, the whole loop:%n",
        footer = {"  rungtone calibrate plan --ladder board.toml --target avr --pins PD2-PD7 \\",
            "      --cpu-clock 16MHz --button PB0",
            "  (measure; fill in rungtone-out/calibration/plan.csv)",
            "  rungtone calibrate fit rungtone-out/calibration/plan.csv \\",
            "      --ladder board.toml --board unit-1",
            "  rungtone build chime.wav \\",
            "      --unit rungtone-out/calibration/unit-1.unit.toml"})
public final class CalibrateCommand implements Runnable {
    @Spec
    CommandSpec spec;

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    /** {@code rungtone calibrate simulate}: readings of a board drawn from the ladder's tolerance. */
    @Command(name = "simulate", mixinStandardHelpOptions = true, sortOptions = false,
            description = {"Make readings of a board drawn from the ladder's tolerance.",
                "Draws one board from the ladder description (resistors uniform within the tolerance), reads it"
                    + " at the plan's codes with a meter's noise and step, and writes the filled-in plan"
                    + " (readings.csv) and the board's true levels (true-levels.csv)."},
            footerHeading = "%nExample:%n",
            footer = {"  rungtone calibrate simulate --topology r2r --bits 6 --tolerance 5%% \\",
                "      --seed 7",
                "  rungtone calibrate fit rungtone-out/calibration/readings.csv \\",
                "      --topology r2r --bits 6 --tolerance 5%% --board simulated-7"})
    static final class Simulate implements Callable<Integer> {
        @Spec
        CommandSpec spec;

        @Mixin
        CommonOptions common;

        @Mixin
        PlanOptions codes;

        @Section(Heading.MEASURING)
    @Option(names = "--seed", paramLabel = "N", defaultValue = "1",
                description = "Seed of the board and the meter noise (default ${DEFAULT-VALUE}).")
        long seed;

        @Section(Heading.MEASURING)
    @Option(names = "--noise", paramLabel = "<volts>", converter = Converters.Volts.class,
                defaultValue = "0.2mV", description = "The meter's rms noise (default ${DEFAULT-VALUE}).")
        double noise;

        @Section(Heading.MEASURING)
    @Option(names = "--resolution", paramLabel = "<volts>", converter = Converters.Volts.class,
                defaultValue = "1mV", description = "The meter's step (default ${DEFAULT-VALUE}).")
        double resolution;

        @Section(Heading.MEASURING)
    @Option(names = "--repeat", paramLabel = "R", defaultValue = "1",
                description = "Readings per code (default ${DEFAULT-VALUE}).")
        int repeat;

        @Mixin
        CalibrationFolder output;

        @Override
        public Integer call() {
            CalibrationRuns.Written<BoardSimulation.Result> w = CalibrationRuns.simulate(new BoardSimulation.Request(
                    codes.spec(), codes.choice(), new Meter(noise, resolution, repeat), seed), output.out);
            common.print(spec, output.json, () -> CalibrationReport.simulationJson(w.result(), w.files(), output.out,
                    Version.get()), () -> CalibrationReport.simulationText(w.result(), w.files()));
            return 0;
        }
    }
}
