package org.rungtone.cli;

import java.nio.file.Path;
import java.time.LocalDate;
import java.time.format.DateTimeParseException;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;
import org.rungtone.calibrate.UnitFit;
import org.rungtone.cli.shell.Heading;
import org.rungtone.cli.shell.Section;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.InputError;
import org.rungtone.internal.OutputFolder;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.report.CalibrationFiles;
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
    @Option(names = "--bits", paramLabel = "N",
            description = "Bit depth (default: the ladder's, else the width of the file's binary column).")
    Integer bits;

    @Mixin
    LadderOptions ladder;

    @Option(names = "--board", paramLabel = "NAME",
            description = "The board's name in the profile and its file name (default: the readings' file name).")
    String board;

    @Section(Heading.MEASURING)
    @Option(names = "--date", paramLabel = "YYYY-MM-DD",
            description = "Date of the readings (default: today).")
    String date;

    @Section(Heading.MEASURING)
    @Option(names = "--resolution", paramLabel = "<volts>", converter = Converters.Volts.class,
            description = "The meter's step, e.g. 1mV (default: from the readings' last digits).")
    Double resolution;

    @Mixin
    CalibrationFolder output;

    @Option(names = "--json", description = "Print JSON instead of text.")
    boolean json;

    @Override
    public Integer call() {
        LocalDate day = day();
        if (resolution != null && !(resolution > 0 && resolution < 10)) {
            throw new InputError("--resolution must be a positive voltage below 10 V, e.g. 1mV: " + resolution);
        }
        int bitsOrZero = LadderOptions.bitsOrZero(bits);
        AtomicFiles.checkFolderUsable(output.out);
        Optional<LadderSpec> ladderSpec = ladder.given() ? Optional.of(ladder.spec(bitsOrZero)) : Optional.empty();
        UnitFit.Result r = UnitFit.run(new UnitFit.Request(measurements, bitsOrZero, ladderSpec,
                Optional.ofNullable(board),
                day, resolution == null ? OptionalDouble.empty() : OptionalDouble.of(resolution)));
        List<Path> files;
        try (OutputFolder folder = OutputFolder.open(output.out, "fit")) {
            files = CalibrationFiles.writeProfile(r, output.out);
            folder.commit();
        }
        common.print(spec, json, () -> Json.toJson(UnitFitReport.json(r, files, output.out, Version.get())),
                () -> UnitFitReport.text(r, files));
        return 0;
    }

    private LocalDate day() {
        if (date == null) {
            return LocalDate.now();
        }
        try {
            return LocalDate.parse(date.trim());
        } catch (DateTimeParseException e) {
            throw new InputError("--date must look like 2026-05-01: " + date, e);
        }
    }
}
