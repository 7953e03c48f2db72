package org.rungtone.calibrate;

import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import org.rungtone.internal.Checks;
import org.rungtone.ladder.LevelTable;

/**
 * One built board's calibration: its name, the date of the readings, the ladder it was built as, the model
 * fitted to the readings, and the output level of every code. {@code build}, {@code survey} and
 * {@code ladder} take it with {@code --unit PROFILE} and quantize onto {@link #levels()}.
 *
 * <p>Stored as TOML ({@link #toToml()}, {@link #load(Path)}): a {@code [unit]} table (board, date, bits,
 * ladder, readings, table), a {@code [model]} table (kind, parameters, residual) and a {@code [levels]} table
 * whose {@code volts} list holds all 2^N levels, code 0 first. Only {@code [unit]} and {@code [levels]} are
 * needed to use a profile; a hand-made one may leave {@code [model]} out.
 */
public final class UnitProfile {
    /** How the table was made: read at every code, or the fitted model evaluated at every code. */
    public enum TableSource {
        /** Every code was read; the table holds the readings. */
        MEASURED,
        /** The fitted model at every code. */
        FITTED;

        /** The word used in the file. */
        public String key() {
            return name().toLowerCase(Locale.ROOT);
        }
    }

    private final String board;
    private final LocalDate date;
    private final String ladder;
    private final int readings;
    private final TableSource tableSource;
    private final Optional<BoardModel> model;
    private final double residualRmsVolts;
    private final double meterStepVolts;
    private final List<Integer> outlierCodes;
    private final LevelTable levels;

    /**
     * How well a profile's model fits its readings.
     *
     * @param residualRmsVolts the chosen fit's residual, NaN if unknown
     * @param meterStepVolts the meter's resolution, 0 if unknown
     * @param outlierCodes codes whose readings the fit left out
     */
    public record Quality(double residualRmsVolts, double meterStepVolts, List<Integer> outlierCodes) {
    }

    /**
     * A profile from its parts.
     *
     * @param ladder the ladder description it was built as ("" if unknown)
     * @param fit how well the model fits the readings
     * @throws IllegalArgumentException when the board name is blank or the model's bits differ from the table's
     */
    public UnitProfile(String board, LocalDate date, String ladder, int readings, TableSource tableSource,
            Optional<BoardModel> model, Quality fit, LevelTable levels) {
        Checks.checkArgument(board != null && !board.isBlank(), "a profile needs a board name");
        Checks.checkArgument(model.map(BoardModel::bits).orElse(levels.bits()) == levels.bits(),
                "model and table differ in bits");
        this.board = board;
        this.date = Objects.requireNonNull(date, "date");
        this.ladder = ladder == null ? "" : ladder;
        this.readings = readings;
        this.tableSource = Objects.requireNonNull(tableSource, "tableSource");
        this.model = model;
        this.residualRmsVolts = fit.residualRmsVolts();
        this.meterStepVolts = fit.meterStepVolts();
        this.outlierCodes = List.copyOf(fit.outlierCodes());
        this.levels = levels.withOrigin(origin(board, date));
    }

    /** The profile of a fit. */
    public static UnitProfile of(FitReport fit, String board, LocalDate date, String ladderDescription) {
        return new UnitProfile(board, date, ladderDescription, fit.readingCount(),
                fit.tableMeasured() ? TableSource.MEASURED : TableSource.FITTED, Optional.of(fit.chosen()),
                new Quality(fit.chosenSummary().rmsVolts(), fit.resolutionVolts(), fit.outlierCodes()), fit.levels());
    }

    private static String origin(String board, LocalDate date) {
        return "unit " + board + " (" + date + ")";
    }

    /**
     * Reads a profile file.
     *
     * @throws org.rungtone.internal.InputError naming the file and line of the first problem
     */
    public static UnitProfile load(Path file) {
        return UnitProfileFile.load(file);
    }

    /**
     * Parses profile text; {@code file} names it in messages.
     *
     * @throws org.rungtone.internal.InputError naming the file and line of the first problem
     */
    public static UnitProfile parse(String text, Path file) {
        return UnitProfileFile.parse(text, file);
    }

    /** The profile as TOML text, deterministic for the same profile. */
    public String toToml() {
        return UnitProfileFile.write(this);
    }

    /** The board's name. */
    public String board() {
        return board;
    }

    /** The date of the readings. */
    public LocalDate date() {
        return date;
    }

    /** The ladder description the board was built as; empty if unknown. */
    public String ladder() {
        return ladder;
    }

    /** Number of readings the fit used (0 if unknown). */
    public int readings() {
        return readings;
    }

    /** Whether the table holds readings or the fitted model. */
    public TableSource tableSource() {
        return tableSource;
    }

    /** The fitted model, when the file has one. */
    public Optional<BoardModel> model() {
        return model;
    }

    /** Residual rms of the fit, volts; NaN if unknown. */
    public double residualRmsVolts() {
        return residualRmsVolts;
    }

    /** The meter's resolution, volts; 0 if unknown. */
    public double meterStepVolts() {
        return meterStepVolts;
    }

    /** Codes the fit left out as outliers. */
    public List<Integer> outlierCodes() {
        return outlierCodes;
    }

    /** Bit depth N. */
    public int bits() {
        return levels.bits();
    }

    /** Every code's level; its origin reads "unit BOARD (DATE)". */
    public LevelTable levels() {
        return levels;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof UnitProfile p && p.board.equals(board) && p.date.equals(date) && p.ladder.equals(ladder)
                && p.readings == readings && p.tableSource == tableSource && p.levels.equals(levels)
                && p.outlierCodes.equals(outlierCodes);
    }

    @Override
    public int hashCode() {
        return Objects.hash(board, date, levels);
    }

    @Override
    public String toString() {
        return "UnitProfile[" + board + ", " + date + ", " + bits() + " bits, " + tableSource.key() + "]";
    }
}
