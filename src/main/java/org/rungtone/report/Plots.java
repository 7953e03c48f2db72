package org.rungtone.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.knowm.xchart.BitmapEncoder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.SeriesMarkers;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.Checks;

/**
 * PNG plots for reports, drawn with XChart and written atomically. Charts are deterministic: fixed size,
 * fixed colours in series order, no timestamps.
 */
public final class Plots {
    private static final Color[] PALETTE = {
        new Color(0x1f, 0x5f, 0x99), new Color(0xc0, 0x39, 0x2b), new Color(0x27, 0x8f, 0x4e),
        new Color(0x8e, 0x44, 0xad), new Color(0xd3, 0x8b, 0x1a), new Color(0x2c, 0x3e, 0x50)};

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
        /** A thin dashed line (reference curves, limits). */
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

    /**
     * A chart description.
     *
     * @param title chart title
     * @param xLabel x axis label with unit
     * @param yLabel y axis label with unit
     * @param logX logarithmic x axis
     * @param series the data
     */
    public record Chart(String title, String xLabel, String yLabel, boolean logX, List<Series> series) {
    }

    /** Where the legend sits inside the plot area. */
    public enum Legend {
        /** Top right (the default). */
        TOP_RIGHT,
        /** Bottom right, for data that rise to the right. */
        BOTTOM_RIGHT
    }

    /**
     * Loads the drawing and PNG-encoding machinery (Java2D, fonts, XChart) by rendering a tiny chart and
     * throwing it away: a build calls this on a spare thread at its start, so the first real plot later
     * does not pay a few hundred milliseconds of one-time start-up.
     */
    public static void warmUp() {
        png(new Chart("", "x", "y", false, List.of(new Series("s", new double[] {0, 1}, new double[] {0, 1},
                Style.LINE))));
    }

    /** Renders a chart to PNG bytes (800 x 480). */
    public static byte[] png(Chart chart) {
        return png(chart, Legend.TOP_RIGHT);
    }

    /** Renders a chart to PNG bytes (800 x 480) with the legend where asked. */
    public static byte[] png(Chart chart, Legend legend) {
        XYChart c = new XYChartBuilder().width(800).height(480).title(chart.title())
                .xAxisTitle(chart.xLabel()).yAxisTitle(chart.yLabel()).build();
        c.getStyler().setTheme(new org.knowm.xchart.style.theme.XChartTheme());
        c.getStyler().setLegendPosition(legend == Legend.BOTTOM_RIGHT ? Styler.LegendPosition.InsideSE
                : Styler.LegendPosition.InsideNE);
        c.getStyler().setXAxisLogarithmic(chart.logX());
        c.getStyler().setChartBackgroundColor(Color.WHITE);
        c.getStyler().setPlotGridLinesColor(new Color(0xdd, 0xdd, 0xdd));
        c.getStyler().setAntiAlias(true);
        c.getStyler().setLegendVisible(chart.series().size() > 1);
        int i = 0;
        for (Series s : chart.series()) {
            double[] x = s.x();
            double[] y = s.y();
            if (x.length == 0) {
                continue;
            }
            XYSeries xy = c.addSeries(s.name(), x, y);
            Color color = PALETTE[i++ % PALETTE.length];
            xy.setLineColor(color);
            xy.setMarkerColor(color);
            switch (s.style()) {
                case MARKERS:
                    xy.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
                    xy.setMarker(SeriesMarkers.CIRCLE);
                    break;
                case LINE_AND_MARKERS:
                    xy.setMarker(SeriesMarkers.CIRCLE);
                    break;
                case DASHED:
                    xy.setMarker(SeriesMarkers.NONE);
                    xy.setLineStyle(new BasicStroke(1.2f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f,
                            new float[] {6f, 4f}, 0f));
                    break;
                default:
                    xy.setMarker(SeriesMarkers.NONE);
                    xy.setLineWidth(1.2f);
                    break;
            }
        }
        try {
            return BitmapEncoder.getBitmapBytes(c, BitmapEncoder.BitmapFormat.PNG);
        } catch (IOException e) {
            throw new IllegalStateException("PNG encoding failed", e);
        }
    }

    /** Renders a chart and writes it atomically to {@code file}. */
    public static void write(Path file, Chart chart) {
        AtomicFiles.writeBytes(file, png(chart));
    }

    /** Renders a chart with the legend where asked and writes it atomically to {@code file}. */
    public static void write(Path file, Chart chart, Legend legend) {
        AtomicFiles.writeBytes(file, png(chart, legend));
    }
}
