package org.rungtone.calibrate;

import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import org.rungtone.internal.FileNames;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;
import org.rungtone.internal.Units;
import org.rungtone.ladder.LadderSpec;

/**
 * The work of {@code calibrate fit}: reads a board's measurements, fits them ({@link BoardFit}) and makes the
 * board's unit profile. Writes nothing; the report writes the profile and the residuals.
 */
public final class UnitFit {
    private UnitFit() {
    }

    /**
     * What to fit.
     *
     * @param measurements the readings file: a filled-in plan, or rows of code, volts
     * @param bits bit depth, 0 for the ladder's, else the width of the file's binary column
     * @param ladder the ladder the board was built as, when described
     * @param board the board's name, empty for the readings' file name
     * @param date the day of the readings
     * @param resolutionVolts the meter's step, empty to take it from the readings' last digits
     */
    public record Request(Path measurements, int bits, Optional<LadderSpec> ladder, Optional<String> board,
            LocalDate date, OptionalDouble resolutionVolts) {
        /** Checks that every part is there. */
        public Request {
            Objects.requireNonNull(measurements, "measurements");
            Objects.requireNonNull(ladder, "ladder");
            Objects.requireNonNull(board, "board");
            Objects.requireNonNull(date, "date");
            Objects.requireNonNull(resolutionVolts, "resolutionVolts");
        }
    }

    /**
     * A fitted board.
     *
     * @param request what was fitted
     * @param fit the models, residuals and chosen model
     * @param profile the board's unit profile
     */
    public record Result(Request request, FitReport fit, UnitProfile profile) {
    }

    /**
     * Reads, fits and makes the profile.
     *
     * @throws InputError when the resolution is not a positive voltage below 10 V, the readings cannot be read
     *     or fitted, a reading shows finer digits than the resolution, their profile would be flat or falling
     *     ({@link UsableLevels}), or the board name is empty
     */
    public static Result run(Request r) {
        r.resolutionVolts().ifPresent(q -> Setting.RESOLUTION.check(q > 0 && q < 10, "must be a positive voltage"
                + " below 10 V, e.g. 1mV: %s", q));
        Optional<LadderSpec> ladder = r.ladder();
        int bitsOrZero = r.bits() != 0 ? r.bits() : ladder.map(LadderSpec::bits).orElse(0);
        Measurements m = MeasurementCsv.read(r.measurements(), bitsOrZero);
        r.resolutionVolts().ifPresent(q -> checkDigits(m, q));
        BoardFit.Settings settings = new BoardFit.Settings(r.resolutionVolts().orElse(0),
                ladder.map(s -> s.buffer().outMinVolts()).orElse(Double.NaN),
                ladder.map(s -> s.buffer().outMaxVolts()).orElse(Double.NaN));
        FitReport fit = BoardFit.fit(m, settings);
        UsableLevels.problem(fit.levels().levels()).ifPresent(p -> {
            throw new InputError(m.source() + ": the readings give no usable profile: " + p.detail());
        });
        String board = r.board().map(String::trim).orElseGet(() -> FileNames.stem(r.measurements(), "board"));
        if (board.isEmpty()) {
            throw new InputError("--board: the name is empty");
        }
        UnitProfile profile = UnitProfile.of(fit, board, r.date(), ladder.map(LadderSpec::describe).orElse(""));
        return new Result(r, fit, profile);
    }

    /**
     * Refuses a reading written with finer digits than the resolution given for the whole file: a meter shows
     * no digit below its step, so one of the two is wrong. Coarser digits are fine (a trailing zero left off).
     */
    private static void checkDigits(Measurements m, double resolutionVolts) {
        for (Reading x : m.readings()) {
            if (x.stepVolts() > 0 && x.stepVolts() < 0.99 * resolutionVolts) {
                int decimals = Math.max(0, (int) Math.round(-Math.log10(x.stepVolts())));
                throw Setting.RESOLUTION.problem("%s:%d: the reading %s V shows %s digits, finer than %s %s; leave"
                        + " %s out to weight each reading by its own digits, or correct it", m.source(), x.line(),
                        String.format(Locale.ROOT, "%." + decimals + "f", x.volts()), Units.format(x.stepVolts(),
                                "V"), Setting.RESOLUTION.ref(), Units.format(resolutionVolts, "V"),
                        Setting.RESOLUTION.ref());
            }
        }
    }
}
