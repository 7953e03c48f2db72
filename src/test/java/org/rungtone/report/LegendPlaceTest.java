package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.geom.Rectangle2D;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.rungtone.ladder.LadderAnalysis;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.Topology;

class LegendPlaceTest {
    private static Plots.Series line(String name, double[] x, double[] y) {
        return new Plots.Series(name, x, y, Plots.Style.LINE);
    }

    private static Plots.Chart chart(List<Plots.Series> series, List<Plots.Reference> refs) {
        return new Plots.Chart("t", new PlotAxis("x", 0, 10, 1), new PlotAxis("y", 0, 10, 1), series, refs, "t");
    }

    @Test
    void aRisingLineLeavesTheTopLeftCornerFree() {
        Plots.Chart c = chart(List.of(line("rising", new double[] {0, 10}, new double[] {0, 10}),
                line("ideal", new double[] {0, 10}, new double[] {0.5, 10})), List.of());
        assertEquals(LegendPlace.TOP_LEFT, c.legend());
    }

    @Test
    void aReferenceLineAcrossTheTopTakesBothTopCorners() {
        Plots.Chart c = chart(List.of(line("low", new double[] {0, 10}, new double[] {5, 5})),
                List.of(Plots.Reference.horizontal("limit", 9.5)));
        assertEquals(LegendPlace.BOTTOM_RIGHT, c.legend());
    }

    @Test
    void goesBelowThePlotWhenEveryCornerHasData() {
        Plots.Chart c = chart(List.of(line("zigzag", new double[] {0, 1, 9, 10}, new double[] {0, 10, 0, 10}),
                line("flat", new double[] {0, 10}, new double[] {0.2, 0.2})), List.of());
        assertEquals(LegendPlace.BELOW, c.legend());
        assertEquals(LegendPlace.NONE, chart(List.of(line("alone", new double[] {0, 10},
                new double[] {0, 10})), List.of()).legend());
    }

    @Test
    void seesALineCrossingACornerBetweenTwoPointsOutsideIt() {
        Plots.Chart c = chart(List.of(line("diagonal", new double[] {5, 10}, new double[] {10, 5})), List.of());
        Rectangle2D topRight = LegendPlace.TOP_RIGHT.box(0.3, 0.3);
        assertTrue(LegendPlace.occupied(c, topRight));
        Plots.Chart dots = chart(List.of(new Plots.Series("dots", new double[] {5, 10}, new double[] {10, 5},
                Plots.Style.MARKERS)), List.of());
        assertFalse(LegendPlace.occupied(dots, topRight));
    }

    @Test
    void theLadderChartsPutTheirLegendsClearOfTheData() {
        // a 4-bit weighted ladder of E12/E24 parts: the transfer rises, DNL and INL fill the width
        LadderAnalysis a = LadderAnalysis.of(LadderSpec.builder().topology(Topology.WEIGHTED).bits(4)
                .resistors(68e3, 33e3, 15e3, 8.2e3).build(), Double.POSITIVE_INFINITY);
        List<LegendPlace> places = LadderCharts.of(a, Optional.empty()).stream()
                .map(f -> f.chart().legend()).toList();
        assertEquals(List.of(LegendPlace.TOP_LEFT, LegendPlace.BELOW, LegendPlace.BELOW), places);
    }
}
