package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.rungtone.ladder.LadderAnalysis;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.MonteCarlo;
import org.rungtone.ladder.Spread;
import org.rungtone.ladder.Topology;

class LadderChartsTest {
    private static final LadderSpec R2R3 = LadderSpec.builder().topology(Topology.R2R).bits(3).build();

    @Test
    void eachKindHasItsFile() {
        LadderAnalysis a = LadderAnalysis.of(R2R3, Double.POSITIVE_INFINITY);
        List<LadderCharts.Figure> plain = LadderCharts.of(a, Optional.empty());
        assertEquals(List.of(LadderCharts.Kind.TRANSFER, LadderCharts.Kind.DNL, LadderCharts.Kind.INL),
                plain.stream().map(LadderCharts.Figure::kind).toList());
        assertEquals("Transfer curve (r2r 3-bit, 5% parts)", plain.get(0).chart().title());
        List<LadderCharts.Figure> all = LadderCharts.of(a,
                Optional.of(new MonteCarlo(4, 1, Spread.uniform()).run(R2R3)));
        assertEquals(LadderCharts.Kind.MONTE_CARLO, all.get(3).kind());
        assertEquals("monte-carlo.png", all.get(3).kind().fileName());
    }

    @Test
    void linearityChartsDrawTheHalfLsbBandAndDnlTheMonotonicLimit() {
        List<LadderCharts.Figure> charts = LadderCharts.of(LadderAnalysis.of(R2R3, Double.POSITIVE_INFINITY),
                Optional.empty());
        Plots.Chart dnl = charts.get(1).chart();
        Plots.Chart inl = charts.get(2).chart();
        // IEEE Std 1658-2011: DNL > -1 LSB at every step <=> monotonic; the +-0.5 LSB band is common practice,
        // no source
        assertEquals(List.of(new Plots.Reference("\u00b10.5 LSB", Plots.Direction.HORIZONTAL, List.of(0.5, -0.5)),
                new Plots.Reference("-1 LSB (monotonic limit)", Plots.Direction.HORIZONTAL, List.of(-1.0))),
                dnl.references());
        assertEquals(List.of(new Plots.Reference("\u00b10.5 LSB", Plots.Direction.HORIZONTAL, List.of(0.5, -0.5))),
                inl.references());
        // the y range holds every reference line with room to spare, on round ticks
        assertEquals(List.of(-1.2, -1.0, -0.8, -0.6, -0.4, -0.2, 0.0, 0.2, 0.4, 0.6), dnl.y().ticks());
        assertEquals(List.of(-0.6, -0.4, -0.2, 0.0, 0.2, 0.4, 0.6), inl.y().ticks());
        // codes 0..7 along x, every code a tick
        assertEquals(List.of(0.0, 1.0, 2.0, 3.0, 4.0, 5.0, 6.0, 7.0), dnl.x().ticks());
        assertEquals(0, dnl.x().min());
        assertEquals(7, dnl.x().max());
        assertEquals("Differential non-linearity of the r2r 3-bit, 5% parts ladder, codes 0\u20137, LSB, with"
                + " \u00b10.5 LSB and the -1 LSB monotonic limit dashed", dnl.description());
    }

    @Test
    void monteCarloShowsTheShareOfBoardsFromNoneToAll() {
        Plots.Chart mc = LadderCharts.of(LadderAnalysis.of(R2R3, Double.POSITIVE_INFINITY),
                Optional.of(new MonteCarlo(200, 1, Spread.uniform()).run(R2R3))).get(3).chart();
        assertEquals(List.of(0.0, 20.0, 40.0, 60.0, 80.0, 100.0), mc.y().ticks());
        assertEquals(0, mc.x().min());
        assertEquals(List.of(Plots.Reference.vertical("0.5 LSB", 0.5)), mc.references());
    }

    @Test
    void longSeriesKeepEachRunsExtremes() {
        double[] y = new double[4096];
        y[1001] = 7;
        y[1002] = -3;
        Plots.Series s = LadderCharts.envelope("DNL", y, Plots.Style.LINE);
        // 1024 runs of 4 codes: one point for a flat run, two where the run has a spike
        assertEquals(1024 + 1, s.x().length);
        assertEquals(1001, s.x()[250]);
        assertEquals(7, s.y()[250]);
        assertEquals(1002, s.x()[251]);
        assertEquals(-3, s.y()[251]);
        assertTrue(LadderCharts.envelope("DNL", new double[] {1, 2}, Plots.Style.LINE).x().length == 2);
    }
}
