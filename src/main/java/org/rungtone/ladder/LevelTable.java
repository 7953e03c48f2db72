package org.rungtone.ladder;

import java.util.Arrays;
import org.rungtone.internal.Checks;

/**
 * The output level in volts that a DAC produces for every code 0 .. 2^N − 1: ideal, modelled from a
 * resistor network, or measured on a board. Levels need not be uniform nor even monotonic; the quantizer
 * maps onto whatever the table holds.
 */
public final class LevelTable {
    private final int bits;
    private final double[] volts;
    private final String origin;

    private LevelTable(int bits, double[] volts, String origin) {
        this.bits = bits;
        this.volts = volts;
        this.origin = origin;
    }

    /**
     * A table from explicit levels; {@code volts.length} must be 2^bits and every level finite.
     *
     * @param origin a short description for reports ("ideal", "modelled r2r 5%", "unit board-7")
     * @throws IllegalArgumentException when the length does not match or a level is not finite
     */
    public static LevelTable of(int bits, double[] volts, String origin) {
        Checks.checkBits(bits);
        Checks.checkArgument(volts.length == 1 << bits, "a %d-bit table needs %d levels: %d", bits,
                1 << bits, volts.length);
        for (int i = 0; i < volts.length; i++) {
            Checks.checkArgument(Double.isFinite(volts[i]), "level of code %d is not finite: %s", i, volts[i]);
        }
        return new LevelTable(bits, volts.clone(), origin);
    }

    /**
     * The ideal uniform table: code k gives {@code fullScaleVolts · k / 2^N}, the transfer of an ideal
     * R-2R ladder with reference {@code fullScaleVolts} (Horowitz &amp; Hill, The Art of Electronics).
     */
    public static LevelTable ideal(int bits, double fullScaleVolts) {
        Checks.checkBits(bits);
        double[] v = new double[1 << bits];
        for (int k = 0; k < v.length; k++) {
            v[k] = fullScaleVolts * k / v.length;
        }
        return new LevelTable(bits, v, "ideal");
    }

    /** Bit depth N. */
    public int bits() {
        return bits;
    }

    /** Number of codes, 2^N. */
    public int size() {
        return volts.length;
    }

    /** Level of one code, in volts. */
    public double volts(int code) {
        return volts[code];
    }

    /** A copy of all levels, index = code. */
    public double[] levels() {
        return volts.clone();
    }

    /** Where the table came from, for reports. */
    public String origin() {
        return origin;
    }

    /** Lowest level in volts. */
    public double minVolts() {
        double m = Double.POSITIVE_INFINITY;
        for (double v : volts) {
            m = Math.min(m, v);
        }
        return m;
    }

    /** Highest level in volts. */
    public double maxVolts() {
        double m = Double.NEGATIVE_INFINITY;
        for (double v : volts) {
            m = Math.max(m, v);
        }
        return m;
    }

    /** True when the levels rise with the code at every step. */
    public boolean isMonotonic() {
        for (int i = 1; i < volts.length; i++) {
            if (volts[i] <= volts[i - 1]) {
                return false;
            }
        }
        return true;
    }

    /** The same levels with a new origin text. */
    public LevelTable withOrigin(String newOrigin) {
        return new LevelTable(bits, volts, newOrigin);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof LevelTable t && t.bits == bits && Arrays.equals(t.volts, volts);
    }

    @Override
    public int hashCode() {
        return Arrays.hashCode(volts);
    }

    @Override
    public String toString() {
        return "LevelTable[" + bits + " bits, " + origin + ", " + minVolts() + ".." + maxVolts() + " V]";
    }
}
