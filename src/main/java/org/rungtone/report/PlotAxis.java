package org.rungtone.report;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Pattern;
import org.rungtone.internal.Checks;

/**
 * One axis of a plot: its label, the range it shows and the step between its ticks. Steps are 1, 2 or 5
 * times a power of ten, and ticks sit on whole multiples of the step, so every tick value reads round
 * (0, 0.5, 1; −120, −100; 2,000, 4,000). The plot draws exactly {@link #ticks()}.
 *
 * @param label the axis title with its unit
 * @param min the lowest value shown
 * @param max the highest value shown
 * @param step the distance between ticks: 1, 2 or 5 × 10^k
 */
public record PlotAxis(String label, double min, double max, double step) {
    /** "-0", "-0.0", ...: a value that rounds to zero from below, labelled without its sign. */
    private static final Pattern NEGATIVE_ZERO = Pattern.compile("-0(\\.0*)?");

    /** Intervals between ticks, at most: at least 34 pixels apart on a 340-pixel-high plot. */
    static final int MAX_INTERVALS = 10;

    /** Checks the range and the step. */
    public PlotAxis {
        Checks.checkArgument(Double.isFinite(min) && Double.isFinite(max) && min < max,
                "axis %s: range must be finite and increasing: %s .. %s", label, min, max);
        Checks.checkArgument(isRoundStep(step), "axis %s: step must be 1, 2 or 5 times a power of ten: %s",
                label, step);
    }

    /**
     * An axis over exactly {@code low .. high} with the roundest step that gives at most
     * {@link #MAX_INTERVALS} intervals (a frequency axis ends at the Nyquist rate, not at a round number).
     * An empty range is widened by one unit each side.
     */
    public static PlotAxis exact(String label, double low, double high) {
        Span s = widened(low, high);
        return new PlotAxis(label, s.low(), s.high(), step(s.high() - s.low(), MAX_INTERVALS));
    }

    /** An exact axis over whole numbers (bit depths, codes): its step is never below 1. */
    public static PlotAxis integers(String label, double low, double high) {
        PlotAxis a = exact(label, low, high);
        return a.step() >= 1 ? a : new PlotAxis(label, a.min(), a.max(), 1);
    }

    /** An axis from {@code low} rounded down to {@code high} rounded up, both to whole steps. */
    public static PlotAxis rounded(String label, double low, double high) {
        return rounded(label, low, high, MAX_INTERVALS);
    }

    /** An axis rounded outward to whole steps, with at most {@code maxIntervals} intervals. */
    public static PlotAxis rounded(String label, double low, double high, int maxIntervals) {
        Checks.checkArgument(maxIntervals >= 1, "maxIntervals must be >= 1: %d", maxIntervals);
        Span s = widened(low, high);
        double step = step(s.high() - s.low(), maxIntervals);
        // widening to whole steps can add an interval; take the next step up until it fits
        while (Math.ceil(s.high() / step - 1e-9) - Math.floor(s.low() / step + 1e-9) > maxIntervals) {
            step = nextStep(step);
        }
        return new PlotAxis(label, multiple(Math.floor(s.low() / step + 1e-9), step),
                multiple(Math.ceil(s.high() / step - 1e-9), step), step);
    }

    /** The tick values: every whole multiple of the step from min to max, exact decimals. */
    public List<Double> ticks() {
        List<Double> ticks = new ArrayList<>();
        long first = (long) Math.ceil(min / step - 1e-9);
        long last = (long) Math.floor(max / step + 1e-9);
        for (long k = first; k <= last; k++) {
            double t = multiple(k, step);
            if (contains(t)) {
                ticks.add(t);
            }
        }
        return ticks;
    }

    /**
     * A tick's label: as many decimals as the step needs, thousands grouped on axes that reach 10,000:
     * "0.5", "-120", "5,000" next to "10,000".
     */
    public String format(double value) {
        int decimals = Math.max(0, BigDecimal.valueOf(step).stripTrailingZeros().scale());
        boolean grouped = Math.max(Math.abs(min), Math.abs(max)) >= 10_000;
        String pattern = grouped ? "%,." + decimals + "f" : "%." + decimals + "f";
        String text = String.format(Locale.ROOT, pattern, value);
        return NEGATIVE_ZERO.matcher(text).matches() ? text.substring(1) : text;
    }

    /** The same axis with another label. */
    public PlotAxis withLabel(String newLabel) {
        return new PlotAxis(newLabel, min, max, step);
    }

    /** True when {@code v} lies within the axis range. */
    public boolean contains(double v) {
        return v >= min && v <= max;
    }

    /** A range of data values, low ≤ high. */
    public record Span(double low, double high) {
        /** Checks the order. */
        public Span {
            Checks.checkArgument(low <= high, "span must not be reversed: %s .. %s", low, high);
        }

        /** The smallest span holding both. */
        public Span union(Span other) {
            return new Span(Math.min(low, other.low), Math.max(high, other.high));
        }

        /**
         * This span widened by {@code fraction} of its width at each end, so that nothing runs along the
         * frame; an end at or beyond zero stays there (volts from 0 V do not grow a negative range).
         */
        public Span padded(double fraction) {
            double margin = (high - low) * fraction;
            double newLow = low >= 0 ? Math.max(0, low - margin) : low - margin;
            double newHigh = high <= 0 ? Math.min(0, high + margin) : high + margin;
            return new Span(newLow, newHigh);
        }

        /** The smallest span holding this one and {@code v}. */
        public Span including(double v) {
            return new Span(Math.min(low, v), Math.max(high, v));
        }
    }

    /** The roundest step (1, 2, 5 × 10^k) that cuts {@code span} into at most {@code maxIntervals} parts. */
    static double step(double span, int maxIntervals) {
        double raw = span / maxIntervals;
        int exponent = (int) Math.floor(Math.log10(raw));
        double step = BigDecimal.ONE.scaleByPowerOfTen(exponent).doubleValue();
        while (step * maxIntervals < span * (1 - 1e-12)) {
            step = nextStep(step);
        }
        return step;
    }

    /** The next round step up: 1 → 2 → 5 → 10. */
    private static double nextStep(double step) {
        BigDecimal s = BigDecimal.valueOf(step);
        int exponent = s.precision() - s.scale() - 1;
        BigDecimal unit = BigDecimal.ONE.scaleByPowerOfTen(exponent);
        int mantissa = s.divide(unit, RoundingMode.HALF_UP).intValue();
        int next = mantissa == 1 ? 2 : mantissa == 2 ? 5 : 10;
        return unit.multiply(BigDecimal.valueOf(next)).doubleValue();
    }

    private static boolean isRoundStep(double step) {
        if (!(step > 0) || Double.isInfinite(step)) {
            return false;
        }
        BigDecimal s = BigDecimal.valueOf(step).stripTrailingZeros();
        return s.unscaledValue().abs().toString().matches("[125]");
    }

    /** {@code k × step} as the nearest double to the exact decimal (0.1 × 3 = 0.3, not 0.30000000000000004). */
    private static double multiple(double k, double step) {
        return BigDecimal.valueOf(step).multiply(BigDecimal.valueOf((long) k)).doubleValue() + 0.0;
    }

    private static Span widened(double low, double high) {
        Checks.checkArgument(Double.isFinite(low) && Double.isFinite(high) && low <= high,
                "axis range must be finite and increasing: %s .. %s", low, high);
        return low == high ? new Span(low - 1, high + 1) : new Span(low, high);
    }
}
