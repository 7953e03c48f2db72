package org.rungtone.cli;

import java.nio.file.Path;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;
import org.rungtone.calibrate.RecordingCalibration;
import org.rungtone.project.CalibrationRuns;
import org.rungtone.report.Json;
import org.rungtone.report.RecordingReport;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code rungtone calibrate listen}: a sound card's recording of the sweep to a unit profile. */
@Command(name = "listen", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Fit a board from a sound card's recording of its sweep and write its unit profile.",
            "Reads the WAV recording (line input, 16 bits or more) of the sweep of 'calibrate plan --recording',"
                + " finds its patterns and steps, fits the input's corner, gain, polarity, offset, hum and the"
                + " clocks' mismatch with every step's level, and writes a unit profile as 'calibrate fit' does,"
                + " the steps and a plot of the recording with the fit."},
        footerHeading = "%nExample:%n",
        footer = {"  rungtone calibrate listen sweep.wav --ladder board.toml --board unit-1 \\",
            "      --full-scale-reading 4.93V"})
public final class CalibrateListenCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Mixin
    CommonOptions common;

    @Parameters(index = "0", paramLabel = "RECORDING.wav", description = "The recording of the sweep.")
    Path recording;

    @Mixin
    PlanOptions codes;

    @Option(names = "--hold", paramLabel = "<time>", converter = Converters.Seconds.class, defaultValue = "40ms",
            description = "The hold per code given to 'calibrate plan --recording' (default ${DEFAULT-VALUE}).")
    double holdSeconds;

    @Option(names = "--full-scale-reading", paramLabel = "<volts>", converter = Converters.Volts.class, description
            = "A meter reading of the all-ones code, to scale the levels to volts (default: the model's level).")
    Double fullScale;

    @Mixin
    BoardOptions board;

    @Mixin
    CalibrationFolder output;

    @Override
    public Integer call() {
        OptionalDouble full = fullScale == null ? OptionalDouble.empty() : OptionalDouble.of(fullScale);
        CalibrationRuns.Written<RecordingCalibration.Result> w = CalibrationRuns.listen(new RecordingCalibration
                .Request(recording, codes.spec(), codes.choice(), holdSeconds, Optional.ofNullable(board.board),
                CalibrationRuns.day(Optional.ofNullable(board.date)), full), output.out);
        common.print(spec, output.json, () -> Json.toJson(RecordingReport.json(w.result(), w.files(), output.out,
                Version.get())), () -> RecordingReport.text(w.result(), w.files()));
        return 0;
    }
}
