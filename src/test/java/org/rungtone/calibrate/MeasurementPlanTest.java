package org.rungtone.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.List;
import java.util.stream.IntStream;
import org.junit.jupiter.api.Test;
import org.rungtone.ladder.LevelTable;

/** Which codes a plan measures, and the meter advice that goes with it. */
class MeasurementPlanTest {
    @Test
    void measuresEveryCodeUpToSixBits() {
        MeasurementPlan p = MeasurementPlan.of(LevelTable.ideal(6, 5.0));
        assertTrue(p.everyCode());
        assertEquals(IntStream.range(0, 64).boxed().toList(), Arrays.stream(p.codeArray()).boxed().toList());
        assertEquals("bit 3 alone", p.codes().get(8).describe());
        assertEquals("all bits high", p.codes().get(63).describe());
    }

    @Test
    void aboveSixBitsMeasuresTheBasisThenSpreadChecks() {
        MeasurementPlan p = MeasurementPlan.of(LevelTable.ideal(12, 5.0));
        int[] c = p.codeArray();
        assertEquals(2 + 12 + 24, c.length);
        assertEquals(List.of(0, 4095, 1, 2, 4, 8, 16, 32, 64, 128, 256, 512, 1024, 2048),
                Arrays.stream(c, 0, 14).boxed().toList());
        int[] checks = Arrays.copyOfRange(c, 14, c.length);
        assertEquals(24, Arrays.stream(checks).distinct().count());
        for (int i = 1; i < checks.length; i++) {
            assertTrue(checks[i] > checks[i - 1], "ascending");
        }
        // spread: every eighth of the range holds at least one check code
        for (int part = 0; part < 8; part++) {
            int lo = part * 512;
            assertTrue(Arrays.stream(checks).anyMatch(k -> k >= lo && k < lo + 512), "eighth " + part);
        }
        // varied bit patterns: every bit is high in at least a quarter of the check codes
        for (int bit = 0; bit < 12; bit++) {
            int b = bit;
            long high = Arrays.stream(checks).filter(k -> (k >> b & 1) != 0).count();
            assertTrue(high >= 6, "bit " + bit + " high in " + high + " checks");
        }
        assertEquals(p.expected().volts(4095), p.codes().get(1).expectedVolts());
    }

    @Test
    void verifyCountIsHonouredAndTooManyMeansEveryCode() {
        assertEquals(2 + 8 + 5, MeasurementPlan.of(LevelTable.ideal(8, 5.0), 5).codeArray().length);
        assertEquals(2 + 4, MeasurementPlan.of(LevelTable.ideal(4, 5.0), 0).codeArray().length);
        assertTrue(MeasurementPlan.of(LevelTable.ideal(4, 5.0), 10).everyCode());
    }

    @Test
    void csvTemplateListsEveryPlannedCodeWithAnEmptyReading() {
        String csv = MeasurementPlan.of(LevelTable.ideal(2, 4.0)).csv();
        assertTrue(csv.endsWith("code,binary,expected_volts,measured\n0,00,0.0000,\n1,01,1.0000,\n2,10,2.0000,\n"
                + "3,11,3.0000,\n"), csv);
        assertEquals(4, MeasurementCsv.parse(csv, "plan.csv", 0).unmeasured().size(), "reads back as unmeasured");
    }

    @Test
    void meterAdvicePicksTheSmallestRangeWithHeadroom() {
        List<MeterAdvice> a = MeterAdvice.forLevels(4.92, 4.92 / 1023);
        // 2000 counts: 2 V is too small for 4.92 V, so 20 V in 10 mV steps; 6000 counts: 6 V in 1 mV steps
        assertEquals(20, a.get(0).rangeVolts(), 1e-9);
        assertEquals(0.01, a.get(0).stepVolts(), 1e-12);
        assertEquals(6, a.get(1).rangeVolts(), 1e-9);
        assertEquals(0.001, a.get(1).stepVolts(), 1e-12);
        // a quarter LSB or finer: 10 mV is 0.49 LSB (too coarse), 1 mV is 0.2 LSB
        assertTrue(!a.get(0).fineEnough() && a.get(1).fineEnough() && a.get(3).fineEnough());
        assertEquals(0.6, MeterAdvice.forLevels(0.55, 0.01).get(1).rangeVolts(), 1e-9, "600 mV range");
    }
}
