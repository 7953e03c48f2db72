package org.rungtone.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.apache.commons.math3.linear.RealMatrix;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.rungtone.ladder.Ladder;

/**
 * A reading typed with two digits swapped is left out of the fit and named, and the fit without it still
 * recovers the board: the synthetic 10-bit board of {@link BoardFitTest} read at the plan's codes with
 * 0.2 mV of noise and rounded to 1 mV, as a 3½-digit meter on its 2 V range shows it.
 */
class OutlierTest {
    private static final double NOISE = 0.2e-3;
    private static final double STEP = 1e-3;

    @ParameterizedTest(name = "typo at code {0}")
    @ValueSource(ints = {-1, 256, 512})
    void swappedDigitsAreFlaggedAndTheRefitStaysAccurate(int typoCode) {
        Ladder board = BoardFitTest.weightedBoard(20, 20);
        double[] truth = board.levels().levels();
        MeasurementPlan plan = MeasurementPlan.of(board.spec().levels());
        // -1: the plan's first check code.
        int code = typoCode >= 0 ? typoCode : plan.codes().get(12).code();
        String csv = SimulatedBoard.of(board).filledCsv(plan, new SimulatedBoard.Meter(NOISE, STEP, 1), 5);
        String typed = swapLastTwoDigits(csv, code);
        FitReport fit = BoardFit.fit(MeasurementCsv.parse(typed, "typo.csv", 10), BoardFit.Settings.defaults());

        assertEquals(List.of(code), fit.outlierCodes(), fit.reason());
        assertEquals("superposition", fit.chosen().key(), fit.reason());
        // Per-bit weights within 3 sigma; the noise is the meter's noise and its rounding, q²/12 (Bennett 1948),
        // and the design is the plan without the left-out code.
        double sigma = Math.sqrt(NOISE * NOISE + STEP * STEP / 12);
        int[] kept = plan.codes().stream().mapToInt(PlannedCode::code).filter(c -> c != code).toArray();
        RealMatrix cov = BoardFitTest.covariance(kept, 10);
        for (int bit = 0; bit < 10; bit++) {
            double w = truth[1 << bit] - truth[0];
            double sd = sigma * Math.sqrt(cov.getEntry(bit + 1, bit + 1));
            double err = fit.chosen().stepVolts(bit) - w;
            assertTrue(Math.abs(err) < 3 * sd, "bit " + bit + ": error " + err + " beyond 3 sigma " + 3 * sd);
        }
        CodeResidual flagged = fit.residuals().stream().filter(r -> r.code() == code).findFirst().orElseThrow();
        assertEquals(CodeResidual.Status.OUTLIER, flagged.status());
        assertTrue(Math.abs(flagged.score()) > 2 * RobustFit.THRESHOLD, "score " + flagged.score());
    }

    /** The CSV with the reading of {@code code} typed with its last two digits swapped (they must differ). */
    static String swapLastTwoDigits(String csv, int code) {
        StringBuilder out = new StringBuilder();
        boolean done = false;
        for (String line : csv.split("\n", -1)) {
            String[] f = line.split(",", -1);
            if (!done && f.length == 4 && f[0].equals(Integer.toString(code))) {
                String v = f[3];
                int n = v.length();
                String swapped = v.substring(0, n - 2) + v.charAt(n - 1) + v.charAt(n - 2);
                if (swapped.equals(v)) {
                    // Equal last digits: swap the two before instead.
                    swapped = v.substring(0, n - 3) + v.charAt(n - 2) + v.charAt(n - 3) + v.charAt(n - 1);
                }
                assertTrue(!swapped.equals(v) && swapped.indexOf('.') == v.indexOf('.'), "no digits to swap in " + v);
                line = f[0] + "," + f[1] + "," + f[2] + "," + swapped;
                done = true;
            }
            out.append(line).append('\n');
        }
        assertTrue(done, "code " + code + " not in the plan");
        return out.substring(0, out.length() - 1);
    }
}
