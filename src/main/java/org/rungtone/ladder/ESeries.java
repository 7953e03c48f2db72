package org.rungtone.ladder;

import java.util.Arrays;
import java.util.Locale;
import org.rungtone.internal.Checks;
import org.rungtone.internal.InputError;

/**
 * Preferred-number series for resistors and capacitors, IEC 60063:2015: E6, E12, E24 (two significant
 * digits, with their historic values such as 2.7 and 4.7 that differ from the rounded geometric series), and
 * E48, E96, E192 (three significant digits, 10^(i/n) rounded, with the one standard exception 9.20 in E192,
 * from memory).
 */
public enum ESeries {
    /** 20 % series. */
    E6(new double[] {1.0, 1.5, 2.2, 3.3, 4.7, 6.8}),
    /** 10 % series. */
    E12(new double[] {1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2}),
    /** 5 % series. */
    E24(new double[] {1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1,
        5.6, 6.2, 6.8, 7.5, 8.2, 9.1}),
    /** 2 % series. */
    E48(geometric(48)),
    /** 1 % series. */
    E96(geometric(96)),
    /** 0.5 % and tighter. */
    E192(geometric(192));

    private final double[] decade;

    ESeries(double[] decade) {
        this.decade = decade;
    }

    private static double[] geometric(int n) {
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            v[i] = Math.round(100 * Math.pow(10, (double) i / n)) / 100.0;
        }
        if (n == 192) {
            // IEC 60063 lists 9.20 where rounding 10^(185/192) gives 9.19.
            v[185] = 9.20;
        }
        return v;
    }

    /** The mantissas of one decade, 1.0 up to below 10, a copy. */
    public double[] decade() {
        return decade.clone();
    }

    /** Number of values per decade. */
    public int perDecade() {
        return decade.length;
    }

    /**
     * The series value nearest to {@code value} on a logarithmic scale (the smallest ratio error).
     *
     * @throws IllegalArgumentException when the value is not finite and positive
     */
    public double nearest(double value) {
        Checks.checkArgument(Double.isFinite(value) && value > 0, "value must be positive: %s", value);
        int exp = (int) Math.floor(Math.log10(value));
        double best = Double.NaN;
        double bestErr = Double.POSITIVE_INFINITY;
        for (int e = exp - 1; e <= exp + 1; e++) {
            double scale = Math.pow(10, e);
            for (double m : decade) {
                double candidate = m * scale;
                double err = Math.abs(Math.log(candidate / value));
                if (err < bestErr) {
                    bestErr = err;
                    best = candidate;
                }
            }
        }
        return roundSignificant(best);
    }

    /** All series values in [low, high], ascending. */
    public double[] valuesBetween(double low, double high) {
        Checks.checkArgument(low > 0 && high >= low, "need 0 < low <= high: %s, %s", low, high);
        int e0 = (int) Math.floor(Math.log10(low));
        int e1 = (int) Math.floor(Math.log10(high));
        double[] out = new double[(e1 - e0 + 1) * decade.length];
        int n = 0;
        for (int e = e0; e <= e1; e++) {
            double scale = Math.pow(10, e);
            for (double m : decade) {
                double v = roundSignificant(m * scale);
                if (v >= low * (1 - 1e-12) && v <= high * (1 + 1e-12)) {
                    out[n++] = v;
                }
            }
        }
        return Arrays.copyOf(out, n);
    }

    /** True when {@code value} is a member of the series (to 1e-9 relative). */
    public boolean contains(double value) {
        return Math.abs(nearest(value) / value - 1) < 1e-9;
    }

    /**
     * Parses a series name, case-insensitively ("e24", "E96").
     *
     * @throws InputError naming the known series when the name is unknown
     */
    public static ESeries parse(String name) {
        try {
            return valueOf(name.trim().toUpperCase(Locale.ROOT));
        } catch (IllegalArgumentException e) {
            throw new InputError("unknown preferred-value series '" + name
                    + "'; use one of E6, E12, E24, E48, E96, E192");
        }
    }

    private static double roundSignificant(double v) {
        double scale = Math.pow(10, 2 - Math.floor(Math.log10(v)));
        return Math.round(v * scale) / scale;
    }
}
