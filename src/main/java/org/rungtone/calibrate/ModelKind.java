package org.rungtone.calibrate;

/**
 * One model family fitted to one set of per-code means (package-private). Rows are indices into the codes
 * and values the instance was made with, so a fit can leave some out.
 */
interface ModelKind {
    /** The model's name, as {@link BoardModel#key()}. */
    String key();

    /** Number of parameters p. */
    int parameterCount();

    /** True when the given rows determine every parameter. */
    boolean determined(int[] rows);

    /** The least-squares parameters over the rows, or null when they are not determined. */
    double[] fit(int[] rows);

    /** The model's value at row {@code i} for parameters {@code theta}. */
    double predict(double[] theta, int i);

    /** The derivative of the model's value at row {@code i} by each parameter (a Jacobian row). */
    double[] gradient(double[] theta, int i);

    /** The derivative of the model's value at any code by each parameter, measured or not. */
    double[] gradientAtCode(double[] theta, int code);

    /** The board model of these parameters. */
    BoardModel model(double[] theta);
}
