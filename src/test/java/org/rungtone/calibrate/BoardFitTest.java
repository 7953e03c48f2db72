package org.rungtone.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.junit.jupiter.api.Test;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.Ladder;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.Topology;

/**
 * The fit against synthetic boards whose levels are known exactly: a weighted and an R-2R ladder with chosen
 * resistor mismatches, solved by the ladder package's exact solver and "measured" at the plan's codes.
 */
class BoardFitTest {
    /** A 10-bit weighted ladder with equal pin resistances (superposition holds exactly) and chosen mismatches. */
    static Ladder weightedBoard(double pinHigh, double pinLow) {
        LadderSpec spec = LadderSpec.builder().topology(Topology.WEIGHTED).bits(10).baseROhms(10e3)
                .pinROhmsHigh(pinHigh).pinROhmsLow(pinLow).tolerance(0.05).build();
        double[] ohms = spec.ohms();
        double[] mismatch = {0.031, -0.042, 0.018, -0.007, 0.049, -0.033, 0.012, -0.026, 0.041, -0.045};
        for (int i = 0; i < ohms.length; i++) {
            ohms[i] *= 1 + mismatch[i];
        }
        return Ladder.of(spec, ohms);
    }

    private static Measurements exact(Ladder board, MeasurementPlan plan) {
        List<Reading> r = new ArrayList<>();
        double[] v = board.levels().levels();
        for (int c : plan.codeArray()) {
            r.add(new Reading(c, v[c], 0, 0));
        }
        return Measurements.of(board.spec().bits(), r, List.of(), "synthetic");
    }

    private static MeasurementPlan plan(Ladder board) {
        return MeasurementPlan.of(board.spec().levels());
    }

    @Test
    void recoversExactWeightsWithoutNoise() {
        Ladder board = weightedBoard(20, 20);
        double[] truth = board.levels().levels();
        FitReport fit = BoardFit.fit(exact(board, plan(board)), BoardFit.Settings.defaults());
        assertEquals("superposition", fit.chosen().key(), fit.reason());
        for (int bit = 0; bit < 10; bit++) {
            double w = truth[1 << bit] - truth[0];
            assertEquals(w, fit.chosen().stepVolts(bit), 1e-12, "bit " + bit);
        }
        for (int k = 0; k < truth.length; k++) {
            assertEquals(truth[k], fit.levels().volts(k), 1e-12, "code " + k);
        }
        assertTrue(fit.outlierCodes().isEmpty());
    }

    @Test
    void recoversWeightsWithinThreeSigmaOfGaussianNoise() {
        Ladder board = weightedBoard(20, 20);
        double[] truth = board.levels().levels();
        MeasurementPlan plan = plan(board);
        double sigma = 0.5e-3;
        SimulatedBoard sim = SimulatedBoardTest.wrap(board);
        Measurements m = sim.measure(plan, new SimulatedBoard.Meter(sigma, 0, 1), 11);
        FitReport fit = BoardFit.fit(m, BoardFit.Settings.defaults());
        assertEquals("superposition", fit.chosen().key(), fit.reason());
        // Var(θ) = σ²·(XᵀX)⁻¹ for the design X of the plan's codes (ordinary least squares).
        RealMatrix cov = covariance(plan.codeArray(), 10);
        for (int bit = 0; bit < 10; bit++) {
            double w = truth[1 << bit] - truth[0];
            double sd = sigma * Math.sqrt(cov.getEntry(bit + 1, bit + 1));
            double err = fit.chosen().stepVolts(bit) - w;
            assertTrue(Math.abs(err) < 3 * sd, "bit " + bit + ": error " + err + " beyond 3 sigma " + 3 * sd);
        }
    }

    static RealMatrix covariance(int[] codes, int bits) {
        double[][] x = new double[codes.length][bits + 1];
        for (int r = 0; r < codes.length; r++) {
            x[r][0] = 1;
            for (int i = 0; i < bits; i++) {
                x[r][i + 1] = codes[r] >> i & 1;
            }
        }
        RealMatrix m = new Array2DRowRealMatrix(x);
        return new LUDecomposition(m.transpose().multiply(m)).getSolver().getInverse();
    }

    @Test
    void choosesSwitchedLoadWhenPinsDifferAndFitsItExactly() {
        LadderSpec spec = LadderSpec.builder().topology(Topology.WEIGHTED).bits(8).baseROhms(1e3)
                .pinROhmsHigh(60).pinROhmsLow(15).loadOhms(20e3).build();
        Ladder board = Ladder.nominal(spec);
        double[] truth = board.levels().levels();
        FitReport fit = BoardFit.fit(exact(board, plan(board)), BoardFit.Settings.defaults());
        assertEquals("switched-load", fit.chosen().key(), fit.reason());
        // Millman's theorem makes the switched-load form exact for a single summing node.
        for (int k = 0; k < truth.length; k++) {
            assertEquals(truth[k], fit.levels().volts(k), 1e-9, "code " + k);
        }
    }

    @Test
    void choosesSwitchedLoadFromRoundedReadingsOnlyWhenItMatters() {
        // 1 kΩ MSB leg against pins of 60 Ω high and 15 Ω low: the node's conductance moves by several
        // per cent with the code, far more than a 1 mV meter resolves.
        LadderSpec spec = LadderSpec.builder().topology(Topology.WEIGHTED).bits(10).baseROhms(1e3)
                .pinROhmsHigh(60).pinROhmsLow(15).build();
        Ladder board = Ladder.nominal(spec);
        double[] truth = board.levels().levels();
        SimulatedBoard.Meter meter = new SimulatedBoard.Meter(0.2e-3, 1e-3, 1);
        double lsb = (truth[1023] - truth[0]) / 1023;

        // The default plan (32 readings) leaves the 21 parameters 11 spare readings: the fit says so.
        FitReport few = BoardFit.fit(SimulatedBoard.of(board).measure(plan(board), meter, 3),
                BoardFit.Settings.defaults());
        assertEquals("switched-load", few.chosen().key(), few.reason());
        assertTrue(few.superposition().rmsVolts() > 2 * few.floorVolts(), few.reason());
        assertTrue(few.warnings().stream().anyMatch(w -> w.startsWith("the fitted table is uncertain by up to")),
                few.warnings().toString());

        // With 4·N check codes every level lies within 5 of its predicted sigmas, all within a quarter LSB.
        MeasurementPlan plan = MeasurementPlan.of(spec.levels(), 40);
        FitReport fit = BoardFit.fit(SimulatedBoard.of(board).measure(plan, meter, 3), BoardFit.Settings.defaults());
        assertEquals("switched-load", fit.chosen().key(), fit.reason());
        double worst = 0;
        for (int k = 0; k < truth.length; k++) {
            double err = Math.abs(fit.levels().volts(k) - truth[k]);
            assertTrue(err < 5 * fit.levelSigmas().get(k), "code " + k + ": " + err + " vs sigma "
                    + fit.levelSigmas().get(k));
            worst = Math.max(worst, err);
        }
        assertTrue(worst < lsb / 4, "worst level error " + worst);

        // The same pins made equal: superposition holds and is kept.
        Ladder equal = Ladder.nominal(spec.toBuilder().pinROhms(20).build());
        FitReport eq = BoardFit.fit(SimulatedBoard.of(equal).measure(plan(equal), meter, 3),
                BoardFit.Settings.defaults());
        assertEquals("superposition", eq.chosen().key(), eq.reason());
    }

    @Test
    void requiresCodeZeroAndEverySingleBit() {
        List<Reading> r = new ArrayList<>();
        r.add(new Reading(0, 0.0, 0.001, 3));
        r.add(new Reading(1, 0.1, 0.001, 4));
        r.add(new Reading(3, 0.3, 0.001, 5));
        Measurements m = Measurements.of(3, r, List.of(4), "r.csv");
        InputError e = assertThrows(InputError.class, () -> BoardFit.fit(m, BoardFit.Settings.defaults()));
        assertEquals("r.csv: cannot fit: no reading of codes 2, 4 (bit 1 alone, bit 2 alone); the superposition"
                + " fit needs code 0 and each single-bit code (or other codes that stand in for them)", e.getMessage());
    }

    @Test
    void proceedsWhenOtherCodesStandInForAMissingOne() {
        Ladder board = weightedBoard(20, 20);
        double[] truth = board.levels().levels();
        List<Reading> r = new ArrayList<>();
        for (int c : plan(board).codeArray()) {
            if (c != 1 << 4) {
                r.add(new Reading(c, truth[c], 0, 0));
            }
        }
        FitReport fit = BoardFit.fit(Measurements.of(10, r, List.of(16), "r.csv"), BoardFit.Settings.defaults());
        assertEquals(truth[16], fit.levels().volts(16), 1e-12);
        assertTrue(fit.warnings().get(0).startsWith("not measured: code 16 (bit 4 alone); the fit proceeds"),
                fit.warnings().get(0));
        assertFalse(fit.tableMeasured());
    }
}
