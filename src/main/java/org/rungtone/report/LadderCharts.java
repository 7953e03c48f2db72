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

    /** Percent of boards: uneven steps that show the tails. */
    private static final double[] SHARES = {0, 0.1, 0.5, 1, 2, 5, 10, 20, 30, 40, 50, 60, 70, 80, 90, 95,
        98, 99, 99.5, 99.9, 100};

    /** Share of a y range left free above and below, so that no line runs along the frame. */
    private static final double PAD = 0.04;

    private LadderCharts() {
    }

    /** Which chart: each has its file name. */
    enum Kind {
        /** Output volts against code, modelled and ideal. */
        TRANSFER("transfer.png"),
        /** DNL against code, with the ±0.5 LSB band and the −1 LSB monotonicity limit. */
        DNL("dnl.png"),
        /** INL against code, endpoint and best-fit line, with the ±0.5 LSB band. */
        INL("inl.png"),
        /** The share of simulated boards at or below each worst error. */
        MONTE_CARLO("monte-carlo.png");

        private final String fileName;

        Kind(String fileName) {
            this.fileName = fileName;
        }

        String fileName() {
            return fileName;
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

    /** The ±0.5 LSB band both linearity charts draw. */
    static final Plots.Reference HALF_LSB = new Plots.Reference("\u00b10.5 LSB", Plots.Direction.HORIZONTAL,
            List.of(0.5, -0.5));
    /** DNL at −1 LSB: a step that does not rise; any DNL above it everywhere means monotonic (IEEE 1658). */
    static final Plots.Reference MONOTONIC_LIMIT = Plots.Reference.horizontal("-1 LSB (monotonic limit)", -1);

    /** The charts of an analysis, plus the Monte Carlo one when there was a run. */
    static List<Figure> of(LadderAnalysis a, Optional<MonteCarloResult> monteCarlo) {
        int n = a.levels().size();
        Plots.Style style = n <= 64 ? Plots.Style.LINE_AND_MARKERS : Plots.Style.LINE;
        Linearity lin = a.linearity();
        String ladder = a.spec().describe();
        String what = " (" + ladder + ")";
        PlotAxis codes = PlotAxis.integers("code", 0, n - 1);
        String over = " of the " + ladder + " ladder, codes 0\u2013" + (n - 1);
        List<Figure> charts = new ArrayList<>();
        List<Plots.Series> transfer = List.of(envelope("modelled", a.levels().levels(), style),
                envelope("ideal", a.ideal().levels(), Plots.Style.DASHED));
        charts.add(new Figure(Kind.TRANSFER, chart("Transfer curve" + what, codes, "output (V)", transfer,
                List.of(), "Transfer curve" + over + ": output volts, modelled and ideal")));
        charts.add(new Figure(Kind.DNL, chart("DNL" + what, codes, "DNL (LSB)",
                List.of(envelope("DNL", lin.dnlLsb(), style)), List.of(HALF_LSB, MONOTONIC_LIMIT),
                "Differential non-linearity" + over + ", LSB, with \u00b10.5 LSB and the -1 LSB monotonic limit"
                        + " dashed")));
        charts.add(new Figure(Kind.INL, chart("INL" + what, codes, "INL (LSB)", List.of(
                envelope("endpoint line", lin.inlLsb(), style),
                envelope("best-fit line", lin.inlBestFitLsb(), Plots.Style.DASHED)), List.of(HALF_LSB),
                "Integral non-linearity" + over + ", LSB, against the endpoint and the best-fit line, with"
                        + " \u00b10.5 LSB dashed")));
        monteCarlo.ifPresent(mc -> charts.add(new Figure(Kind.MONTE_CARLO, monteCarlo(mc, ladder))));
        return charts;
    }

    private static Plots.Chart monteCarlo(MonteCarloResult mc, String ladder) {
        List<Plots.Series> series = List.of(share("worst |INL|", mc.worstInlLsb()),
                share("worst |DNL|", mc.worstDnlLsb()));
        List<Plots.Reference> refs = List.of(Plots.Reference.vertical("0.5 LSB", 0.5));
        PlotAxis.Span xs = Plots.span(series, refs, Plots.Direction.VERTICAL, true);
        return new Plots.Chart("Monte Carlo, " + mc.boards() + " boards (" + ladder + ")",
                PlotAxis.rounded("worst |error| (LSB)", 0, xs.high()), new PlotAxis("boards at or below (%)", 0, 100,
                        20), series, refs, "Share of " + mc.boards() + " simulated boards of the " + ladder
                        + " ladder at or below each worst |INL| and |DNL|, LSB, with 0.5 LSB dashed");
    }

    /** A chart over codes, its y axis rounded to hold the data and the reference lines. */
    private static Plots.Chart chart(String title, PlotAxis codes, String yLabel, List<Plots.Series> series,
            List<Plots.Reference> refs, String description) {
        PlotAxis.Span ys = Plots.span(series, refs, Plots.Direction.HORIZONTAL, false).padded(PAD);
        return new Plots.Chart(title, codes, PlotAxis.rounded(yLabel, ys.low(), ys.high()), series, refs,
                description);
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
