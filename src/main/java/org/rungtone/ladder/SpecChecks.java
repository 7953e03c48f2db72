package org.rungtone.ladder;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.rungtone.internal.Units;

/** The validation rules and warnings of a {@link LadderSpec}, with their messages in one place. */
final class SpecChecks {
    /**
     * The smallest resistance a ladder may hold, ohms. Far below any pin's own output resistance (tens of
     * ohms), so a smaller part could not set a level anyway.
     */
    static final double MIN_OHMS = 0.1;
    /**
     * The largest resistance a ladder (and its load) may hold, ohms: about the leakage across a clean board's
     * surface, so a larger part is no longer what sets the current. Between the two limits the conductances
     * of the nodal matrix span at most 13 decades (10 S to 1 pS), well inside the 16 digits of a double, so
     * the solve keeps several significant digits in the worst mix of values; far outside them a part's
     * conductance vanishes against the others' and the matrix is numerically singular.
     */
    static final double MAX_OHMS = 1e12;
    private static final String RANGE = "0.1 ohm to 1e12 ohm";

    private SpecChecks() {
    }

    /** Checks every setting on its own and the per-bit list against the bit depth. */
    static void check(LadderSpec s) {
        int bits = s.bits();
        require(bits >= 1 && bits <= 16, "bits", "bit depth must be 1..16, got %d", bits);
        List<Double> rs = s.resistors();
        if (s.topology() == Topology.R2R) {
            require(rs.isEmpty() || rs.size() == 2 * bits, "resistors", "not used by topology r2r unless it lists"
                    + " all %d parts of %d bits (the legs, bit 0 first, then the rungs from bit 0 up, then the"
                    + " termination), got %d; remove it to take the values from base_r, or use topology custom for"
                    + " a summing network of your own values", 2 * bits, bits, rs.size());
        } else {
            require(!rs.isEmpty() || s.topology() != Topology.CUSTOM, "resistors",
                    "topology custom needs one value per bit, bit 0 (LSB) first");
            require(rs.isEmpty() || rs.size() == bits, "resistors", "expected %d values for %d bits, got %d",
                    bits, bits, rs.size());
        }
        String what = s.topology() == Topology.R2R ? "part" : "bit";
        for (int i = 0; i < rs.size(); i++) {
            double r = rs.get(i);
            require(Double.isFinite(r) && r > 0, "resistors",
                    "%s %d needs a positive, finite resistance, got %s", what, i, ohms(r));
            require(inRange(r), "resistors", "%s %d needs a resistance of %s, got %s", what, i, RANGE, ohms(r));
        }
        require(Double.isFinite(s.baseROhms()) && s.baseROhms() > 0, "base_r",
                "must be a positive, finite resistance, got %s", ohms(s.baseROhms()));
        require(inRange(s.baseROhms()), "base_r", "must be %s, got %s", RANGE, ohms(s.baseROhms()));
        checkDerived(s);
        require(s.tolerance() >= 0 && s.tolerance() <= 0.5, "tolerance", "must be 0%% to 50%%, got %s",
                percent(s.tolerance()));
        require(Double.isFinite(s.logicLowVolts()), "logic_low", "must be a finite voltage");
        require(Double.isFinite(s.logicHighVolts()) && s.logicHighVolts() > s.logicLowVolts(), "logic_high",
                "must be above logic_low (%s), got %s", volts(s.logicLowVolts()), volts(s.logicHighVolts()));
        require(Double.isFinite(s.pinROhmsHigh()) && s.pinROhmsHigh() >= 0, "pin_r_high",
                "must be 0 or a positive, finite resistance, got %s", ohms(s.pinROhmsHigh()));
        require(s.pinROhmsHigh() <= MAX_OHMS, "pin_r_high", "must be 0 to 1e12 ohm, got %s",
                ohms(s.pinROhmsHigh()));
        require(Double.isFinite(s.pinROhmsLow()) && s.pinROhmsLow() >= 0, "pin_r_low",
                "must be 0 or a positive, finite resistance, got %s", ohms(s.pinROhmsLow()));
        require(s.pinROhmsLow() <= MAX_OHMS, "pin_r_low", "must be 0 to 1e12 ohm, got %s", ohms(s.pinROhmsLow()));
        require(s.loadOhms() > 0 && !Double.isNaN(s.loadOhms()), "load",
                "must be a positive resistance, or inf for none, got %s", ohms(s.loadOhms()));
        require(Double.isInfinite(s.loadOhms()) || inRange(s.loadOhms()), "load", "must be %s, or inf for none,"
                + " got %s", RANGE, ohms(s.loadOhms()));
        require(Double.isFinite(s.bufferGain()) && s.bufferGain() > 0, "buffer.gain",
                "must be a positive number, got %s", Units.format(s.bufferGain(), ""));
        require(!Double.isNaN(s.outMinVolts()) && s.outMinVolts() < Double.POSITIVE_INFINITY, "buffer.out_min",
                "must be a voltage, got %s", volts(s.outMinVolts()));
        require(s.outMaxVolts() > s.outMinVolts(), "buffer.out_max", "%s must be above out_min (%s)",
                volts(s.outMaxVolts()), volts(s.outMinVolts()));
    }

    private static boolean inRange(double ohms) {
        return ohms >= MIN_OHMS && ohms <= MAX_OHMS;
    }

    /** Checks that the values derived from base_r stay within the limits: bit 0's leg, or the 2R legs. */
    private static void checkDerived(LadderSpec s) {
        if (s.topology() == Topology.R2R) {
            require(2 * s.baseROhms() <= MAX_OHMS, "base_r", "%s makes the 2R legs %s, above 1e12 ohm; use a"
                    + " smaller base_r", ohms(s.baseROhms()), ohms(2 * s.baseROhms()));
        } else if (s.resistors().isEmpty()) {
            int shift = s.bits() - 1;
            double lsb = s.baseROhms() * Math.pow(2, shift);
            require(lsb <= MAX_OHMS, "base_r", "%s makes bit 0's resistor %s (base_r * 2^%d), above 1e12 ohm;"
                    + " use a smaller base_r", ohms(s.baseROhms()), ohms(lsb), shift);
        }
    }

    /** Checks that the buffer swing leaves at least two distinct output levels. */
    static void checkSpan(LadderSpec s, double[] ladderVolts) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (double v : ladderVolts) {
            lo = Math.min(lo, v);
            hi = Math.max(hi, v);
        }
        double g = s.bufferGain();
        require(g * hi > s.outMinVolts(), "buffer.out_min",
                "%s is at or above the highest buffered ladder level (%s); no usable span is left",
                volts(s.outMinVolts()), volts(g * hi));
        require(g * lo < s.outMaxVolts(), "buffer.out_max",
                "%s is at or below the lowest buffered ladder level (%s); no usable span is left",
                volts(s.outMaxVolts()), volts(g * lo));
    }

    /** Warnings of the nominal network: pins as strong as the ladder, buffer clipping. */
    static List<String> warnings(LadderSpec s, double[] ladderVolts) {
        List<String> out = new ArrayList<>();
        Part smallest = null;
        for (Part p : s.parts()) {
            if (smallest == null || p.ohms() < smallest.ohms()) {
                smallest = p;
            }
        }
        double pin = Math.max(s.pinROhmsHigh(), s.pinROhmsLow());
        if (smallest != null && pin > smallest.ohms()) {
            out.add(String.format(Locale.ROOT, "pin resistance (%s high, %s low) is larger than the smallest"
                    + " ladder resistor (%s, %s): the pins, not the resistors, set the levels; use larger"
                    + " resistors", ohms(s.pinROhmsHigh()), ohms(s.pinROhmsLow()), ohms(smallest.ohms()),
                    smallest.label()));
        }
        clipWarning(s, ladderVolts, true, out);
        clipWarning(s, ladderVolts, false, out);
        return out;
    }

    private static void clipWarning(LadderSpec s, double[] ladderVolts, boolean top, List<String> out) {
        double g = s.bufferGain();
        int count = 0;
        int first = -1;
        int last = -1;
        // a level on the rail itself (all pins high, no load) is not clipped: allow the rounding of its sum
        double slack = 1e-9 * Math.max(1, s.outMaxVolts() - s.outMinVolts());
        for (int k = 0; k < ladderVolts.length; k++) {
            double v = g * ladderVolts[k];
            if (top ? v > s.outMaxVolts() + slack : v < s.outMinVolts() - slack) {
                count++;
                first = first < 0 ? k : first;
                last = k;
            }
        }
        if (count > 0) {
            out.add(String.format(Locale.ROOT, "the buffer clips %d code%s at %s %s (codes %d..%d);"
                    + " lower the gain or widen the swing", count, count == 1 ? "" : "s",
                    top ? "out_max" : "out_min", volts(top ? s.outMaxVolts() : s.outMinVolts()), first, last));
        }
    }

    private static void require(boolean ok, String key, String format, Object... args) {
        if (!ok) {
            throw new LadderSpecError(key, String.format(Locale.ROOT, format, args));
        }
    }

    /** A fraction as a percentage with up to three significant digits: "5%", "0.5%", "0.25%". */
    static String percent(double fraction) {
        String t = new java.math.BigDecimal(100 * fraction).round(new java.math.MathContext(3))
                .stripTrailingZeros().toPlainString();
        return t + "%";
    }

    /** Ohms in engineering notation; beyond the prefixes (a refused value) as 1e+300. */
    static String ohms(double r) {
        boolean beyond = Double.isFinite(r) && r != 0 && (Math.abs(r) >= 1e12 || Math.abs(r) < 1e-9);
        return beyond ? String.format(Locale.ROOT, "%.3g", r).replaceFirst("\\.?0+e", "e") : Units.format(r, "");
    }

    static String volts(double v) {
        return Units.format(v, "V");
    }
}
