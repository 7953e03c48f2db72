package org.rungtone.calibrate;

import java.math.BigDecimal;
import java.math.MathContext;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import org.rungtone.internal.FileNames;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;
import org.rungtone.internal.Units;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;

/**
 * The work of {@code calibrate listen}: reads a sound card's recording of the recording sweep, fits it
 * ({@link RecordingFit}) and makes the board's unit profile exactly as {@code calibrate fit} does from
 * readings ({@link BoardFit}), each code's fitted level standing for a reading weighted by its uncertainty.
 * The recording gives levels relative to code 0 and the all-ones code; code 0 takes the ladder model's level
 * and the all-ones code one meter reading of it, or else the model's level too. Writes nothing.
 */
public final class RecordingCalibration {
    /** A recorded level may stray from the ladder model's by this many times the parts' tolerance. */
    public static final double MODEL_TOLERANCES = 4;
    /** ... and always by this share of the full swing. */
    public static final double MIN_MODEL_SHARE = 0.05;

    private RecordingCalibration() {
    }

    /**
     * What to fit.
     *
     * @param recording the WAV recording
     * @param ladder the ladder the board was built as (the model's levels of code 0 and the all-ones code)
     * @param codes the plan's choice of codes, as for the sweep recorded
     * @param holdSeconds the hold per code of the sweep recorded
     * @param board the board's name, empty for the recording's file name
     * @param date the day of the recording
     * @param fullScaleVolts a meter reading of the all-ones code, when taken
     */
    public record Request(Path recording, LadderSpec ladder, CodeChoice codes, double holdSeconds,
            Optional<String> board, LocalDate date, OptionalDouble fullScaleVolts) {
        /** Checks that every part is there. */
        public Request {
            Objects.requireNonNull(recording, "recording");
            Objects.requireNonNull(ladder, "ladder");
            Objects.requireNonNull(codes, "codes");
            Objects.requireNonNull(board, "board");
            Objects.requireNonNull(date, "date");
            Objects.requireNonNull(fullScaleVolts, "fullScaleVolts");
        }
    }

    /**
     * A fitted recording.
     *
     * @param request what was fitted
     * @param recording what the recording's fit found
     * @param fit the board fit of the levels, as for readings
     * @param profile the board's unit profile
     */
    public record Result(Request request, RecordingResult recording, FitReport fit, UnitProfile profile) {
    }

    /**
     * Reads and fits the recording.
     *
     * @throws InputError for an unreadable or unusable recording (one line naming the file), a full-scale
     *     reading at or below code 0's level, levels far from the ladder model's (another sweep's codes), or
     *     levels that give no usable profile
     */
    public static Result run(Request r) {
        RecordingSweep sweep = sweep(r);
        return fit(Recording.read(r.recording()), sweep, r);
    }

    /** The sweep the request describes: the plan's codes for a recording, each held the given time. */
    public static RecordingSweep sweep(Request r) {
        return RecordingSweep.of(r.codes().recordingPlan(r.ladder().levels()), r.holdSeconds());
    }

    /**
     * Fits a recording already read.
     *
     * @throws InputError as {@link #run}
     */
    public static Result fit(Recording rec, RecordingSweep sweep, Request r) {
        LevelTable model = r.ladder().levels();
        int top = model.size() - 1;
        double low = model.volts(0);
        double high = r.fullScaleVolts().orElse(model.volts(top));
        if (!(high > low) || !Double.isFinite(high)) {
            throw Setting.FULL_SCALE_READING.error("must be a reading of the all-ones code, above code 0's %s:"
                    + " %s", Units.format(low, "V"), Units.format(high, "V"));
        }
        RecordingResult found = RecordingFit.fit(rec, sweep);
        int[] codes = sweep.planCodes();
        double[] rel = found.relativeLevels();
        checkFollowsModel(rec, codes, rel, r.ladder());
        double[] sigma = found.relativeSigmas();
        List<Reading> readings = new ArrayList<>();
        for (int i = 0; i < codes.length; i++) {
            double volts = low + rel[i] * (high - low);
            // a reading's step stands for its uncertainty: rounding to q has the variance q²/12
            double step = Math.sqrt(12) * sigma[i] * (high - low);
            readings.add(new Reading(codes[i], volts, step, 0));
        }
        Measurements m = Measurements.of(sweep.bits(), readings, List.of(), rec.source());
        FitReport fit = BoardFit.fit(m, new BoardFit.Settings(0, r.ladder().buffer().outMinVolts(),
                r.ladder().buffer().outMaxVolts(), true));
        UsableLevels.problem(fit.levels().levels()).ifPresent(p -> {
            throw new InputError(rec.source() + ": the recording gives no usable profile: " + p.detail());
        });
        String board = r.board().map(String::trim).orElseGet(() -> FileNames.stem(r.recording(), "board"));
        if (board.isEmpty()) {
            throw new InputError("--board: the name is empty");
        }
        UnitProfile profile = UnitProfile.of(fit, board, r.date(), r.ladder().describe());
        return new Result(r, found, fit, profile);
    }

    /**
     * Refuses levels that stray from the ladder model by more than {@value #MODEL_TOLERANCES} times the parts'
     * tolerance (at least {@value #MIN_MODEL_SHARE}) of the full swing. Parts within a tolerance t move a
     * level by at most about t/2 of the swing (to first order: the errors of the weights a code switches on
     * against those of the rest), so a larger move means other codes than the plan's, or another board.
     */
    private static void checkFollowsModel(Recording rec, int[] codes, double[] rel, LadderSpec ladder) {
        LevelTable model = ladder.levels();
        int top = model.size() - 1;
        double span = model.volts(top) - model.volts(0);
        double limit = Math.max(MIN_MODEL_SHARE, MODEL_TOLERANCES * ladder.tolerance());
        int worst = -1;
        double worstDeviation = limit;
        double[] expected = new double[codes.length];
        for (int i = 0; i < codes.length; i++) {
            expected[i] = (model.volts(codes[i]) - model.volts(0)) / span;
            if (Math.abs(rel[i] - expected[i]) > worstDeviation) {
                worstDeviation = Math.abs(rel[i] - expected[i]);
                worst = i;
            }
        }
        if (worst >= 0) {
            throw new InputError(String.format(Locale.ROOT, "%s: the recording does not follow the ladder: code %d"
                    + " sits at %.3f of the full swing, the model at %.3f (parts of %s keep it within %.3f); is"
                    + " it of another sweep (give the plan's options: ladder, codes, --hold) or is the board"
                    + " not built as described?", rec.source(), codes[worst], rel[worst], expected[worst],
                    percent(ladder.tolerance()), limit));
        }
    }

    private static String percent(double fraction) {
        return new BigDecimal(100 * fraction).round(new MathContext(3)).stripTrailingZeros().toPlainString() + " %";
    }
}
