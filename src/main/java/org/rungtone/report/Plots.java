package org.rungtone.report;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.Checks;

/**
 * PNG plots for reports: a chart is described completely here (axes with their ticks, data series,
 * reference lines, where the legend goes, a sentence saying what it shows), then drawn by
 * {@link ChartRenderer} and written atomically. Charts are deterministic: fixed size, fixed colours in
 * series order, no timestamps.
 */
public final class Plots {
    private Plots() {
    }

    /** How a series is drawn. */
    public enum Style {
        /** Straight lines between points. */
        LINE,
        /** Markers only. */
        MARKERS,
        /** Lines with markers. */
        LINE_AND_MARKERS,
        /** A thin dashed line (a second curve to compare with, such as an ideal one). */
        DASHED
    }

    /**
     * One data series.
     *
     * @param name legend text
     * @param x x values
     * @param y y values, same length as x
     * @param style how to draw it
     */
    public record Series(String name, double[] x, double[] y, Style style) {
        /** Checks the lengths. */
        public Series {
            Checks.checkArgument(x.length == y.length, "series %s: x and y lengths differ", name);
        }
    }

    /** Which way a reference line runs. */
    public enum Direction {
        /** Across the plot at a y value (a limit, a floor, a target). */
        HORIZONTAL,
        /** Up the plot at an x value (a cutoff, a budget). */
        VERTICAL
    }

    /**
     * Dashed reference lines across the whole plot, one legend entry for all of them.
     *
     * @param label legend text, e.g. "±0.5 LSB"
     * @param direction which way the lines run
     * @param values the y values (horizontal) or x values (vertical) of the lines
     */
    public record Reference(String label, Direction direction, List<Double> values) {
        /** Checks and copies the values. */
        public Reference {
            Checks.checkArgument(!values.isEmpty(), "reference %s has no values", label);
            values = List.copyOf(values);
            for (double v : values) {
                Checks.checkArgument(Double.isFinite(v), "reference %s: value must be finite: %s", label, v);
            }
        }

        /** One horizontal line. */
        public static Reference horizontal(String label, double y) {
            return new Reference(label, Direction.HORIZONTAL, List.of(y));
        }

        /** One vertical line. */
        public static Reference vertical(String label, double x) {
            return new Reference(label, Direction.VERTICAL, List.of(x));
        }
    }

    /**
     * A chart description.
     *
     * @param title chart title
     * @param x the x axis: label, range, ticks
     * @param y the y axis
     * @param series the data
     * @param references reference lines, drawn dashed across the plot
     * @param description what the chart shows, in one sentence (a page's alt text)
     */
    public record Chart(String title, PlotAxis x, PlotAxis y, List<Series> series, List<Reference> references,
            String description) {
        /** Copies the lists; legend entries must differ (each names one thing). */
        public Chart {
            series = List.copyOf(series);
            references = List.copyOf(references);
            Set<String> names = new HashSet<>();
            for (String name : legendEntries(series, references)) {
                Checks.checkArgument(names.add(name), "chart %s: two legend entries are called %s", title, name);
            }
        }

        /**
         * A chart whose axes fit its data and reference lines: the x axis exactly, the y axis rounded out to
         * whole ticks.
         */
        public static Chart of(String title, String xLabel, String yLabel, List<Series> series,
                List<Reference> references, String description) {
            PlotAxis.Span xs = span(series, references, Direction.VERTICAL, true);
            PlotAxis.Span ys = span(series, references, Direction.HORIZONTAL, false);
            return new Chart(title, PlotAxis.exact(xLabel, xs.low(), xs.high()),
                    PlotAxis.rounded(yLabel, ys.low(), ys.high()), series, references, description);
        }

        /** A chart with no reference lines whose description is its title. */
        public static Chart of(String title, String xLabel, String yLabel, List<Series> series) {
            return of(title, xLabel, yLabel, series, List.of(), title);
        }

        /** Where the legend goes: an inside corner the data leave empty, else below the plot. */
        public LegendPlace legend() {
            return LegendPlace.choose(this);
        }

        /** The legend's entries in order: each series, then each reference. */
        public List<String> legendEntries() {
            return legendEntries(series, references);
        }

        private static List<String> legendEntries(List<Series> series, List<Reference> references) {
            List<String> names = new ArrayList<>();
            series.forEach(s -> names.add(s.name()));
            references.forEach(r -> names.add(r.label()));
            return names;
        }
    }

    /** The range of the finite x (or y) values of the data and of the references running across that axis. */
    static PlotAxis.Span span(List<Series> series, List<Reference> references, Direction across, boolean x) {
        double low = Double.POSITIVE_INFINITY;
        double high = Double.NEGATIVE_INFINITY;
        for (Series s : series) {
            for (double v : x ? s.x() : s.y()) {
                if (Double.isFinite(v)) {
                    low = Math.min(low, v);
                    high = Math.max(high, v);
                }
            }
        }
        for (Reference r : references) {
            if (r.direction() == across) {
                for (double v : r.values()) {
                    low = Math.min(low, v);
                    high = Math.max(high, v);
                }
            }
        }
        return low <= high ? new PlotAxis.Span(low, high) : new PlotAxis.Span(0, 1);
    }

    /**
     * Loads the drawing and PNG-encoding machinery (Java2D, fonts, XChart) by rendering a tiny chart and
     * throwing it away: a build calls this on a spare thread at its start, so the first real plot later
     * does not pay a few hundred milliseconds of one-time start-up.
     */
    public static void warmUp() {
        png(Chart.of("", "x", "y", List.of(new Series("s", new double[] {0, 1}, new double[] {0, 1},
                Style.LINE))));
    }

    /** Renders a chart to PNG bytes (800 x 480), its description in the file (see {@link PngText}). */
    public static byte[] png(Chart chart) {
        return PngEncoder.encode(ChartRenderer.image(chart), chart.description());
    }

    /** Renders a chart and writes it atomically to {@code file}. */
    public static void write(Path file, Chart chart) {
        AtomicFiles.writeBytes(file, png(chart));
    }
}
