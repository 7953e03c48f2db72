package org.rungtone.calibrate;

/**
 * Fits {@link Superposition} by linear least squares: the design row of code k is
 * {@code [1, b_0(k), .., b_{N−1}(k)]}, times the square root of the code's weight ({@link ReadingWeights}), so
 * that {@link #predict} and {@link #gradient} are in the weighted fit's units; {@link #gradientAtCode} is not.
 */
final class SuperpositionFit implements ModelKind {
    private final double[][] design;
    private final double[] values;

    /** A fit of {@code values} (already scaled by {@code rootWeights}) at {@code codes}. */
    SuperpositionFit(int bits, int[] codes, double[] values, double[] rootWeights) {
        this.values = values;
        design = new double[codes.length][bits + 1];
        for (int r = 0; r < codes.length; r++) {
            design[r][0] = rootWeights[r];
            for (int i = 0; i < bits; i++) {
                design[r][i + 1] = (codes[r] >> i & 1) * rootWeights[r];
            }
        }
    }

    @Override
    public String key() {
        return "superposition";
    }

    @Override
    public int parameterCount() {
        return design[0].length;
    }

    @Override
    public boolean determined(int[] rows) {
        return LeastSquares.rInverse(design, rows) != null;
    }

    @Override
    public double[] fit(int[] rows) {
        LeastSquares.Solution s = LeastSquares.solve(design, values, rows);
        return s == null ? null : s.theta();
    }

    @Override
    public double predict(double[] theta, int i) {
        double v = 0;
        double[] x = design[i];
        for (int j = 0; j < x.length; j++) {
            v += x[j] * theta[j];
        }
        return v;
    }

    @Override
    public double[] gradient(double[] theta, int i) {
        return design[i].clone();
    }

    @Override
    public double[] gradientAtCode(double[] theta, int code) {
        double[] g = new double[theta.length];
        g[0] = 1;
        for (int i = 1; i < g.length; i++) {
            g[i] = code >> (i - 1) & 1;
        }
        return g;
    }

    @Override
    public BoardModel model(double[] theta) {
        return Superposition.ofParameters(theta);
    }
}
