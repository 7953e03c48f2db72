package org.rungtone.calibrate;

import java.util.Locale;
import java.util.Optional;
import org.rungtone.internal.Units;

/**
 * The rules a board's table of levels must meet to serve as a unit profile, with their messages in one place:
 * both a fit of readings and a profile file are held to them. Every level is a plausible voltage (finite,
 * within {@link MeasurementCsv#MAX_VOLTS}, as a reading must be), and the levels rise from code 0 to the
 * all-ones code, by at least {@link #MIN_SPAN_VOLTS} and over at least half of their range. Compensation copes with
 * a board that is not monotonic in between;
 * a flat table has nothing to quantize onto, and a falling one (meter leads swapped, pins listed top bit
 * first) would turn every sound upside down and make every linearity figure meaningless.
 */
final class UsableLevels {
    /**
     * The least rise from code 0 to the all-ones code, volts: one step of a handheld meter's usual range; a
     * smaller rise is the meter's noise, not a ladder's output.
     */
    static final double MIN_SPAN_VOLTS = 1e-3;

    private UsableLevels() {
    }

    /**
     * What is wrong with a table, and the code it is best shown at.
     *
     * @param code the code whose level is at fault
     * @param detail what is wrong and what to check, one line, without a file or key
     */
    record Problem(int code, String detail) {
    }

    /** The first rule {@code volts} (code 0 first) breaks, if any. */
    static Optional<Problem> problem(double[] volts) {
        int last = volts.length - 1;
        int low = 0;
        int high = 0;
        for (int k = 0; k < volts.length; k++) {
            double v = volts[k];
            if (!Double.isFinite(v) || Math.abs(v) > MeasurementCsv.MAX_VOLTS) {
                return Optional.of(new Problem(k, String.format(Locale.ROOT, "the level of code %d, %s, is not a"
                        + " plausible board level (a finite voltage within %d V)", k, shown(v),
                        (int) MeasurementCsv.MAX_VOLTS)));
            }
            low = v < volts[low] ? k : low;
            high = v > volts[high] ? k : high;
        }
        double first = volts[0];
        double top = volts[last];
        if (volts[high] - volts[low] < MIN_SPAN_VOLTS) {
            String same = volts[low] == volts[high] ? "every code has the same level, " + v(first)
                    : "every code's level lies within 1mV of " + v(first);
            return Optional.of(new Problem(last, same + ", so there is nothing to quantize onto; check that the"
                    + " readings were taken at the ladder's output"));
        }
        if (top <= first) {
            String where = top == first ? "level with" : difference(first - top) + " below";
            return Optional.of(new Problem(last, String.format(Locale.ROOT, "code %d is %s code 0 (%s), but the"
                    + " levels must rise from code 0 to code %d; were the meter's leads swapped, or the pins listed"
                    + " with the top bit first?", last, where, v(first), last)));
        }
        if (top - first < MIN_SPAN_VOLTS) {
            return Optional.of(new Problem(last, String.format(Locale.ROOT, "code %d is only %s above code 0 (%s);"
                    + " a ladder's levels rise by 1mV or more from code 0 to code %d: check that the readings were"
                    + " taken at the ladder's output", last, difference(top - first), v(first), last)));
        }
        if (top - first < 0.5 * (volts[high] - volts[low])) {
            return Optional.of(new Problem(last, String.format(Locale.ROOT, "code 0 (%s) and code %d (%s) span"
                    + " less than half of the levels' range (%s at code %d to %s at code %d); code 0 and code %d"
                    + " must give about the lowest and the highest level: check the pin order and the readings",
                    v(first), last, v(top), v(volts[low]), low, v(volts[high]), high, last)));
        }
        return Optional.empty();
    }

    /** A positive difference of levels; below the profile file's resolution of 1 nV, as "less than 1nV". */
    private static String difference(double volts) {
        return volts < 1e-9 ? "less than 1nV" : v(volts);
    }

    private static String v(double volts) {
        return Units.format(volts, "V");
    }

    /** A level as read, in plain notation when it is far beyond any prefix. */
    private static String shown(double volts) {
        return Double.isFinite(volts) && Math.abs(volts) >= 1e12 ? String.format(Locale.ROOT, "%.3g V", volts)
                : v(volts);
    }
}
