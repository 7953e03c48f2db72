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
    void eachKindHasItsFileAndLegend() {
        LadderAnalysis a = LadderAnalysis.of(R2R3, Double.POSITIVE_INFINITY);
        List<LadderCharts.Figure> plain = LadderCharts.of(a, Optional.empty());
        assertEquals(List.of(LadderCharts.Kind.TRANSFER, LadderCharts.Kind.DNL, LadderCharts.Kind.INL),
                plain.stream().map(LadderCharts.Figure::kind).toList());
        assertEquals("Transfer curve (r2r 3-bit, 5% parts)", plain.get(0).chart().title());
        assertEquals(Plots.Legend.BOTTOM_RIGHT, LadderCharts.Kind.TRANSFER.legend());
        assertEquals(Plots.Legend.TOP_RIGHT, LadderCharts.Kind.INL.legend());
        List<LadderCharts.Figure> all = LadderCharts.of(a,
                Optional.of(new MonteCarlo(4, 1, Spread.uniform()).run(R2R3)));
        assertEquals(LadderCharts.Kind.MONTE_CARLO, all.get(3).kind());
        assertEquals("monte-carlo.png", all.get(3).kind().fileName());
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
