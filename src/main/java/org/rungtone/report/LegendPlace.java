package org.rungtone.report;

import java.awt.Font;
import java.awt.font.FontRenderContext;
import java.awt.geom.Rectangle2D;
import java.util.List;

/**
 * Where a chart's legend goes: in a corner of the plot that no data line, marker or reference line passes
 * through, or below the plot when every corner is taken; never over the data.
 *
 * <p>The legend's size is measured with the font it is drawn in and compared with the plot area in
 * pixels; the plot area is taken a little smaller than it is drawn, and the legend a little larger, so a
 * corner found empty here is empty on the image.
 */
public enum LegendPlace {
    /** No legend: one thing on the chart, named by its title. */
    NONE,
    /** Top right inside the plot. */
    TOP_RIGHT,
    /** Top left inside the plot. */
    TOP_LEFT,
    /** Bottom right inside the plot. */
    BOTTOM_RIGHT,
    /** Bottom left inside the plot. */
    BOTTOM_LEFT,
    /** Below the plot, in one row. */
    BELOW;

    /** Plot area of an 800 × 480 chart, pixels, rounded down from what the renderer leaves for it. */
    static final double PLOT_WIDTH_PX = 680;
    static final double PLOT_HEIGHT_PX = 340;
    /** Legend geometry as the renderer draws it: padding, the sample line, one line of 11-point text. */
    private static final double PADDING_PX = 10;
    private static final double LINE_SAMPLE_PX = 24;
    private static final double ROW_PX = 14;
    /** Space kept between the legend and any data, pixels. */
    private static final double CLEARANCE_PX = 8;
    private static final Font FONT = new Font(Font.SANS_SERIF, Font.PLAIN, 11);
    private static final FontRenderContext CONTEXT = new FontRenderContext(null, true, true);

    /** The first corner the data leave empty (top right, top left, bottom right, bottom left), else below. */
    static LegendPlace choose(Plots.Chart chart) {
        List<String> entries = chart.legendEntries();
        if (entries.size() <= 1) {
            return NONE;
        }
        double widest = 0;
        for (String e : entries) {
            widest = Math.max(widest, FONT.getStringBounds(e, CONTEXT).getWidth());
        }
        double w = (3 * PADDING_PX + LINE_SAMPLE_PX + widest + CLEARANCE_PX) / PLOT_WIDTH_PX;
        double h = (PADDING_PX + entries.size() * (ROW_PX + PADDING_PX) + CLEARANCE_PX) / PLOT_HEIGHT_PX;
        for (LegendPlace p : List.of(TOP_RIGHT, TOP_LEFT, BOTTOM_RIGHT, BOTTOM_LEFT)) {
            if (!occupied(chart, p.box(w, h))) {
                return p;
            }
        }
        return BELOW;
    }

    /** This corner's box of {@code w × h} in plot fractions (0..1 across, 0..1 up). */
    Rectangle2D box(double w, double h) {
        boolean right = this == TOP_RIGHT || this == BOTTOM_RIGHT;
        boolean top = this == TOP_RIGHT || this == TOP_LEFT;
        return new Rectangle2D.Double(right ? 1 - w : 0, top ? 1 - h : 0, w, h);
    }

    /** True when a series or a reference line of the chart enters {@code box} (plot fractions). */
    static boolean occupied(Plots.Chart chart, Rectangle2D box) {
        PlotAxis xa = chart.x();
        PlotAxis ya = chart.y();
        for (Plots.Series s : chart.series()) {
            boolean lines = s.style() != Plots.Style.MARKERS;
            double px = Double.NaN;
            double py = Double.NaN;
            for (int i = 0; i < s.x().length; i++) {
                double u = fraction(s.x()[i], xa);
                double v = fraction(s.y()[i], ya);
                if (Double.isNaN(u) || Double.isNaN(v)) {
                    px = Double.NaN;
                    continue;
                }
                if (box.contains(u, v) || lines && !Double.isNaN(px) && box.intersectsLine(px, py, u, v)) {
                    return true;
                }
                px = u;
                py = v;
            }
        }
        for (Plots.Reference r : chart.references()) {
            for (double value : r.values()) {
                boolean across = r.direction() == Plots.Direction.HORIZONTAL;
                double f = across ? fraction(value, ya) : fraction(value, xa);
                double low = across ? box.getMinY() : box.getMinX();
                double high = across ? box.getMaxY() : box.getMaxX();
                if (f >= low && f <= high) {
                    return true;
                }
            }
        }
        return false;
    }

    /** Where {@code v} sits on the axis, 0 at its minimum and 1 at its maximum; NaN when not finite. */
    private static double fraction(double v, PlotAxis a) {
        return Double.isFinite(v) ? (v - a.min()) / (a.max() - a.min()) : Double.NaN;
    }
}
