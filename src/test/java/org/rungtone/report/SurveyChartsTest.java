package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.rungtone.analysis.Survey;
import org.rungtone.analysis.SurveyResult;
import org.rungtone.analysis.SurveyRow;
import org.rungtone.analysis.SurveySpec;
import org.rungtone.analysis.SurveyTarget;
import org.rungtone.source.Signal;

class SurveyChartsTest {
    private static Signal sine(double rate, int n) {
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = 0.9 * Math.sin(2 * Math.PI * 1001.3 * i / rate);
        }
        return Signal.wrap(x, rate);
    }

    private static SurveyResult survey(SurveyTarget target, Long budget, boolean packed) {
        SurveySpec.Builder b = SurveySpec.builder().bitDepths(List.of(4, 6, 8)).ratesHz(List.of(8000.0, 16000.0))
                .target(target).packed(packed);
        if (budget != null) {
            b.flashBudgetBytes(budget);
        }
        return Survey.run(b.build(), rate -> sine(rate, (int) (rate / 4)));
    }

    @Test
    void againstBitDepthOneLinePerRateWithTheSinadTarget() {
        SurveyResult result = survey(SurveyTarget.sinadDb(30), null, false);
        Plots.Chart c = SurveyCharts.againstBits(result);
        assertEquals(List.of("8 kHz", "16 kHz", "chosen: 6 bits at 8 kHz", "target 30 dB"), c.legendEntries());
        assertEquals(List.of(Plots.Reference.horizontal("target 30 dB", 30)), c.references());
        assertArrayEquals(new double[] {4, 6, 8}, c.series().get(0).x());
        SurveyRow first = result.rowsAtRate(8000).get(0);
        assertEquals(first.sinadDb(), c.series().get(0).y()[0]);
        assertEquals(List.of(4.0, 5.0, 6.0, 7.0, 8.0), c.x().ticks());
        assertEquals("SINAD (dB)", c.y().label());
        assertTrue(c.y().contains(30));
    }

    @Test
    void anEnobTargetPlotsEnob() {
        SurveyResult result = survey(SurveyTarget.enobBits(5), null, false);
        Plots.Chart c = SurveyCharts.againstBits(result);
        assertEquals("ENOB (re full scale, bits)", c.y().label());
        assertEquals(List.of(Plots.Reference.horizontal("target 5 bits", 5)), c.references());
        assertEquals(result.rowsAtRate(16000).get(2).enobFullScaleBits(), c.series().get(1).y()[2]);
        assertEquals(SurveyCharts.Figure.ENOB, SurveyCharts.Figure.of(result));
        assertEquals(SurveyCharts.Figure.SINAD, SurveyCharts.Figure.of(survey(null, null, false)));
    }

    @Test
    void againstFlashBytesWithTheBudgetAndTheChosenCell() {
        SurveyResult result = survey(SurveyTarget.sinadDb(30), 3000L, true);
        Plots.Chart c = SurveyCharts.againstFlash(result);
        assertEquals("flash (bytes, bit-packed)", c.x().label());
        assertEquals(0, c.x().min());
        // 16 kHz, 8 bits, 4000 samples bit-packed: 4000 bytes is the most any cell needs
        assertTrue(c.x().max() >= 4000, c.x().toString());
        assertArrayEquals(new double[] {1000, 1500, 2000}, c.series().get(0).x());
        assertEquals(List.of(Plots.Reference.vertical("flash budget 3,000 bytes", 3000),
                Plots.Reference.horizontal("target 30 dB", 30)), c.references());
        SurveyRow chosen = result.chosen().orElseThrow();
        Plots.Series mark = c.series().get(2);
        assertArrayEquals(new double[] {chosen.flashBytesPacked()}, mark.x());
        assertArrayEquals(new double[] {chosen.sinadDb()}, mark.y());
        assertTrue(c.description().contains("the flash budget and the chosen setting marked"), c.description());
        for (double t : c.x().ticks()) {
            assertEquals(0, t % c.x().step(), 1e-9);
        }
    }
}
