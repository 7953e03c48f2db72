package org.rungtone.calibrate;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.DecompositionSolver;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.RealMatrix;

/**
 * The linear part of the recording's model for a given input corner and hum frequency (package-private).
 *
 * <p>A first-order high-pass with time constant τ turns a staircase of levels into a decaying exponential per
 * step: inside step k the recording is {@code a_k·exp(−(n − E_k)/(f_s·τ)) + o + hum(n) + noise}, with E_k the
 * step's first sample, o the input's offset and a_k the output just after the edge. A jump of the input
 * passes the high-pass whole, so at each edge {@code a_{k+1} − ρ_k·a_k = g·(V_{k+1} − V_k)} with
 * {@code ρ_k = exp(−(E_{k+1} − E_k)/(f_s·τ))} and g the unknown gain (its sign the polarity). So the levels
 * follow from the a_k by a running sum, and two visits i &lt; j of one code give a linear constraint on them:
 * {@code a_j − ρ_i·a_i + Σ_{i<m<j} (1 − ρ_m)·a_m = 0}.
 *
 * <p>Stage one fits every a_k, the offset and, per segment, two terms per hum harmonic, by least squares over
 * the bins; the a_k are eliminated step by step and the hum terms segment by segment (block elimination, the
 * Schur complement), so the cost grows with the bins, not with their square. Stage two moves the a_k the least,
 * in the metric of stage one's information {@code d_k = Σ w·φ²}, onto the constraints:
 * {@code a* = â − D⁻¹Cᵀ(C·D⁻¹·Cᵀ)⁻¹·C·â} (least squares with linear equality constraints, Lawson and Hanson,
 * Solving Least Squares Problems, 1974, ch. 20). Its cost adds to the residual sum of squares. Golub and
 * Pereyra's variable projection (SIAM J. Numer. Anal. 10, 1973) then leaves only τ and the hum frequency to
 * the nonlinear search.
 */
final class StaircaseSolver {
    private final StepBins bins;
    private final int[] stepCodes;
    /** The global terms of the last hum frequency asked for: a Jacobian's corner column reuses them. */
    private double cachedHum = Double.NaN;
    private int cachedHarmonics;
    private double[] cachedGlobals;

    StaircaseSolver(StepBins bins, int[] stepCodes) {
        this.bins = bins;
        this.stepCodes = stepCodes.clone();
    }

    /**
     * One solution.
     *
     * @param a the constrained amplitude of each step (recording units)
     * @param rho each step's decay over its length
     * @param information d_k of each step
     * @param model the model's value in each bin
     * @param rss the residual sum of squares of the bin means, times the samples per bin
     * @param parameters how many linear parameters were fitted, less the constraints
     */
    record Solution(double[] a, double[] rho, double[] information, double[] model, double rss, int parameters) {
        /** The noise per sample the solution leaves, rms, from the residuals of {@code bins} bins. */
        double noiseRms(int bins) {
            return Math.sqrt(rss / Math.max(1, bins - parameters));
        }

        /** The input level of every step, relative to step 0, in recording units (gain times volts). */
        double[] levels() {
            double[] g = new double[a.length];
            for (int k = 1; k < a.length; k++) {
                g[k] = g[k - 1] + a[k] - rho[k - 1] * a[k - 1];
            }
            return g;
        }
    }

    /**
     * Solves for a time constant and a hum frequency.
     *
     * @param tauSamples the high-pass time constant in samples
     * @param humCyclesPerSample the hum's fundamental in cycles per sample, or 0 for no hum terms
     * @param harmonics hum harmonics modelled (1, 2, ..), when the hum is
     */
    Solution solve(double tauSamples, double humCyclesPerSample, int harmonics) {
        int steps = bins.steps;
        int h = humCyclesPerSample > 0 ? 2 * harmonics : 0;
        int p = h + 1;
        int n = bins.bins();
        double[] phi = new double[n];
        double[] x = globals(humCyclesPerSample, harmonics, p);
        double[] rho = new double[steps];
        int m = bins.width;
        double q = Math.exp(-1 / tauSamples);
        double binMean = m == 1 ? 1 : (1 - Math.pow(q, m)) / (m * (1 - q));
        double binDecay = Math.pow(q, m);
        for (int k = 0; k < steps; k++) {
            rho[k] = Math.exp(-(bins.edge[k + 1] - bins.edge[k]) / tauSamples);
            int b0 = bins.binFrom[k];
            int b1 = bins.binFrom[k + 1];
            if (b0 == b1) {
                continue;
            }
            double v = Math.exp(-(bins.firstSample[b0] - bins.edge[k]) / tauSamples) * binMean;
            for (int b = b0; b < b1; b++) {
                phi[b] = v;
                v *= binDecay;
            }
        }
        Stage one = stageOne(phi, x, p);
        double[] a = constrain(one.a, one.d, rho);
        double[] model = new double[n];
        double rss = 0;
        for (int k = 0; k < steps; k++) {
            double[] beta = one.beta[bins.segment[k]];
            for (int b = bins.binFrom[k]; b < bins.binFrom[k + 1]; b++) {
                double v = a[k] * phi[b];
                for (int j = 0; j < p; j++) {
                    v += x[b * p + j] * beta[j];
                }
                model[b] = v;
                double e = bins.mean[b] - v;
                rss += e * e;
            }
        }
        rss *= m;
        return new Solution(a, rho, one.d, model, rss, steps + 1 + bins.segments * h - constraintCount());
    }

    /** Every bin's global terms, {@code p} each: the hum harmonics' cosine and sine, then the offset. */
    private double[] globals(double humCyclesPerSample, int harmonics, int p) {
        if (humCyclesPerSample == cachedHum && harmonics == cachedHarmonics) {
            return cachedGlobals;
        }
        int h = p - 1;
        double[] x = new double[bins.bins() * p];
        for (int k = 0; k < bins.steps; k++) {
            int b0 = bins.binFrom[k];
            int b1 = bins.binFrom[k + 1];
            for (int b = b0; b < b1; b++) {
                x[b * p + h] = 1;
            }
            for (int r = 1; 2 * r <= h; r++) {
                harmonic(x, p, 2 * r - 2, b0, b1, 2 * Math.PI * humCyclesPerSample * r);
            }
        }
        cachedHum = humCyclesPerSample;
        cachedHarmonics = harmonics;
        cachedGlobals = x;
        return x;
    }

    /**
     * The bin means of cos(w·n) and sin(w·n) for bins b0..b1−1 of one step into columns {@code col} and
     * {@code col + 1}: the Dirichlet kernel times the value at each bin's centre, the centres advanced by a
     * rotation from the first one's exact value.
     */
    private void harmonic(double[] x, int p, int col, int b0, int b1, double w) {
        int m = bins.width;
        double dirichlet = m == 1 ? 1 : Math.sin(w * m / 2) / (m * Math.sin(w / 2));
        double c = bins.centre(b0);
        double cr = Math.cos(w * c);
        double ci = Math.sin(w * c);
        double sr = Math.cos(w * m);
        double si = Math.sin(w * m);
        for (int b = b0; b < b1; b++) {
            x[b * p + col] = dirichlet * cr;
            x[b * p + col + 1] = dirichlet * ci;
            double t = cr * sr - ci * si;
            ci = cr * si + ci * sr;
            cr = t;
        }
    }

    /** Stage one's result: each step's amplitude and information, each segment's global terms. */
    private record Stage(double[] a, double[] d, double[][] beta) {
    }

    private Stage stageOne(double[] phi, double[] x, int p) {
        int steps = bins.steps;
        int segs = bins.segments;
        double w = bins.width;
        double[] d = new double[steps];
        double[] r = new double[steps];
        double[][] u = new double[steps][p];
        double[][][] big = new double[segs][p][p];
        double[][] rhs = new double[segs][p];
        for (int k = 0; k < steps; k++) {
            double[] uk = u[k];
            double[][] bs = big[bins.segment[k]];
            double[] rs = rhs[bins.segment[k]];
            for (int b = bins.binFrom[k]; b < bins.binFrom[k + 1]; b++) {
                double y = bins.mean[b];
                double f = phi[b];
                d[k] += w * f * f;
                r[k] += w * f * y;
                int o = b * p;
                for (int i = 0; i < p; i++) {
                    double wx = w * x[o + i];
                    uk[i] += wx * f;
                    rs[i] += wx * y;
                    double[] row = bs[i];
                    for (int j = 0; j <= i; j++) {
                        row[j] += wx * x[o + j];
                    }
                }
            }
            if (d[k] > 0) {
                for (int i = 0; i < p; i++) {
                    rs[i] -= uk[i] * r[k] / d[k];
                    for (int j = 0; j <= i; j++) {
                        bs[i][j] -= uk[i] * uk[j] / d[k];
                    }
                }
            }
        }
        double[][] beta = globalTerms(big, rhs, p);
        double[] a = new double[steps];
        for (int k = 0; k < steps; k++) {
            double v = r[k];
            for (int i = 0; i < p; i++) {
                v -= u[k][i] * beta[bins.segment[k]][i];
            }
            a[k] = d[k] > 0 ? v / d[k] : 0;
        }
        return new Stage(a, d, beta);
    }

    /**
     * Solves the reduced system of the global terms: per segment its hum terms, shared by all the offset (the
     * last term). The hum terms are eliminated segment by segment, leaving one equation for the offset.
     */
    private static double[][] globalTerms(double[][][] big, double[][] rhs, int p) {
        int segs = big.length;
        int h = p - 1;
        for (double[][] m : big) {
            for (int i = 0; i < p; i++) {
                for (int j = i + 1; j < p; j++) {
                    m[i][j] = m[j][i];
                }
            }
        }
        double[][] beta = new double[segs][p];
        if (h == 0) {
            double num = 0;
            double den = 0;
            for (int s = 0; s < segs; s++) {
                num += rhs[s][0];
                den += big[s][0][0];
            }
            double o = den > 0 ? num / den : 0;
            for (double[] b : beta) {
                b[0] = o;
            }
            return beta;
        }
        DecompositionSolver[] solvers = new DecompositionSolver[segs];
        double[][] zc = new double[segs][];
        double[][] zr = new double[segs][];
        double num = 0;
        double den = 0;
        for (int s = 0; s < segs; s++) {
            RealMatrix hh = new Array2DRowRealMatrix(h, h);
            double[] c = new double[h];
            double[] rh = new double[h];
            for (int i = 0; i < h; i++) {
                for (int j = 0; j < h; j++) {
                    hh.setEntry(i, j, big[s][i][j]);
                }
                c[i] = big[s][i][h];
                rh[i] = rhs[s][i];
            }
            solvers[s] = new QRDecomposition(hh, 1e-12).getSolver();
            zc[s] = solvers[s].isNonSingular() ? solvers[s].solve(new ArrayRealVector(c)).toArray() : new double[h];
            zr[s] = solvers[s].isNonSingular() ? solvers[s].solve(new ArrayRealVector(rh)).toArray() : new double[h];
            num += rhs[s][h];
            den += big[s][h][h];
            for (int i = 0; i < h; i++) {
                num -= c[i] * zr[s][i];
                den -= c[i] * zc[s][i];
            }
        }
        double o = den > 0 ? num / den : 0;
        for (int s = 0; s < segs; s++) {
            for (int i = 0; i < h; i++) {
                beta[s][i] = zr[s][i] - zc[s][i] * o;
            }
            beta[s][h] = o;
        }
        return beta;
    }

    /** Two consecutive visits of one code: the steps a constraint ties together. */
    private record Visits(int first, int next) {
    }

    /** Consecutive visits of each code, in order of the later one. */
    private List<Visits> visitPairs() {
        Map<Integer, Integer> last = new HashMap<>();
        List<Visits> pairs = new ArrayList<>();
        for (int k = 0; k < stepCodes.length; k++) {
            Integer before = last.put(stepCodes[k], k);
            if (before != null) {
                pairs.add(new Visits(before, k));
            }
        }
        return pairs;
    }

    private int constraintCount() {
        return visitPairs().size();
    }

    /** Stage two: the least change of the amplitudes, weighted by their information, that meets the ties. */
    private double[] constrain(double[] a, double[] d, double[] rho) {
        List<Visits> pairs = visitPairs();
        int m = pairs.size();
        if (m == 0) {
            return a.clone();
        }
        double[][] c = new double[m][];
        int[] from = new int[m];
        double[] ca = new double[m];
        for (int i = 0; i < m; i++) {
            int s = pairs.get(i).first();
            int e = pairs.get(i).next();
            double[] row = new double[e - s + 1];
            row[0] = -rho[s];
            for (int k = s + 1; k < e; k++) {
                row[k - s] = 1 - rho[k];
            }
            row[e - s] = 1;
            c[i] = row;
            from[i] = s;
            for (int k = 0; k < row.length; k++) {
                ca[i] += row[k] * a[s + k];
            }
        }
        RealMatrix g = new Array2DRowRealMatrix(m, m);
        for (int i = 0; i < m; i++) {
            for (int j = 0; j <= i; j++) {
                int lo = Math.max(from[i], from[j]);
                int hi = Math.min(from[i] + c[i].length, from[j] + c[j].length);
                double v = 0;
                for (int k = lo; k < hi; k++) {
                    v += c[i][k - from[i]] * c[j][k - from[j]] / Math.max(d[k], 1e-300);
                }
                g.setEntry(i, j, v);
                g.setEntry(j, i, v);
            }
        }
        double[] lambda = new QRDecomposition(g, 1e-14).getSolver().solve(new ArrayRealVector(ca)).toArray();
        double[] out = a.clone();
        for (int i = 0; i < m; i++) {
            for (int k = 0; k < c[i].length; k++) {
                int step = from[i] + k;
                out[step] -= c[i][k] * lambda[i] / Math.max(d[step], 1e-300);
            }
        }
        return out;
    }
}
