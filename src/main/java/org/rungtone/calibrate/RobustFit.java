package org.rungtone.calibrate;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Least squares that leaves out readings which do not fit (package-private). Each round fits the kept
 * readings, then scores every reading by its studentised residual: for a kept reading
 * {@code t = e/(s·√(1 − h))}, for a left-out one the prediction error {@code t = e/(s·√(1 + h))}, with
 * leverage h from the Jacobian and a robust scale s = 1.4826 · median of {@code |e|/√(1 − h)} over kept
 * readings (the median absolute deviation, consistent for Gaussian noise; Rousseeuw and Croux, JASA 88,
 * 1993), never below the meter's floor. Readings with {@code |t|} above {@value #THRESHOLD} and at least half
 * the largest score are left out, left-out readings whose prediction now fits come back, until nothing
 * changes (Belsley, Kuh and Welsch, Regression Diagnostics, 1980, for studentised residuals). A reading
 * with leverage 1 determines its own parameter and cannot be checked. Leaving out is skipped where it
 * would leave a parameter undetermined.
 */
final class RobustFit {
    /** Studentised residual beyond which a reading is an outlier (common practice, no source). */
    static final double THRESHOLD = 5.0;
    private static final double UNCHECKABLE = 1 - 1e-9;
    private static final int MAX_ROUNDS = 40;
    private static final double MAD_TO_SIGMA = 1.4826;

    private RobustFit() {
    }

    /**
     * The outcome of a robust fit.
     *
     * @param kind the model family
     * @param theta the parameters fitted to the kept readings
     * @param excluded per reading, true when left out as an outlier
     * @param residual per reading, value minus model
     * @param score per reading, the studentised residual (0 for unchecked ones)
     * @param unchecked per reading, true when its leverage is 1
     * @param scale the residual scale s used, volts
     * @param rInverse R⁻¹ of the kept readings' Jacobian, for parameter sigmas
     */
    record Outcome(ModelKind kind, double[] theta, boolean[] excluded, double[] residual, double[] score,
            boolean[] unchecked, double scale, double[][] rInverse) {
        /** Sum of squared residuals over kept readings. */
        double rss() {
            double s = 0;
            for (int i = 0; i < residual.length; i++) {
                if (!excluded[i]) {
                    s += residual[i] * residual[i];
                }
            }
            return s;
        }

        /** Number of kept readings. */
        int kept() {
            int n = 0;
            for (boolean e : excluded) {
                n += e ? 0 : 1;
            }
            return n;
        }

        /** Indices of left-out readings. */
        List<Integer> outliers() {
            List<Integer> out = new ArrayList<>();
            for (int i = 0; i < excluded.length; i++) {
                if (excluded[i]) {
                    out.add(i);
                }
            }
            return out;
        }
    }

    /**
     * Fits {@code kind} to {@code values} robustly.
     *
     * @param floor the smallest residual scale to assume, volts (the meter's)
     * @return the outcome, or null when even all readings do not determine the parameters
     */
    static Outcome run(ModelKind kind, double[] values, double floor) {
        int m = values.length;
        boolean[] excluded = new boolean[m];
        Outcome last = null;
        for (int round = 0; round < MAX_ROUNDS; round++) {
            int[] rows = rows(excluded);
            double[] theta = kind.fit(rows);
            if (theta == null) {
                return last;
            }
            Outcome o = assess(kind, values, rows, excluded, theta, floor);
            if (o == null) {
                return last;
            }
            last = o;
            boolean[] next = choose(o);
            if (Arrays.equals(next, excluded)) {
                return o;
            }
            excluded = determinedOrGreedy(kind, o, next);
            if (Arrays.equals(excluded, o.excluded())) {
                return o;
            }
        }
        return last;
    }

    static int[] rows(boolean[] excluded) {
        int n = 0;
        for (boolean e : excluded) {
            n += e ? 0 : 1;
        }
        int[] rows = new int[n];
        int k = 0;
        for (int i = 0; i < excluded.length; i++) {
            if (!excluded[i]) {
                rows[k++] = i;
            }
        }
        return rows;
    }

    private static Outcome assess(ModelKind kind, double[] values, int[] rows, boolean[] excluded,
            double[] theta, double floor) {
        int m = values.length;
        double[][] jac = new double[m][];
        for (int i = 0; i < m; i++) {
            jac[i] = kind.gradient(theta, i);
        }
        double[][] rInv = LeastSquares.rInverse(jac, rows);
        if (rInv == null) {
            return null;
        }
        double[] e = new double[m];
        double[] sd = new double[m];
        boolean[] unchecked = new boolean[m];
        double[] standardized = new double[rows.length];
        int ns = 0;
        for (int i = 0; i < m; i++) {
            e[i] = values[i] - kind.predict(theta, i);
            double h = LeastSquares.leverage(jac[i], rInv);
            if (excluded[i]) {
                sd[i] = Math.sqrt(1 + h);
            } else if (h > UNCHECKABLE) {
                unchecked[i] = true;
            } else {
                sd[i] = Math.sqrt(1 - h);
                standardized[ns++] = Math.abs(e[i]) / sd[i];
            }
        }
        double scale = floor;
        if (ns > 0) {
            double[] s = Arrays.copyOf(standardized, ns);
            Arrays.sort(s);
            double median = ns % 2 == 1 ? s[ns / 2] : 0.5 * (s[ns / 2 - 1] + s[ns / 2]);
            scale = Math.max(floor, MAD_TO_SIGMA * median);
        }
        double[] t = new double[m];
        for (int i = 0; i < m; i++) {
            t[i] = unchecked[i] || scale == 0 ? 0 : e[i] / (scale * sd[i]);
        }
        return new Outcome(kind, theta, excluded.clone(), e, t, unchecked, scale, rInv);
    }

    /** Out: kept readings scoring above the cut; left-out readings that still score above the threshold. */
    private static boolean[] choose(Outcome o) {
        double max = 0;
        for (int i = 0; i < o.score().length; i++) {
            if (!o.excluded()[i]) {
                max = Math.max(max, Math.abs(o.score()[i]));
            }
        }
        double cut = Math.max(THRESHOLD, 0.5 * max);
        boolean[] next = new boolean[o.score().length];
        for (int i = 0; i < next.length; i++) {
            double t = Math.abs(o.score()[i]);
            next[i] = o.excluded()[i] ? t > THRESHOLD : t > cut;
        }
        return next;
    }

    /** {@code next} when it keeps every parameter determined; else the newly flagged added worst first. */
    private static boolean[] determinedOrGreedy(ModelKind kind, Outcome o, boolean[] next) {
        if (kind.determined(rows(next))) {
            return next;
        }
        boolean[] base = next.clone();
        List<Integer> added = new ArrayList<>();
        for (int i = 0; i < base.length; i++) {
            if (base[i] && !o.excluded()[i]) {
                base[i] = false;
                added.add(i);
            }
        }
        if (!kind.determined(rows(base))) {
            return o.excluded().clone();
        }
        added.sort((a, b) -> Double.compare(Math.abs(o.score()[b]), Math.abs(o.score()[a])));
        for (int i : added) {
            base[i] = true;
            if (!kind.determined(rows(base))) {
                base[i] = false;
            }
        }
        return base;
    }
}
