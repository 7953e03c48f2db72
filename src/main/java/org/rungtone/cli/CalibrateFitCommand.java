package org.rungtone.cli;

import java.nio.file.Path;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;
import org.rungtone.calibrate.UnitFit;
import org.rungtone.cli.shell.Heading;
import org.rungtone.cli.shell.Section;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.project.CalibrationRuns;
import org.rungtone.report.Json;
import org.rungtone.report.UnitFitReport;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code rungtone calibrate fit}: readings of a built board to a unit profile. */
@Command(name = "fit", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Fit a board's readings and write its unit profile.",
            "Reads the filled-in plan (or any CSV of code, volts), fits the board by least squares (an offset"
                + " plus a step per bit; a switched-load model when the pins' high and low resistances differ"
                + " enough to show), leaves out readings that do not fit and names them, and writes a unit"
                + " profile with every code's level for 'build --unit'."},
        footerHeading = "%nExample:%n",
        footer = {"  rungtone calibrate fit greenhouse-cal/plan.csv --board greenhouse-1 \\",
            "      --ladder examples/calibration/greenhouse-r2r.toml \\",
            "      --date 2026-05-01 --out greenhouse-cal",
            "  (writes greenhouse-cal/greenhouse-1.unit.toml and fit-residuals.csv)"})
public final class CalibrateFitCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Parameters(index = "0", paramLabel = "MEASUREMENTS.csv", description = "The readings: the plan's CSV with"
            + " its measured column filled in, or rows of code, volts.")
    Path measurements;

    @Section(Heading.LADDER)
    @Option(names = "--bits", paramLabel = "N", description = "Bit depth (default: the ladder's, else the width of"
            + " the file's binary column).")
    Integer bits;

    @Mixin
    LadderOptions ladder;

    @Mixin
    BoardOptions board;

    @Section(Heading.MEASURING)
    @Option(names = "--resolution", paramLabel = "<volts>", converter = Converters.Volts.class,
            description = "The meter's step for every reading, e.g. 1mV (default: each reading's own last digit).")
    Double resolution;

    @Mixin
    CalibrationFolder output;

    @Override
    public Integer call() {
        int bitsOrZero = LadderOptions.bitsOrZero(bits);
        Optional<LadderSpec> ladderSpec = ladder.given() ? Optional.of(ladder.spec(bitsOrZero)) : Optional.empty();
        CalibrationRuns.Written<UnitFit.Result> w = CalibrationRuns.fit(new UnitFit.Request(measurements, bitsOrZero,
                ladderSpec, Optional.ofNullable(board.board), CalibrationRuns.day(Optional.ofNullable(board.date)),
                resolution == null ? OptionalDouble.empty() : OptionalDouble.of(resolution)), output.out);
        common.print(spec, output.json, () -> Json.toJson(UnitFitReport.json(w.result(), w.files(), output.out,
                Version.get())), () -> UnitFitReport.text(w.result(), w.files()));
        return 0;
    }
}
