package org.rungtone.calibrate;

import org.apache.commons.math3.exception.MathIllegalArgumentException;
import org.apache.commons.math3.exception.MathIllegalStateException;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresProblem;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.fitting.leastsquares.MultivariateJacobianFunction;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.util.Pair;

/**
 * Fits {@link SwitchedLoad} in two steps. Multiplying {@code V = (c + Σ b_i·a_i)/(1 + Σ b_i·d_i)} through by
 * the denominator gives {@code V = c + Σ b_i·a_i − Σ b_i·V·d_i}, linear in the parameters with the measured V
 * in the design; its least-squares solution (exact for exact data) starts a Levenberg-Marquardt refinement of
 * the true residuals (Commons Math {@link LevenbergMarquardtOptimizer}; Moré, "The Levenberg-Marquardt
 * algorithm: implementation and theory", 1978). The Jacobian row is
 * {@code [1/D, b_i/D, −b_i·V/D]} with {@code D = 1 + Σ b_i·d_i}. Rows are scaled by the square root of their
 * code's weight ({@link ReadingWeights}): {@link #predict} and {@link #gradient} are in the weighted fit's
 * units, {@link #gradientAtCode} is not.
 */
final class SwitchedLoadFit implements ModelKind {
    private static final int MAX_ITERATIONS = 200;

    private final int bits;
    private final int[] codes;
    private final double[] values;
    private final double[][] linearDesign;
    private final double[] rootWeights;

    /** A fit of {@code values} (already scaled by {@code rootWeights}) at {@code codes}. */
    SwitchedLoadFit(int bits, int[] codes, double[] values, double[] rootWeights) {
        this.bits = bits;
        this.codes = codes;
        this.values = values;
        this.rootWeights = rootWeights;
        linearDesign = new double[codes.length][2 * bits + 1];
        for (int r = 0; r < codes.length; r++) {
            double[] x = linearDesign[r];
            double w = rootWeights[r];
            x[0] = w;
            for (int i = 0; i < bits; i++) {
                int b = codes[r] >> i & 1;
                x[1 + i] = b * w;
                // values[r] is already scaled by w: the row times w is −b·V·w
                x[1 + bits + i] = -b * values[r];
            }
        }
    }

    @Override
    public String key() {
        return "switched-load";
    }

    @Override
    public int parameterCount() {
        return 2 * bits + 1;
    }

    @Override
    public boolean determined(int[] rows) {
        return LeastSquares.rInverse(linearDesign, rows) != null;
    }

    @Override
    public double[] fit(int[] rows) {
        LeastSquares.Solution start = LeastSquares.solve(linearDesign, values, rows);
        if (start == null) {
            return null;
        }
        double[] theta = start.theta();
        double rss = 0;
        double sum = 0;
        for (int r : rows) {
            double e = values[r] - predict(theta, r);
            rss += e * e;
            sum += values[r] * values[r];
        }
        if (!(rss > 1e-28 * sum)) {
            return theta;
        }
        double[] target = new double[rows.length];
        for (int i = 0; i < rows.length; i++) {
            target[i] = values[rows[i]];
        }
        MultivariateJacobianFunction model = point -> valueAndJacobian(point, rows);
        LeastSquaresProblem problem = new LeastSquaresBuilder().start(theta).model(model).target(target)
                .maxEvaluations(10 * MAX_ITERATIONS).maxIterations(MAX_ITERATIONS).build();
        try {
            LeastSquaresOptimizer.Optimum o = new LevenbergMarquardtOptimizer().optimize(problem);
            double[] refined = o.getPoint().toArray();
            return finite(refined) ? refined : theta;
        } catch (MathIllegalStateException | MathIllegalArgumentException e) {
            // No convergence within the limit: the linearised solution is still a sound fit.
            return theta;
        }
    }

    private Pair<RealVector, RealMatrix> valueAndJacobian(RealVector point, int[] rows) {
        double[] theta = point.toArray();
        double[] v = new double[rows.length];
        double[][] jac = new double[rows.length][];
        for (int i = 0; i < rows.length; i++) {
            v[i] = predict(theta, rows[i]);
            jac[i] = gradient(theta, rows[i]);
        }
        return new Pair<>(new ArrayRealVector(v, false), new Array2DRowRealMatrix(jac, false));
    }

    private static boolean finite(double[] x) {
        for (double v : x) {
            if (!Double.isFinite(v)) {
                return false;
            }
        }
        return true;
    }

    @Override
    public double predict(double[] theta, int i) {
        return rootWeights[i] * level(theta, i);
    }

    private double level(double[] theta, int i) {
        double num = theta[0];
        double den = 1;
        int code = codes[i];
        for (int b = 0; b < bits; b++) {
            if ((code >> b & 1) != 0) {
                num += theta[1 + b];
                den += theta[1 + bits + b];
            }
        }
        return num / den;
    }

    @Override
    public double[] gradient(double[] theta, int i) {
        double[] g = gradientAtCode(theta, codes[i]);
        for (int j = 0; j < g.length; j++) {
            g[j] *= rootWeights[i];
        }
        return g;
    }

    @Override
    public double[] gradientAtCode(double[] theta, int code) {
        double num = theta[0];
        double den = 1;
        for (int b = 0; b < bits; b++) {
            if ((code >> b & 1) != 0) {
                num += theta[1 + b];
                den += theta[1 + bits + b];
            }
        }
        double v = num / den;
        double[] g = new double[2 * bits + 1];
        g[0] = 1 / den;
        for (int b = 0; b < bits; b++) {
            if ((code >> b & 1) != 0) {
                g[1 + b] = 1 / den;
                g[1 + bits + b] = -v / den;
            }
        }
        return g;
    }

    @Override
    public BoardModel model(double[] theta) {
        return SwitchedLoad.ofParameters(theta);
    }
}
