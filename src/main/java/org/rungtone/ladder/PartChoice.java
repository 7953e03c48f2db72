package org.rungtone.ladder;

import org.rungtone.internal.Checks;
import org.rungtone.internal.Units;

/**
 * How one resistor position is built from preferred values: a single part, or two parts in series or in
 * parallel.
 *
 * @param kind single, series or parallel
 * @param first the first (or only) part, ohms
 * @param second the second part, ohms; 0 for a single part
 */
public record PartChoice(Kind kind, double first, double second) {
    /** How the parts are joined. */
    public enum Kind {
        /** One part. */
        SINGLE,
        /** Two parts in series: first + second. */
        SERIES,
        /** Two parts in parallel: first · second / (first + second). */
        PARALLEL
    }

    /** Checks the values. */
    public PartChoice {
        Checks.checkArgument(first > 0, "part value must be positive: %s", first);
        Checks.checkArgument(kind == Kind.SINGLE ? second == 0 : second > 0, "bad second value: %s", second);
    }

    /** A single part. */
    public static PartChoice single(double ohms) {
        return new PartChoice(Kind.SINGLE, ohms, 0);
    }

    /** Two parts in series. */
    public static PartChoice series(double a, double b) {
        return new PartChoice(Kind.SERIES, Math.max(a, b), Math.min(a, b));
    }

    /** Two parts in parallel. */
    public static PartChoice parallel(double a, double b) {
        return new PartChoice(Kind.PARALLEL, Math.min(a, b), Math.max(a, b));
    }

    /** The resulting resistance, ohms. */
    public double ohms() {
        switch (kind) {
            case SERIES:
                return first + second;
            case PARALLEL:
                return first * second / (first + second);
            default:
                return first;
        }
    }

    /** Number of parts, 1 or 2. */
    public int partCount() {
        return kind == Kind.SINGLE ? 1 : 2;
    }

    /** Schematic text: "8.2k", "4.7k + 4.7k", "10k || 1M". */
    public String describe() {
        switch (kind) {
            case SERIES:
                return Units.format(first, "") + " + " + Units.format(second, "");
            case PARALLEL:
                return Units.format(first, "") + " || " + Units.format(second, "");
            default:
                return Units.format(first, "");
        }
    }
}
