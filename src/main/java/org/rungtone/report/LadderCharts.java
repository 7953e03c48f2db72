package org.rungtone.report;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import org.rungtone.ladder.LadderAnalysis;
import org.rungtone.ladder.Linearity;
import org.rungtone.ladder.MonteCarloResult;

/** The ladder's PNG charts: transfer curve, DNL, INL and, after Monte Carlo, the share of boards per worst INL. */
final class LadderCharts {
    /** Above this many codes, a series keeps only each run's extremes. */
    private static final int MAX_POINTS = 2048;

    /** The number of runs of codes a long series is thinned to. */
    private static final int RUNS = 1024;

    /** Percent of boards: uneven steps that show the tails (and keep XChart's ticks readable). */
    private static final double[] SHARES = {0, 0.1, 0.5, 1, 2, 5, 10, 20, 30, 40, 50, 60, 70, 80, 90, 95,
        98, 99, 99.5, 99.9, 100};

    private LadderCharts() {
    }

    /** Which chart: each has its file name and legend corner. */
    enum Kind {
        /** Output volts against code, modelled and ideal; it rises to the right, so its legend sits low. */
        TRANSFER("transfer.png", Plots.Legend.BOTTOM_RIGHT),
        /** DNL against code. */
        DNL("dnl.png", Plots.Legend.TOP_RIGHT),
        /** INL against code, endpoint and best-fit line. */
        INL("inl.png", Plots.Legend.TOP_RIGHT),
        /** The share of simulated boards at or below each worst error. */
        MONTE_CARLO("monte-carlo.png", Plots.Legend.TOP_RIGHT);

        private final String fileName;
        private final Plots.Legend legend;

        Kind(String fileName, Plots.Legend legend) {
            this.fileName = fileName;
            this.legend = legend;
        }

        String fileName() {
            return fileName;
        }

        Plots.Legend legend() {
            return legend;
        }
    }

    /**
     * One chart and its kind.
     *
     * @param kind which chart
     * @param chart what it draws
     */
    record Figure(Kind kind, Plots.Chart chart) {
    }

    /** The charts of an analysis, plus the Monte Carlo one when there was a run. */
    static List<Figure> of(LadderAnalysis a, Optional<MonteCarloResult> monteCarlo) {
        int n = a.levels().size();
        Plots.Style style = n <= 64 ? Plots.Style.LINE_AND_MARKERS : Plots.Style.LINE;
        Linearity lin = a.linearity();
        String what = " (" + a.spec().describe() + ")";
        List<Figure> charts = new ArrayList<>();
        charts.add(new Figure(Kind.TRANSFER, new Plots.Chart("Transfer curve" + what, "code", "output (V)", false,
                List.of(envelope("modelled", a.levels().levels(), style),
                        envelope("ideal", a.ideal().levels(), Plots.Style.DASHED)))));
        charts.add(new Figure(Kind.DNL, new Plots.Chart("DNL" + what, "code", "DNL (LSB)", false, List.of(
                envelope("DNL", lin.dnlLsb(), style)))));
        charts.add(new Figure(Kind.INL, new Plots.Chart("INL" + what, "code", "INL (LSB)", false, List.of(
                envelope("endpoint line", lin.inlLsb(), style),
                envelope("best-fit line", lin.inlBestFitLsb(), Plots.Style.DASHED)))));
        monteCarlo.ifPresent(mc -> charts.add(new Figure(Kind.MONTE_CARLO, new Plots.Chart("Monte Carlo, "
                + mc.boards() + " boards" + what, "worst |error| (LSB)", "boards at or below (%)", false, List.of(
                share("worst |INL|", mc.worstInlLsb()), share("worst |DNL|", mc.worstDnlLsb()))))));
        return charts;
    }

    /**
     * A series over codes; above 2048 codes, each of 1024 runs of codes keeps only its lowest and highest
     * point, so spikes survive and the chart stays quick to draw.
     */
    static Plots.Series envelope(String name, double[] y, Plots.Style style) {
        int n = y.length;
        if (n <= MAX_POINTS) {
            double[] x = new double[n];
            for (int k = 0; k < n; k++) {
                x[k] = k;
            }
            return new Plots.Series(name, x, y, style);
        }
        int run = (n + RUNS - 1) / RUNS;
        double[] xs = new double[2 * ((n + run - 1) / run)];
        double[] ys = new double[xs.length];
        int m = 0;
        for (int start = 0; start < n; start += run) {
            int lo = start;
            int hi = start;
            for (int k = start; k < Math.min(n, start + run); k++) {
                lo = y[k] < y[lo] ? k : lo;
                hi = y[k] > y[hi] ? k : hi;
            }
            for (int k : lo == hi ? new int[] {lo} : new int[] {Math.min(lo, hi), Math.max(lo, hi)}) {
                xs[m] = k;
                ys[m++] = y[k];
            }
        }
        return new Plots.Series(name, Arrays.copyOf(xs, m), Arrays.copyOf(ys, m), style);
    }

    /** The empirical distribution: the nearest-rank value at each share of boards. */
    private static Plots.Series share(String name, double[] values) {
        double[] sorted = values.clone();
        Arrays.sort(sorted);
        int n = sorted.length;
        double[] x = new double[SHARES.length];
        for (int i = 0; i < x.length; i++) {
            int rank = (int) Math.ceil(SHARES[i] / 100 * n) - 1;
            x[i] = sorted[Math.max(0, Math.min(n - 1, rank))];
        }
        return new Plots.Series(name, x, SHARES.clone(), Plots.Style.LINE);
    }
}
