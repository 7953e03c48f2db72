package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class PlotAxisTest {
    @Test
    void roundsARangeOutToWholeSteps() {
        PlotAxis a = PlotAxis.rounded("level (dBFS)", -93.2, -0.9);
        assertEquals(-100, a.min());
        assertEquals(0, a.max());
        assertEquals(10, a.step());
        assertEquals(List.of(-100.0, -90.0, -80.0, -70.0, -60.0, -50.0, -40.0, -30.0, -20.0, -10.0, 0.0), a.ticks());
    }

    @Test
    void keepsAnExactRangeAndTicksInsideIt() {
        // a frequency axis ends at the Nyquist rate: 22.05 kHz, ticks every 5 kHz
        PlotAxis nyquist = PlotAxis.exact("frequency (kHz)", 0, 22.05);
        assertEquals(22.05, nyquist.max());
        assertEquals(List.of(0.0, 5.0, 10.0, 15.0, 20.0), nyquist.ticks());
        assertEquals(List.of(0.0, 1.0, 2.0, 3.0, 4.0, 5.0, 6.0, 7.0, 8.0), PlotAxis.exact("f", 0, 8).ticks());
        assertEquals(List.of(4.0, 5.0, 6.0, 7.0, 8.0, 9.0, 10.0), PlotAxis.exact("bits", 3.5, 10.5).ticks());
        assertEquals(List.of(0.0, 10.0, 20.0, 30.0, 40.0, 50.0, 60.0), PlotAxis.exact("code", 0, 63).ticks());
        assertEquals(List.of(0.0, 50.0, 100.0, 150.0, 200.0, 250.0), PlotAxis.exact("code", 0, 255).ticks());
        // whole numbers only where a half makes no sense: bits 4..8, codes 0..3
        assertEquals(0.5, PlotAxis.exact("bits", 3.5, 8.5).step());
        assertEquals(List.of(4.0, 5.0, 6.0, 7.0, 8.0), PlotAxis.integers("bits", 3.5, 8.5).ticks());
        assertEquals(List.of(0.0, 1.0, 2.0, 3.0), PlotAxis.integers("code", 0, 3).ticks());
    }

    @Test
    void ticksAreExactDecimals() {
        PlotAxis a = PlotAxis.rounded("DNL (LSB)", -1.06, 0.56);
        assertEquals(0.2, a.step());
        assertEquals(List.of(-1.2, -1.0, -0.8, -0.6, -0.4, -0.2, 0.0, 0.2, 0.4, 0.6), a.ticks());
        assertEquals(List.of("-1.2", "-1.0", "-0.8", "-0.6", "-0.4", "-0.2", "0.0", "0.2", "0.4", "0.6"),
                a.ticks().stream().map(a::format).toList());
        // 3 × 0.1 is 0.3, not 0.30000000000000004
        assertEquals(List.of(0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9), new PlotAxis("x", 0.25, 0.95, 0.1).ticks());
    }

    @Test
    void everyStepIsOneTwoOrFiveTimesAPowerOfTen() {
        SplittableRandom random = new SplittableRandom(7);
        for (int i = 0; i < 2000; i++) {
            double low = (random.nextDouble() - 0.5) * Math.pow(10, random.nextInt(-3, 7));
            double high = low + random.nextDouble() * Math.pow(10, random.nextInt(-3, 7)) + 1e-9;
            for (PlotAxis a : List.of(PlotAxis.rounded("y", low, high), PlotAxis.exact("x", low, high))) {
                String digits = BigDecimal.valueOf(a.step()).stripTrailingZeros().unscaledValue().toString();
                assertTrue(List.of("1", "2", "5").contains(digits), a.toString());
                List<Double> ticks = a.ticks();
                assertTrue(ticks.size() >= 2 && ticks.size() <= PlotAxis.MAX_INTERVALS + 1, a + " " + ticks);
                assertTrue(a.min() <= low && a.max() >= high, a.toString());
                for (double t : ticks) {
                    double k = t / a.step();
                    assertEquals(Math.rint(k), k, 1e-6 * Math.max(1, Math.abs(k)), a + " tick " + t);
                    assertTrue(a.contains(t), a + " tick " + t);
                }
            }
        }
    }

    @Test
    void groupsThousandsOnAxesThatReachTenThousand() {
        PlotAxis flash = PlotAxis.rounded("flash (bytes)", 0, 33_000);
        assertEquals(List.of("0", "5,000", "10,000", "15,000", "20,000", "25,000", "30,000", "35,000"),
                flash.ticks().stream().map(flash::format).toList());
        PlotAxis small = PlotAxis.rounded("flash (bytes)", 0, 9_000);
        assertEquals("9000", small.format(9000));
        assertEquals("0", PlotAxis.rounded("y", -3, 3).format(-0.0));
    }

    @Test
    void refusesAStepThatIsNotRound() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> new PlotAxis("y", 0, 1, 0.25));
        assertEquals("axis y: step must be 1, 2 or 5 times a power of ten: 0.25", e.getMessage());
    }

    @Test
    void spansGrowToHoldWhatTheyMust() {
        PlotAxis.Span s = new PlotAxis.Span(-1, 2).padded(0.1);
        assertEquals(-1.3, s.low(), 1e-12);
        assertEquals(2.3, s.high(), 1e-12);
        // volts from 0 V: the bottom stays at 0
        PlotAxis.Span volts = new PlotAxis.Span(0, 5).padded(0.04);
        assertEquals(0, volts.low());
        assertEquals(5.2, volts.high(), 1e-12);
        assertEquals(new PlotAxis.Span(-5, 2), new PlotAxis.Span(-1, 2).including(-5));
        assertEquals(new PlotAxis.Span(-1, 7), new PlotAxis.Span(-1, 2).union(new PlotAxis.Span(0, 7)));
    }
}
