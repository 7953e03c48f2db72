package org.rungtone.calibrate;

/**
 * Finds a pattern of {@link RecordingSweep} in a recording by cross-correlation (package-private). The
 * recording passes a high-pass on its way in, so levels are not comparable across it, but its jumps are: the
 * jump at sample p is the mean of a window after p minus the mean of a window before it, each
 * {@value #WINDOW_SECONDS} s long and {@value #GAP_SECONDS} s clear of p (the input filter's settling). The
 * pattern's correlation at a start s is {@code C(s) = Σ e_j·J(s + j·c)} over its edge template e and the
 * step length c in samples; its largest magnitude marks the pattern and its sign the input's polarity. The
 * search runs on a grid of a quarter window, then sample by sample around the best point. A find must also
 * hold up edge by edge: every edge of the template must show a jump of the right sign and at least half the
 * mean size, and no other start may reach {@value #SIDE_PEAK_SHARE} of the peak (the patterns' own side peaks
 * reach 3/11).
 */
final class PatternSearch {
    static final double WINDOW_SECONDS = 0.004;
    static final double GAP_SECONDS = 0.0005;
    static final double SIDE_PEAK_SHARE = 0.6;

    private final double[] prefix;
    private final int window;
    private final int gap;
    private final int length;

    /** A search over {@code y} at {@code rateHz}. */
    PatternSearch(double[] y, double rateHz) {
        length = y.length;
        prefix = new double[y.length + 1];
        for (int i = 0; i < y.length; i++) {
            prefix[i + 1] = prefix[i] + y[i];
        }
        window = Math.max(2, (int) Math.round(WINDOW_SECONDS * rateHz));
        gap = Math.max(1, (int) Math.round(GAP_SECONDS * rateHz));
    }

    /**
     * A pattern found.
     *
     * @param start the sample where the pattern's first step begins
     * @param jump the mean jump of its edges in full-scale units (somewhat below the full swing, which the
     *     input's high-pass lets decay within the windows), signed by the input's polarity
     * @param sidePeak the largest correlation elsewhere, as a share of the peak
     */
    record Found(double start, double jump, double sidePeak) {
    }

    /** The jump at sample p: the mean after minus the mean before, or NaN too near an end. */
    double jump(double p) {
        int i = (int) Math.round(p);
        int a0 = i - gap - window;
        int b1 = i + gap + window;
        if (a0 < 0 || b1 > length) {
            return Double.NaN;
        }
        return ((prefix[b1] - prefix[i + gap]) - (prefix[i - gap] - prefix[a0])) / window;
    }

    private double correlation(int[] edges, double start, double stepSamples) {
        double c = 0;
        for (int j = 1; j < edges.length; j++) {
            if (edges[j] != 0) {
                double v = jump(start + j * stepSamples);
                if (Double.isNaN(v)) {
                    return 0;
                }
                c += edges[j] * v;
            }
        }
        return c;
    }

    /**
     * The best start of the pattern with {@code edges} between {@code from} and {@code to} (samples), its steps
     * {@code stepSamples} long; null when no start there holds up.
     */
    Found find(int[] edges, double stepSamples, double from, double to) {
        int count = 0;
        for (int e : edges) {
            count += Math.abs(e);
        }
        double lo = Math.max(0, from);
        double hi = Math.min(length - 1, to);
        int grid = Math.max(1, window / 4);
        double best = 0;
        double bestAt = -1;
        int cells = (int) Math.max(0, Math.floor((hi - lo) / grid)) + 1;
        double[] coarse = new double[cells];
        for (int k = 0; k < cells; k++) {
            double s = lo + (double) k * grid;
            coarse[k] = correlation(edges, s, stepSamples);
            if (Math.abs(coarse[k]) > Math.abs(best)) {
                best = coarse[k];
                bestAt = s;
            }
        }
        if (bestAt < 0 || best == 0) {
            return null;
        }
        for (double s = Math.max(lo, bestAt - grid); s <= Math.min(hi, bestAt + grid); s++) {
            double c = correlation(edges, s, stepSamples);
            if (Math.abs(c) > Math.abs(best)) {
                best = c;
                bestAt = s;
            }
        }
        double side = 0;
        double clear = stepSamples * 0.75;
        for (int k = 0; k < cells; k++) {
            if (Math.abs(lo + (double) k * grid - bestAt) > clear) {
                side = Math.max(side, Math.abs(coarse[k]));
            }
        }
        double mean = best / count;
        for (int j = 1; j < edges.length; j++) {
            if (edges[j] != 0 && !(edges[j] * jump(bestAt + j * stepSamples) / mean > 0.5)) {
                return null;
            }
        }
        double share = side / Math.abs(best);
        return share >= SIDE_PEAK_SHARE ? null : new Found(bestAt, mean, share);
    }
}
