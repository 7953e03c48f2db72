package org.rungtone.calibrate;

import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * The weight of each measured code in the least-squares fits (package-private). A reading rounded to a step q
 * carries the rounding noise {@code q²/12} (Bennett, BSTJ 27, 1948) on top of the repeat spread s², so a
 * code read with the steps {@code q_1 .. q_n} has the variance {@code σ_i² = mean(q_j²)/12 + s²}; weighted
 * least squares gives it the weight {@code w_i = σ_ref²/σ_i²} (Draper and Smith, Applied Regression Analysis,
 * 3rd ed., §9.2), with {@code σ_ref} the file's floor, so that readings of the common step keep the weight 1
 * and the fits stay in volts of that step. Only the readings' own digits set the steps: with one resolution
 * for the whole file (given, or all readings alike) every weight is 1, as in an ordinary fit. Counts of
 * repeated readings do not enter the weight, so files that read some codes more often than others are
 * weighted as before; their spread enters through s.
 */
final class ReadingWeights {
    private ReadingWeights() {
    }

    /**
     * The square roots of the weights of the means, in their order.
     *
     * @param m the readings
     * @param givenStepVolts the resolution given for the whole file, or 0 to use each reading's own
     * @param fileStepVolts the file's common step (the median of the readings' steps)
     * @param floorVolts the file's floor {@code sqrt(q²/12 + s²)}
     */
    static double[] rootWeights(Measurements m, double givenStepVolts, double fileStepVolts, double floorVolts) {
        List<CodeMean> means = m.means();
        double[] out = new double[means.size()];
        java.util.Arrays.fill(out, 1);
        if (givenStepVolts > 0 || !(floorVolts > 0) || m.readings().stream()
                .allMatch(r -> r.stepVolts() <= 0 || r.stepVolts() == fileStepVolts)) {
            return out;
        }
        Map<Integer, double[]> squares = new HashMap<>();
        for (Reading r : m.readings()) {
            double q = r.stepVolts() > 0 ? r.stepVolts() : fileStepVolts;
            double[] sum = squares.computeIfAbsent(r.code(), k -> new double[2]);
            sum[0] += q * q;
            sum[1]++;
        }
        double spread = m.repeatSpreadVolts();
        for (int i = 0; i < out.length; i++) {
            double[] sum = squares.get(means.get(i).code());
            double variance = sum[0] / sum[1] / 12 + spread * spread;
            out[i] = variance > 0 ? floorVolts / Math.sqrt(variance) : 1;
        }
        return out;
    }

    /** {@code values[i]·root[i]}: the values in the weighted fit's units. */
    static double[] scaled(double[] values, double[] root) {
        double[] out = new double[values.length];
        for (int i = 0; i < out.length; i++) {
            out[i] = values[i] * root[i];
        }
        return out;
    }
}
