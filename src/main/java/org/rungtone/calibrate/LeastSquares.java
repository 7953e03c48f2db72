package org.rungtone.calibrate;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.RealMatrix;

/**
 * Linear least squares by Householder QR (Commons Math {@link QRDecomposition}), with what the outlier
 * screen needs: a rank test, and {@code R⁻¹} so that a row's leverage {@code h = x·(XᵀX)⁻¹·xᵀ = ‖x·R⁻¹‖²}
 * and the parameter covariance {@code σ²·R⁻¹·R⁻ᵀ} cost a p×p product each (Golub and Van Loan, Matrix
 * Computations, §5.3). The full Q is never formed.
 */
final class LeastSquares {
    /** A column whose |R_jj| is below this share of the largest is taken as dependent. */
    static final double RANK_TOLERANCE = 1e-10;

    private LeastSquares() {
    }

    /**
     * A solution: the parameters and the inverse of the triangular factor.
     *
     * @param theta the least-squares parameters
     * @param rInverse {@code R⁻¹}, p×p upper triangular
     */
    record Solution(double[] theta, double[][] rInverse) {
        /** {@code ‖x·R⁻¹‖²}: the leverage of a used row, or the prediction-variance factor of another. */
        double leverage(double[] x) {
            return LeastSquares.leverage(x, rInverse);
        }
    }

    /**
     * Solves {@code min ‖X·θ − y‖} over the given rows.
     *
     * @return the solution, or null when the rows do not determine every parameter
     */
    static Solution solve(double[][] x, double[] y, int[] rows) {
        int p = x[0].length;
        if (rows.length < p) {
            return null;
        }
        double[] b = new double[rows.length];
        for (int i = 0; i < rows.length; i++) {
            b[i] = y[rows[i]];
        }
        QRDecomposition qr = new QRDecomposition(matrix(x, rows));
        double[][] rInv = invertR(qr.getR(), p);
        if (rInv == null) {
            return null;
        }
        double[] theta = qr.getSolver().solve(new ArrayRealVector(b, false)).toArray();
        return new Solution(theta, rInv);
    }

    /** {@code R⁻¹} of the QR factorisation of the given rows of {@code x}, or null when rank-deficient. */
    static double[][] rInverse(double[][] x, int[] rows) {
        int p = x[0].length;
        if (rows.length < p) {
            return null;
        }
        return invertR(new QRDecomposition(matrix(x, rows)).getR(), p);
    }

    private static RealMatrix matrix(double[][] x, int[] rows) {
        double[][] a = new double[rows.length][];
        for (int i = 0; i < rows.length; i++) {
            a[i] = x[rows[i]];
        }
        return new Array2DRowRealMatrix(a, false);
    }

    /** The inverse of the leading p×p block of R, or null when a diagonal entry is (nearly) zero. */
    private static double[][] invertR(RealMatrix r, int p) {
        double max = 0;
        for (int j = 0; j < p; j++) {
            max = Math.max(max, Math.abs(r.getEntry(j, j)));
        }
        if (!(max > 0)) {
            return null;
        }
        for (int j = 0; j < p; j++) {
            if (Math.abs(r.getEntry(j, j)) <= RANK_TOLERANCE * max) {
                return null;
            }
        }
        double[][] inv = new double[p][p];
        for (int col = 0; col < p; col++) {
            // Back substitution of R·z = e_col.
            for (int i = col; i >= 0; i--) {
                double s = i == col ? 1 : 0;
                for (int k = i + 1; k <= col; k++) {
                    s -= r.getEntry(i, k) * inv[k][col];
                }
                inv[i][col] = s / r.getEntry(i, i);
            }
        }
        return inv;
    }

    /** {@code ‖x·R⁻¹‖²}. */
    static double leverage(double[] x, double[][] rInverse) {
        int p = x.length;
        double sum = 0;
        for (int j = 0; j < p; j++) {
            double v = 0;
            for (int i = 0; i <= j; i++) {
                v += x[i] * rInverse[i][j];
            }
            sum += v * v;
        }
        return sum;
    }

    /** The standard deviation of each parameter for residual scale {@code sigma}: σ·‖row j of R⁻¹‖. */
    static double[] parameterSigmas(double[][] rInverse, double sigma) {
        int p = rInverse.length;
        double[] out = new double[p];
        for (int j = 0; j < p; j++) {
            double s = 0;
            for (int k = j; k < p; k++) {
                s += rInverse[j][k] * rInverse[j][k];
            }
            out[j] = sigma * Math.sqrt(s);
        }
        return out;
    }
}
