package org.rungtone.calibrate;

import java.util.ArrayList;
import java.util.BitSet;
import java.util.List;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.CholeskyDecomposition;
import org.apache.commons.math3.linear.NonPositiveDefiniteMatrixException;
import org.rungtone.ladder.LevelTable;

/**
 * Check codes for a known meter (package-private): each one in turn is the free code that most lowers the
 * average variance of the fitted levels over every code, given the basis and the checks chosen so far: a
 * sequential I-optimal design (Atkinson, Donev and Tobias, Optimum Experimental Designs, with SAS, 2007, on
 * I- and sequential designs). The model is superposition, {@code V(k) = x_k·θ} with
 * {@code x_k = [1, b_0(k), .., b_{N−1}(k)]}; a code read with the meter's step q has the variance q²/12
 * (Bennett 1948). With the information {@code M = Σ x xᵀ/σ²} of the codes so far, {@code P = M⁻¹} and
 * {@code G} the mean of {@code x_k x_kᵀ} over all codes, adding code c lowers the average variance
 * {@code trace(G·P)} by {@code x_cᵀ P G P x_c / (σ_c² + x_cᵀ P x_c)} (Sherman-Morrison). The basis already
 * reads the lower bits on the meter's finer ranges, so that choice alone puts the checks above them, where
 * the coarse readings of the top bits need averaging; but a single reading of a bit can hold a typing error
 * nothing would show, so the first half of the checks is chosen among codes the meter reads on a finer range
 * than the highest level's (when there are any), the rest among all. A level is read at the step of the
 * range that holds it 5 % higher than the model expects (the parts' tolerance, common practice, no source),
 * so a code near a range's top counts as coarse.
 */
final class MeterDesign {
    /** Above this many codes, the candidates are a spread subset (the choice costs p² per candidate). */
    private static final int MAX_CANDIDATES = 4096;
    private static final double MARGIN = 1.05;
    private static final double GOLDEN_STEP = (Math.sqrt(5) - 1) / 2;

    private MeterDesign() {
    }

    /**
     * {@code count} check codes not in {@code used}, in the order chosen.
     *
     * @param expected the modelled levels
     * @param used the basis codes (not changed)
     * @param meter the meter that will read them
     */
    static List<Integer> checks(LevelTable expected, BitSet used, int count, MeterRanges meter) {
        int bits = expected.bits();
        int p = bits + 1;
        double maxAbs = Math.max(Math.abs(expected.minVolts()), Math.abs(expected.maxVolts())) * MARGIN;
        double[][] info = new double[p][p];
        for (int c = used.nextSetBit(0); c >= 0; c = used.nextSetBit(c + 1)) {
            addOuter(info, row(c, bits), 1 / variance(expected, c, meter, maxAbs));
        }
        double[][] g = meanOuter(bits);
        int[] all = candidates(bits, used);
        double topStep = meter.stepVolts(maxAbs, maxAbs);
        int[] fine = java.util.Arrays.stream(all).filter(c -> meter.stepVolts(expected.volts(c) * MARGIN, maxAbs)
                < topStep).toArray();
        BitSet taken = (BitSet) used.clone();
        List<Integer> out = new ArrayList<>();
        for (int j = 0; j < count; j++) {
            // the first half on the finer ranges, so that the basis's single readings there are checked too
            int[] candidates = j < (count + 1) / 2 && fine.length > 0 ? fine : all;
            double[][] pInv = inverse(info);
            if (pInv == null) {
                break;
            }
            double[][] pgp = multiply(multiply(pInv, g), pInv);
            int best = -1;
            double bestGain = -1;
            for (int c : candidates) {
                if (taken.get(c)) {
                    continue;
                }
                double[] x = row(c, bits);
                double gain = quadratic(x, pgp) / (variance(expected, c, meter, maxAbs) + quadratic(x, pInv));
                if (gain > bestGain) {
                    bestGain = gain;
                    best = c;
                }
            }
            if (best < 0) {
                break;
            }
            taken.set(best);
            out.add(best);
            addOuter(info, row(best, bits), 1 / variance(expected, best, meter, maxAbs));
        }
        return out;
    }

    /** q²/12 for the step the meter reads the code's level with (5 % up), relative to a 1 V step. */
    private static double variance(LevelTable expected, int code, MeterRanges meter, double maxAbs) {
        double q = meter.stepVolts(expected.volts(code) * MARGIN, maxAbs);
        return q * q / 12;
    }

    private static int[] candidates(int bits, BitSet used) {
        int n = 1 << bits;
        if (n <= MAX_CANDIDATES) {
            int[] all = new int[n];
            for (int k = 0; k < n; k++) {
                all[k] = k;
            }
            return all;
        }
        BitSet pick = new BitSet(n);
        for (int j = 0; pick.cardinality() < MAX_CANDIDATES && j < 4 * MAX_CANDIDATES; j++) {
            pick.set((int) Math.floor(((0.5 + j * GOLDEN_STEP) % 1.0) * n));
        }
        pick.andNot(used);
        return pick.stream().toArray();
    }

    private static double[] row(int code, int bits) {
        double[] x = new double[bits + 1];
        x[0] = 1;
        for (int i = 0; i < bits; i++) {
            x[i + 1] = code >> i & 1;
        }
        return x;
    }

    /** The mean of {@code x_k x_kᵀ} over every code: 1 and ½ off the bit diagonal, ¼ between two bits. */
    private static double[][] meanOuter(int bits) {
        int p = bits + 1;
        double[][] g = new double[p][p];
        for (int i = 0; i < p; i++) {
            for (int j = 0; j < p; j++) {
                g[i][j] = i == 0 && j == 0 ? 1 : i == 0 || j == 0 || i == j ? 0.5 : 0.25;
            }
        }
        return g;
    }

    private static void addOuter(double[][] m, double[] x, double w) {
        for (int i = 0; i < x.length; i++) {
            for (int j = 0; j < x.length; j++) {
                m[i][j] += w * x[i] * x[j];
            }
        }
    }

    private static double[][] inverse(double[][] m) {
        try {
            return new CholeskyDecomposition(new Array2DRowRealMatrix(m), 1e-12, 1e-14).getSolver().getInverse()
                    .getData();
        } catch (NonPositiveDefiniteMatrixException | org.apache.commons.math3.linear.NonSymmetricMatrixException e) {
            return null;
        }
    }

    private static double[][] multiply(double[][] a, double[][] b) {
        int n = a.length;
        double[][] c = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int k = 0; k < n; k++) {
                double v = a[i][k];
                for (int j = 0; j < n; j++) {
                    c[i][j] += v * b[k][j];
                }
            }
        }
        return c;
    }

    private static double quadratic(double[] x, double[][] a) {
        double s = 0;
        for (int i = 0; i < x.length; i++) {
            if (x[i] == 0) {
                continue;
            }
            double r = 0;
            for (int j = 0; j < x.length; j++) {
                r += a[i][j] * x[j];
            }
            s += x[i] * r;
        }
        return s;
    }
}
