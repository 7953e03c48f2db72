package org.rungtone.analysis;

/**
 * A {@link ReconstructionFilter} discretised for an input held constant over each step of length T (the
 * step-invariant or zero-order-hold equivalent): with the state-space form {@code x' = A·x + B·u},
 * {@code y = x_0}, the exact update is {@code x[k+1] = Φ·x[k] + Γ·u[k]} with
 * {@code [[Φ, Γ], [0, 1]] = exp([[A, B], [0, 0]]·T)} (the augmented-matrix identity of C. F. Van Loan,
 * "Computing Integrals Involving the Matrix Exponential", IEEE Trans. Autom. Control 23(3), 1978). Because
 * the held ladder output really is piecewise constant, the samples {@code y[k]} are the analog filter's
 * output at t = kT exactly, not an approximation such as the bilinear transform. The exponential is
 * computed by scaling and squaring of a 20-term Taylor series. States are scaled (x1 = y'/ω0) so entries
 * stay near ω0·T.
 */
final class StepInvariantFilter {
    private final int order;
    private final double[][] phi;
    private final double[] gamma;
    private final double[] state;

    StepInvariantFilter(ReconstructionFilter filter, double stepSeconds) {
        double[][] a;
        double[] b;
        switch (filter.kind()) {
            case FIRST_ORDER: {
                double w = 2 * Math.PI * filter.cutoffHz();
                a = new double[][] {{-w}};
                b = new double[] {w};
                break;
            }
            case SECOND_ORDER: {
                double w = 2 * Math.PI * filter.cutoffHz();
                a = new double[][] {{0, w}, {-w, -w / filter.q()}};
                b = new double[] {0, w};
                break;
            }
            default:
                a = new double[0][0];
                b = new double[0];
                break;
        }
        order = b.length;
        int m = order + 1;
        double[][] aug = new double[m][m];
        for (int i = 0; i < order; i++) {
            for (int j = 0; j < order; j++) {
                aug[i][j] = a[i][j] * stepSeconds;
            }
            aug[i][order] = b[i] * stepSeconds;
        }
        double[][] e = expm(aug);
        phi = new double[order][order];
        gamma = new double[order];
        for (int i = 0; i < order; i++) {
            System.arraycopy(e[i], 0, phi[i], 0, order);
            gamma[i] = e[i][order];
        }
        state = new double[order];
    }

    /**
     * Filters {@code count} held inputs {@code u[0 ..]} into {@code y[offset ..]}: the output of step k is
     * the value at its start, then the state advances over the step with input {@code u[k]}. Without a
     * filter the output is the input.
     */
    void process(double[] u, double[] y, int offset, int count) {
        if (order == 0) {
            System.arraycopy(u, 0, y, offset, count);
        } else if (order == 1) {
            double x = state[0];
            double p = phi[0][0];
            double g = gamma[0];
            for (int k = 0; k < count; k++) {
                y[offset + k] = x;
                x = p * x + g * u[k];
            }
            state[0] = x;
        } else {
            double x0 = state[0];
            double x1 = state[1];
            double p00 = phi[0][0];
            double p01 = phi[0][1];
            double p10 = phi[1][0];
            double p11 = phi[1][1];
            double g0 = gamma[0];
            double g1 = gamma[1];
            for (int k = 0; k < count; k++) {
                y[offset + k] = x0;
                double n0 = p00 * x0 + p01 * x1 + g0 * u[k];
                x1 = p10 * x0 + p11 * x1 + g1 * u[k];
                x0 = n0;
            }
            state[0] = x0;
            state[1] = x1;
        }
    }

    /** Matrix exponential by scaling and squaring with a Taylor series. */
    static double[][] expm(double[][] m) {
        int n = m.length;
        double norm = 0;
        for (double[] row : m) {
            double s = 0;
            for (double v : row) {
                s += Math.abs(v);
            }
            norm = Math.max(norm, s);
        }
        int squarings = norm > 0.5 ? (int) Math.ceil(Math.log(norm / 0.5) / Math.log(2)) : 0;
        double scale = Math.pow(2, -squarings);
        double[][] a = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                a[i][j] = m[i][j] * scale;
            }
        }
        double[][] result = identity(n);
        double[][] term = identity(n);
        for (int k = 1; k <= 20; k++) {
            term = multiply(term, a);
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    term[i][j] /= k;
                    result[i][j] += term[i][j];
                }
            }
        }
        for (int s = 0; s < squarings; s++) {
            result = multiply(result, result);
        }
        return result;
    }

    private static double[][] identity(int n) {
        double[][] r = new double[n][n];
        for (int i = 0; i < n; i++) {
            r[i][i] = 1;
        }
        return r;
    }

    private static double[][] multiply(double[][] x, double[][] y) {
        int n = x.length;
        double[][] r = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int k = 0; k < n; k++) {
                double v = x[i][k];
                for (int j = 0; j < n; j++) {
                    r[i][j] += v * y[k][j];
                }
            }
        }
        return r;
    }
}
