package org.rungtone.calibrate;

import java.util.Locale;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Units;
import org.rungtone.ladder.LevelTable;

/**
 * Which voltage span a signal's full scale [-1, 1] maps onto when quantizing onto a real board's levels.
 * {@link #FULL} uses everything the board reaches (its lowest to its highest level), for the most signal;
 * {@link #NOMINAL} uses the ideal ladder's span, cut to what the board reaches, so that a full-scale signal
 * has the same amplitude in volts on every board (calibrated-amplitude work).
 */
public enum OutputSpan {
    /** The board's lowest to highest level. */
    FULL,
    /** The ideal ladder's span, intersected with the board's. */
    NOMINAL;

    /** The option spelling: {@code full} or {@code nominal}. */
    public String key() {
        return name().toLowerCase(Locale.ROOT);
    }

    /**
     * Parses the option spelling.
     *
     * @throws InputError when the text names no span
     */
    public static OutputSpan parse(String text) {
        for (OutputSpan s : values()) {
            if (s.key().equalsIgnoreCase(text == null ? "" : text.trim())) {
                return s;
            }
        }
        throw org.rungtone.internal.Setting.SPAN.error("must be full or nominal: %s", text);
    }

    /**
     * The low and high volts that signal −1 and +1 map onto.
     *
     * @param board the board's real levels
     * @param ideal the ideal ladder's levels
     * @throws InputError when the board's levels and the ideal span do not overlap
     */
    public double[] volts(LevelTable board, LevelTable ideal) {
        if (this == FULL) {
            return new double[] {board.minVolts(), board.maxVolts()};
        }
        double low = Math.max(ideal.minVolts(), board.minVolts());
        double high = Math.min(ideal.maxVolts(), board.maxVolts());
        if (!(high > low)) {
            throw new InputError("--span nominal: the board's levels (" + Units.format(board.minVolts(), "V")
                    + " .. " + Units.format(board.maxVolts(), "V") + ") do not overlap the ideal span ("
                    + Units.format(ideal.minVolts(), "V") + " .. " + Units.format(ideal.maxVolts(), "V")
                    + "); use --span full");
        }
        return new double[] {low, high};
    }
}
