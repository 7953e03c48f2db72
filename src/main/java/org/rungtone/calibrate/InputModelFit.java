package org.rungtone.calibrate;

import java.util.Arrays;
import org.apache.commons.math3.exception.MathIllegalStateException;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.util.Pair;

/**
 * The nonlinear part of the recording's model (package-private): the input's high-pass corner and, when the
 * recording hums, the mains frequency, found by Levenberg-Marquardt (Commons Math
 * {@link LevenbergMarquardtOptimizer}) over the residuals that {@link StaircaseSolver} leaves for each trial
 * value (variable projection). The corner starts from the best of octaves from 0.5 to 32 Hz and stays within
 * {@value #MIN_CORNER_HZ} .. {@value #MAX_CORNER_HZ} Hz; hum is looked for as a peak between 45 and 65 Hz in
 * the spectrum of that first fit's residuals over the first {@value #HUM_SEARCH_SECONDS} s, at least
 * {@value #HUM_PEAK_RATIO} times the median power there, and modelled with {@value #HARMONICS} harmonics.
 */
final class InputModelFit {
    static final double MIN_CORNER_HZ = 0.2;
    static final double MAX_CORNER_HZ = 60;
    static final int HARMONICS = 3;
    static final double HUM_SEARCH_SECONDS = 10;
    static final double HUM_PEAK_RATIO = 30;
    private static final double[] GRID_HZ = {0.5, 1, 2, 4, 8, 16, 32};
    private static final double STEP = 1e-4;

    private final StepBins bins;
    private final StaircaseSolver solver;

    InputModelFit(StepBins bins, int[] stepCodes) {
        this.bins = bins;
        this.solver = new StaircaseSolver(bins, stepCodes);
    }

    /**
     * The fitted input.
     *
     * @param cornerHz the high-pass corner
     * @param humHz the hum's fundamental, or 0 when none was found
     * @param solution the linear part at these values
     */
    record Fitted(double cornerHz, double humHz, StaircaseSolver.Solution solution) {
    }

    /** Fits the corner, looks for hum, and fits again with it when found. */
    Fitted fit() {
        double best = GRID_HZ[0];
        double bestRss = Double.POSITIVE_INFINITY;
        for (double f : GRID_HZ) {
            double rss = solve(f, 0).rss();
            if (rss < bestRss) {
                bestRss = rss;
                best = f;
            }
        }
        double hum = humPeak(solve(best, 0));
        double[] theta = hum == 0 ? refine(new double[] {Math.log(best)}, 0)
                : refine(new double[] {Math.log(best), hum}, 1);
        double f = Math.exp(theta[0]);
        double h = hum == 0 ? 0 : theta[1];
        return new Fitted(f, h, solve(f, h));
    }

    private StaircaseSolver.Solution solve(double cornerHz, double humHz) {
        double c = Math.min(MAX_CORNER_HZ, Math.max(MIN_CORNER_HZ, cornerHz));
        double tau = bins.rateHz / (2 * Math.PI * c);
        return solver.solve(tau, humHz / bins.rateHz, HARMONICS);
    }

    /** The weighted residuals at {@code theta} (log corner, then the hum frequency when {@code hum} is 1). */
    private double[] residuals(double[] theta, int hum) {
        StaircaseSolver.Solution s = solve(Math.exp(theta[0]), hum == 1 ? theta[1] : 0);
        double[] r = new double[bins.bins()];
        double w = Math.sqrt(bins.width);
        for (int b = 0; b < r.length; b++) {
            r[b] = w * (bins.mean[b] - s.model()[b]);
        }
        return r;
    }

    /** Levenberg-Marquardt over the residual vector, with a forward-difference Jacobian. */
    private double[] refine(double[] start, int hum) {
        int n = bins.bins();
        LeastSquaresBuilder b = new LeastSquaresBuilder().start(start).target(new double[n])
                .maxEvaluations(400).maxIterations(100).model(point -> {
                    double[] theta = point.toArray();
                    double[] r0 = residuals(theta, hum);
                    double[][] jac = new double[n][theta.length];
                    for (int j = 0; j < theta.length; j++) {
                        double[] t = theta.clone();
                        t[j] += STEP;
                        double[] r1 = residuals(t, hum);
                        for (int i = 0; i < n; i++) {
                            // the model is target − residual: its derivative is minus the residual's
                            jac[i][j] = -(r1[i] - r0[i]) / STEP;
                        }
                    }
                    double[] value = new double[n];
                    for (int i = 0; i < n; i++) {
                        value[i] = -r0[i];
                    }
                    return new Pair<>(new ArrayRealVector(value, false), new Array2DRowRealMatrix(jac, false));
                });
        try {
            LeastSquaresOptimizer.Optimum o = new LevenbergMarquardtOptimizer().optimize(b.build());
            double[] p = o.getPoint().toArray();
            return Arrays.stream(p).allMatch(Double::isFinite) ? p : start;
        } catch (MathIllegalStateException e) {
            // no convergence within the limits: the start is the grid's best, still a sound fit
            return start;
        }
    }

    /**
     * The hum's frequency in the residuals of {@code s}, or 0 when no peak stands out. The weighted residuals
     * are summed into millisecond cells (the gaps at the edges stay zero) and transformed at 0.05 Hz steps.
     */
    private double humPeak(StaircaseSolver.Solution s) {
        double origin = bins.firstSample[0];
        double cell = bins.rateHz / 1000;
        int cells = (int) (HUM_SEARCH_SECONDS * 1000);
        double[] sum = new double[cells];
        for (int b = 0; b < bins.bins(); b++) {
            int i = (int) ((bins.centre(b) - origin) / cell);
            if (i >= cells) {
                break;
            }
            sum[i] += bins.mean[b] - s.model()[b];
        }
        int freqs = 401;
        double[] power = new double[freqs];
        double bestF = 0;
        double bestP = 0;
        for (int k = 0; k < freqs; k++) {
            double f = 45 + 20.0 * k / (freqs - 1);
            double w = 2 * Math.PI * f / 1000;
            double cr = Math.cos(w);
            double ci = Math.sin(w);
            double pr = 1;
            double pi = 0;
            double re = 0;
            double im = 0;
            for (double v : sum) {
                re += v * pr;
                im += v * pi;
                double t = pr * cr - pi * ci;
                pi = pr * ci + pi * cr;
                pr = t;
            }
            power[k] = re * re + im * im;
            if (power[k] > bestP) {
                bestP = power[k];
                bestF = f;
            }
        }
        double[] sorted = power.clone();
        Arrays.sort(sorted);
        return bestP > HUM_PEAK_RATIO * sorted[freqs / 2] ? bestF : 0;
    }
}
