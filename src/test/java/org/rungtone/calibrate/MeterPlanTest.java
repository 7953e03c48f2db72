package org.rungtone.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;
import org.rungtone.ladder.Spread;
import org.rungtone.ladder.Topology;
import org.rungtone.source.Signal;

/**
 * A meter used to its limit: each reading weighted by its own digits, and the check codes chosen for the
 * meter's ranges. ENOB as in {@link CompensationTest} (IEEE Std 1241-2010).
 */
class MeterPlanTest {
    private static final LadderSpec TEN_BITS = LadderSpec.builder().topology(Topology.WEIGHTED).bits(10)
            .tolerance(0.05).build();

    @Test
    void aMetersCountGivesItsRangesAndSteps() {
        MeterRanges m = new MeterRanges(2000, true);
        assertEquals(1e-4, m.autorangedStepVolts(0.150), 1e-15, "200 mV range");
        assertEquals(1e-3, m.autorangedStepVolts(1.9994), 1e-15, "2 V range shows 1.999");
        assertEquals(1e-2, m.autorangedStepVolts(1.9996), 1e-15, "2.000 is past the 2 V range");
        assertEquals(1e-2, m.autorangedStepVolts(4.9), 1e-15, "20 V range");
        assertEquals(1e-2, new MeterRanges(2000, false).stepVolts(0.1, 4.9), 1e-15, "left on the 20 V range");
        assertEquals(1e-3, new MeterRanges(6000, true).autorangedStepVolts(4.9), 1e-15, "6 V range");
        assertEquals(1e-5, new MeterRanges(20000, true).autorangedStepVolts(0.15), 1e-15, "200 mV range");
        assertEquals(2000, MeterRanges.parse("2k", true).counts());
        assertEquals("{plan.meter_counts} must be the meter's count, a whole number such as 2000 (3½ digits) or 20000"
                + " (4½ digits): 3.5", assertThrows(InputError.class, () -> MeterRanges.parse("3.5", true))
                        .getMessage().replace("plan.meter_counts", "{plan.meter_counts}"));
    }

    @Test
    void aThreeAndAHalfDigitMeterGetsMostChecksOnItsFineRanges() {
        MeasurementPlan plan = new CodeChoice(false, OptionalInt.empty(), Optional.of(new MeterRanges(2000, true)))
                .plan(TEN_BITS.levels());
        assertEquals(2 * 10 + 12, plan.codes().size(), "2·N + 12 readings");
        // half the checks on the 2 V range or below, even 5 % high; the rest where they average the top bits
        long fine = plan.codes().stream().filter(c -> c.role() == PlannedCode.Role.VERIFY)
                .filter(c -> 1.05 * c.expectedVolts() < 1.9995).count();
        assertEquals(10, fine, "checks below 2 V");
    }

    @Test
    void eachReadingIsWeightedByItsOwnDigits() {
        // an ideal 2-bit board of 1 V steps: three readings to 1 mV, the all-ones code to 10 mV and 20 mV off
        List<Reading> readings = List.of(new Reading(0, 0.000, 1e-3, 1), new Reading(1, 1.000, 1e-3, 2),
                new Reading(2, 2.000, 1e-3, 3), new Reading(3, 3.02, 1e-2, 4));
        FitReport weighted = BoardFit.fit(Measurements.of(2, readings, List.of(), "r.csv"),
                BoardFit.Settings.defaults());
        FitReport flat = BoardFit.fit(Measurements.of(2, readings, List.of(), "r.csv"),
                new BoardFit.Settings(1e-3, Double.NaN, Double.NaN));
        // one resolution for the file: the 20 mV error spreads over all four codes, 5 mV each (Σe = 0 by bit)
        assertEquals(0.005, Math.abs(flat.chosen().volts(1) - 1.000), 1e-9);
        // weighted by 100 to 1, the fine readings hold: the error moves onto the coarse one
        assertEquals(1.000, weighted.chosen().volts(1), 0.0002);
        assertEquals(3.02 - 0.02 * 100 / 103, weighted.chosen().volts(3), 0.0005);
    }

    @Test
    void aThreeAndAHalfDigitMeterKeepsEnobNearExactKnowledge() {
        // 1 mV below 2 V and 10 mV above (the goal's meter; rounding only, no noise), 10-bit weighted, 5 %
        MeasurementPlan plan = new CodeChoice(false, OptionalInt.empty(), Optional.of(new MeterRanges(2000, true)))
                .plan(TEN_BITS.levels());
        assertTrue(plan.codes().size() <= 2 * 10 + 12);
        MeasurementPlan spread = MeasurementPlan.of(TEN_BITS.levels());
        Signal sine = CompensationTest.sine(8192, 1021);
        int boards = 61;
        double[] exact = new double[boards];
        double[] before = new double[boards];
        double[] after = new double[boards];
        for (int b = 0; b < boards; b++) {
            SimulatedBoard board = SimulatedBoard.draw(TEN_BITS, Spread.uniform(), 5000 + b);
            double[] truth = board.levels().levels();
            exact[b] = enob(sine, board.levels(), truth);
            // before: the plan's default codes, fitted with one resolution for the whole file
            before[b] = enob(sine, BoardFit.fit(read(spread, truth), new BoardFit.Settings(1e-3, Double.NaN,
                    Double.NaN)).levels(), truth);
            after[b] = enob(sine, BoardFit.fit(read(plan, truth), BoardFit.Settings.defaults()).levels(), truth);
        }
        double e = CompensationTest.median(exact);
        double lossBefore = e - CompensationTest.median(before);
        double loss = e - CompensationTest.median(after);
        System.out.printf(Locale.ROOT, "[calibrate] 10-bit, 3½-digit autoranging meter, %d readings: median ENOB"
                + " exact %.3f, one resolution %.3f (loss %.3f), weighted digits and meter plan %.3f (loss %.3f)%n",
                plan.codes().size(), e, CompensationTest.median(before), lossBefore, CompensationTest.median(after),
                loss);
        assertTrue(loss <= 0.05, "median ENOB loss " + loss + " bit");
    }

    /** Readings of every planned code: 1 mV below 2 V, 10 mV from there, written with those digits. */
    private static Measurements read(MeasurementPlan plan, double[] truth) {
        List<Reading> readings = new ArrayList<>();
        for (PlannedCode c : plan.codes()) {
            double v = truth[c.code()];
            double step = Math.abs(v) < 1.9995 ? 1e-3 : 1e-2;
            readings.add(new Reading(c.code(), Math.rint(v / step) * step, step, 0));
        }
        return Measurements.of(plan.bits(), readings, List.of(), "meter");
    }

    private static double enob(Signal sine, LevelTable table, double[] truth) {
        return CompensationTest.enob(CompensationTest.sinadDb(sine, CompensationTest.nearest(table, sine), truth));
    }
}
