package org.rungtone.report;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.geom.Line2D;
import java.awt.image.BufferedImage;
import java.util.Map;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.XYStyler;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * Draws a {@link Plots.Chart} with XChart. XChart draws the frame, titles, data and legend over exactly the
 * chart's axis ranges; the grid, the tick marks and the tick labels are drawn here at the chart's own
 * {@link PlotAxis#ticks()}, so the image shows the ticks the model lists. XChart's own tick labels are laid
 * out (they reserve the room) but drawn transparent.
 */
final class ChartRenderer {
    static final int WIDTH = 800;
    static final int HEIGHT = 480;
    private static final Color[] PALETTE = {
        new Color(0x1f, 0x5f, 0x99), new Color(0x27, 0x8f, 0x4e), new Color(0x8e, 0x44, 0xad),
        new Color(0x2c, 0x3e, 0x50), new Color(0x16, 0xa0, 0x85), new Color(0x7f, 0x55, 0x39)};
    /** Reference lines: orange, then red and dark grey, apart from the data's colours and seen over them. */
    private static final Color[] REFERENCE_PALETTE = {
        new Color(0xd3, 0x54, 0x00), new Color(0xc0, 0x39, 0x2b), new Color(0x44, 0x44, 0x44)};
    private static final Color CLEAR = new Color(0, 0, 0, 0);
    private static final Color GRID = new Color(0xdd, 0xdd, 0xdd);
    private static final Color TICK_TEXT = new Color(0x22, 0x22, 0x22);
    private static final int TICK_PX = 4;
    private static final BasicStroke DASH = new BasicStroke(1.5f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER,
            10f, new float[] {6f, 4f}, 0f);
    private static final Map<LegendPlace, Styler.LegendPosition> POSITIONS = Map.of(
            LegendPlace.NONE, Styler.LegendPosition.InsideNE,
            LegendPlace.TOP_RIGHT, Styler.LegendPosition.InsideNE,
            LegendPlace.TOP_LEFT, Styler.LegendPosition.InsideNW,
            LegendPlace.BOTTOM_RIGHT, Styler.LegendPosition.InsideSE,
            LegendPlace.BOTTOM_LEFT, Styler.LegendPosition.InsideSW,
            LegendPlace.BELOW, Styler.LegendPosition.OutsideS);

    private ChartRenderer() {
    }

    /** The chart drawn at 800 × 480, RGB. */
    static BufferedImage image(Plots.Chart chart) {
        XYChart c = xchart(chart);
        // XChart paints on a transparent layer; painting lays the chart out, so that data values map to
        // pixels for the grid, which goes under the layer
        BufferedImage layer = new BufferedImage(WIDTH, HEIGHT, BufferedImage.TYPE_INT_ARGB);
        Graphics2D gl = layer.createGraphics();
        c.paint(gl, WIDTH, HEIGHT);
        gl.dispose();
        BufferedImage image = new BufferedImage(WIDTH, HEIGHT, BufferedImage.TYPE_INT_RGB);
        Graphics2D g = image.createGraphics();
        g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
        g.setRenderingHint(RenderingHints.KEY_TEXT_ANTIALIASING, RenderingHints.VALUE_TEXT_ANTIALIAS_ON);
        g.setColor(Color.WHITE);
        g.fillRect(0, 0, WIDTH, HEIGHT);
        Frame f = new Frame(c, chart);
        drawGrid(g, f, chart);
        g.drawImage(layer, 0, 0, null);
        drawTicks(g, f, chart, c.getStyler().getAxisTickLabelsFont());
        g.dispose();
        return image;
    }

    /**
     * The axis's labels, each value formatted once: XChart labels evenly spaced data (a spectrum's bins) by
     * trying every n-th value for n = 1, 2, ... until the labels fit, which formats each value many times.
     */
    private static java.util.function.Function<Double, String> remembered(PlotAxis axis) {
        java.util.Map<Double, String> labels = new java.util.HashMap<>();
        return value -> labels.computeIfAbsent(value, axis::format);
    }

    private static XYChart xchart(Plots.Chart chart) {
        XYChart c = new XYChartBuilder().width(WIDTH).height(HEIGHT).title(chart.title())
                .xAxisTitle(chart.x().label()).yAxisTitle(chart.y().label()).build();
        XYStyler st = c.getStyler();
        st.setTheme(new org.knowm.xchart.style.theme.XChartTheme());
        LegendPlace legend = chart.legend();
        st.setLegendVisible(legend != LegendPlace.NONE);
        st.setLegendPosition(POSITIONS.get(legend));
        st.setLegendLayout(legend == LegendPlace.BELOW ? Styler.LegendLayout.Horizontal
                : Styler.LegendLayout.Vertical);
        st.setChartBackgroundColor(CLEAR);
        st.setPlotBackgroundColor(CLEAR);
        st.setPlotGridLinesVisible(false);
        st.setPlotTicksMarksVisible(false);
        st.setAxisTicksMarksVisible(false);
        st.setAxisTickLabelsColor(CLEAR);
        st.setXAxisTickLabelsColor(CLEAR);
        st.setYAxisTickLabelsColor(CLEAR);
        st.setPlotContentSize(1.0);
        st.setXAxisMin(chart.x().min());
        st.setXAxisMax(chart.x().max());
        st.setYAxisMin(chart.y().min());
        st.setYAxisMax(chart.y().max());
        // XChart's (invisible) labels take the room ours need
        st.setxAxisTickLabelsFormattingFunction(remembered(chart.x()));
        st.setyAxisTickLabelsFormattingFunction(remembered(chart.y()));
        st.setAntiAlias(true);
        int i = 0;
        for (Plots.Series s : chart.series()) {
            Color color = PALETTE[i++ % PALETTE.length];
            if (s.x().length > 0) {
                style(c.addSeries(s.name(), s.x(), s.y()), s.style(), color);
            }
        }
        int r = 0;
        for (Plots.Reference ref : chart.references()) {
            addReference(c, chart, ref, REFERENCE_PALETTE[r++ % REFERENCE_PALETTE.length]);
        }
        return c;
    }

    private static void style(XYSeries xy, Plots.Style style, Color color) {
        xy.setLineColor(color);
        xy.setMarkerColor(color);
        switch (style) {
            case MARKERS:
                xy.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Scatter);
                xy.setMarker(SeriesMarkers.CIRCLE);
                break;
            case LINE_AND_MARKERS:
                xy.setMarker(SeriesMarkers.CIRCLE);
                break;
            case DASHED:
                xy.setMarker(SeriesMarkers.NONE);
                xy.setLineStyle(DASH);
                break;
            default:
                xy.setMarker(SeriesMarkers.NONE);
                xy.setLineWidth(1.2f);
                break;
        }
    }

    /** Each line of a reference as a dashed two-point series; only the first has a legend entry. */
    private static void addReference(XYChart c, Plots.Chart chart, Plots.Reference ref, Color color) {
        for (int k = 0; k < ref.values().size(); k++) {
            double v = ref.values().get(k);
            boolean across = ref.direction() == Plots.Direction.HORIZONTAL;
            double[] xs = across ? new double[] {chart.x().min(), chart.x().max()} : new double[] {v, v};
            double[] ys = across ? new double[] {v, v} : new double[] {chart.y().min(), chart.y().max()};
            XYSeries xy = c.addSeries(k == 0 ? ref.label() : ref.label() + " #" + (k + 1), xs, ys);
            style(xy, Plots.Style.DASHED, color);
            xy.setShowInLegend(k == 0);
        }
    }

    /** The plot's pixel frame after layout: where the axis ends fall. */
    private record Frame(double left, double right, double top, double bottom, XYChart c) {
        Frame(XYChart c, Plots.Chart chart) {
            this(c.getScreenXFromChart(chart.x().min()), c.getScreenXFromChart(chart.x().max()),
                    c.getScreenYFromChart(chart.y().max()), c.getScreenYFromChart(chart.y().min()), c);
        }

        double x(double v) {
            return c.getScreenXFromChart(v);
        }

        double y(double v) {
            return c.getScreenYFromChart(v);
        }
    }

    private static void drawGrid(Graphics2D g, Frame f, Plots.Chart chart) {
        g.setColor(GRID);
        g.setStroke(new BasicStroke(1f));
        for (double t : chart.x().ticks()) {
            g.draw(new Line2D.Double(f.x(t), f.top(), f.x(t), f.bottom()));
        }
        for (double t : chart.y().ticks()) {
            g.draw(new Line2D.Double(f.left(), f.y(t), f.right(), f.y(t)));
        }
    }

    private static void drawTicks(Graphics2D g, Frame f, Plots.Chart chart, Font font) {
        g.setFont(font);
        g.setStroke(new BasicStroke(1f));
        FontMetrics m = g.getFontMetrics();
        for (double t : chart.x().ticks()) {
            double px = f.x(t);
            g.setColor(Color.GRAY);
            g.draw(new Line2D.Double(px, f.bottom(), px, f.bottom() + TICK_PX));
            String label = chart.x().format(t);
            g.setColor(TICK_TEXT);
            // a label at the right end of the axis stays on the image
            double left = Math.min(px - m.stringWidth(label) / 2.0, WIDTH - 2 - m.stringWidth(label));
            g.drawString(label, (float) left,
                    (float) (f.bottom() + TICK_PX + 2 + m.getAscent()));
        }
        for (double t : chart.y().ticks()) {
            double py = f.y(t);
            g.setColor(Color.GRAY);
            g.draw(new Line2D.Double(f.left() - TICK_PX, py, f.left(), py));
            String label = chart.y().format(t);
            g.setColor(TICK_TEXT);
            g.drawString(label, (float) (f.left() - TICK_PX - 2 - m.stringWidth(label)),
                    (float) (py + (m.getAscent() - m.getDescent()) / 2.0));
        }
    }
}
