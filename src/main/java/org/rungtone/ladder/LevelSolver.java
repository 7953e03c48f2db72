package org.rungtone.ladder;

/**
 * The fast exact solution of every code's ladder voltage, used for level tables, Monte Carlo boards and the
 * design search. Each pin is a Thévenin source: logic level V_H through r_H when its bit is 1, V_L through
 * r_L when 0.
 *
 * <p><b>Summing networks</b> (weighted, custom) have one node, so nodal analysis reduces to Millman's
 * theorem: {@code V = Σ g_i(b_i)·V(b_i) / (Σ g_i(b_i) + g_load)} with {@code g_i(b) = 1/(R_i + r(b))}.
 * Numerator and denominator of code k are those of code {@code k & (k−1)} plus the change of its lowest set
 * bit, so each code costs two additions and one division, exact even when r_H ≠ r_L. When r_H = r_L the
 * denominator does not depend on the code and the levels are a plain superposition of per-bit steps.
 *
 * <p><b>R-2R ladders</b> are solved by eliminating nodes from the LSB end (Gaussian elimination of the
 * tridiagonal nodal matrix, i.e. repeated source transformation): the part of the ladder left of node j is a
 * Thévenin source (V_j, R_j) that depends only on bits 0..j. With r_H = r_L, R_j does not depend on the code
 * and the output is a superposition {@code V(k) = V(0) + Σ_{i∈k} w_i·(V_H − V_L)} with transfer weights w_i
 * from one sweep. With r_H ≠ r_L the sweep runs over the binary tree of bit prefixes, all 2^(j+1) prefixes
 * of node j at once, which gives every code's exact level with 2^(N+1) source combinations instead of a
 * matrix solution per code.
 *
 * <p>References: Millman's theorem (e.g. Hayt and Kemmerly, Engineering Circuit Analysis); R-2R ladder
 * (Horowitz and Hill, The Art of Electronics, 3rd ed., 2015).
 */
final class LevelSolver {
    private LevelSolver() {
    }

    /** Scratch arrays for one thread, sized for 2^bits codes. */
    static final class Scratch {
        final double[] first;
        final double[] second;

        Scratch(int bits) {
            first = new double[1 << bits];
            second = new double[1 << bits];
        }
    }

    /**
     * Writes the buffer output in volts of every code into {@code out} (length 2^N).
     *
     * @param ohms resistor values in the order of {@link LadderSpec#parts()}
     */
    static void outputVolts(LadderSpec spec, double[] ohms, double[] out, Scratch scratch) {
        ladderVolts(spec, ohms, out, scratch);
        Buffer buffer = spec.buffer();
        for (int k = 0; k < out.length; k++) {
            out[k] = buffer.apply(out[k]);
        }
    }

    /** Writes the ladder output voltage (buffer input) of every code into {@code out}. */
    static void ladderVolts(LadderSpec spec, double[] ohms, double[] out, Scratch scratch) {
        if (spec.topology().isSumming()) {
            summing(spec, ohms, out, scratch);
        } else if (spec.pinROhmsHigh() == spec.pinROhmsLow()) {
            r2rSuperposition(spec, ohms, out);
        } else {
            r2rTree(spec, ohms, out, scratch);
        }
    }

    private static void summing(LadderSpec spec, double[] ohms, double[] out, Scratch scratch) {
        int bits = spec.bits();
        double vh = spec.logicHighVolts();
        double vl = spec.logicLowVolts();
        double rh = spec.pinROhmsHigh();
        double rl = spec.pinROhmsLow();
        double[] dNum = new double[bits];
        double[] dDen = new double[bits];
        double num0 = 0;
        double den0 = conductance(spec.loadOhms());
        for (int i = 0; i < bits; i++) {
            double gh = 1 / (ohms[i] + rh);
            double gl = 1 / (ohms[i] + rl);
            num0 += gl * vl;
            den0 += gl;
            dNum[i] = gh * vh - gl * vl;
            dDen[i] = gh - gl;
        }
        int n = 1 << bits;
        if (rh == rl) {
            // The denominator is the same for every code: superposition of per-bit steps.
            double[] step = new double[bits];
            for (int i = 0; i < bits; i++) {
                step[i] = dNum[i] / den0;
            }
            out[0] = num0 / den0;
            for (int k = 1; k < n; k++) {
                out[k] = out[k & (k - 1)] + step[Integer.numberOfTrailingZeros(k)];
            }
            return;
        }
        double[] num = scratch.first;
        double[] den = scratch.second;
        num[0] = num0;
        den[0] = den0;
        out[0] = num0 / den0;
        for (int k = 1; k < n; k++) {
            int parent = k & (k - 1);
            int bit = Integer.numberOfTrailingZeros(k);
            num[k] = num[parent] + dNum[bit];
            den[k] = den[parent] + dDen[bit];
            out[k] = num[k] / den[k];
        }
    }

    private static void r2rSuperposition(LadderSpec spec, double[] ohms, double[] out) {
        int bits = spec.bits();
        double r = spec.pinROhmsHigh();
        double[] w = new double[bits];
        // Thévenin sweep from the LSB end: the termination to ground has no source, so only weights move.
        double rt = ohms[2 * bits - 1];
        for (int j = 0; j < bits; j++) {
            if (j > 0) {
                rt += ohms[bits + j - 1];
            }
            double gt = 1 / rt;
            double gs = 1 / (ohms[j] + r);
            double g = gt + gs;
            double keep = gt / g;
            for (int i = 0; i < j; i++) {
                w[i] *= keep;
            }
            w[j] = gs / g;
            rt = 1 / g;
        }
        double loadFactor = loadFactor(rt, spec.loadOhms());
        double vl = spec.logicLowVolts();
        double swing = spec.logicHighVolts() - vl;
        double base = 0;
        double[] step = new double[bits];
        for (int i = 0; i < bits; i++) {
            base += w[i] * vl * loadFactor;
            step[i] = w[i] * swing * loadFactor;
        }
        out[0] = base;
        for (int k = 1; k < out.length; k++) {
            out[k] = out[k & (k - 1)] + step[Integer.numberOfTrailingZeros(k)];
        }
    }

    private static void r2rTree(LadderSpec spec, double[] ohms, double[] out, Scratch scratch) {
        int bits = spec.bits();
        double vh = spec.logicHighVolts();
        double vl = spec.logicLowVolts();
        double rh = spec.pinROhmsHigh();
        double rl = spec.pinROhmsLow();
        double[] vt = out;
        double[] rt = scratch.first;
        vt[0] = 0;
        rt[0] = ohms[2 * bits - 1];
        for (int j = 0; j < bits; j++) {
            double rung = j == 0 ? 0 : ohms[bits + j - 1];
            double gh = 1 / (ohms[j] + rh);
            double gl = 1 / (ohms[j] + rl);
            double ih = gh * vh;
            double il = gl * vl;
            int half = 1 << j;
            for (int c = 0; c < half; c++) {
                // Source (V, R) through the rung, then in parallel with the leg (g, i = g·V_pin):
                // t = R + rung, R' = t/(1 + g·t), V' = (V + i·t)/(1 + g·t): one division per new state.
                double t = rt[c] + rung;
                double v = vt[c];
                double dHigh = 1 / (1 + gh * t);
                double dLow = 1 / (1 + gl * t);
                rt[c + half] = t * dHigh;
                vt[c + half] = (v + ih * t) * dHigh;
                rt[c] = t * dLow;
                vt[c] = (v + il * t) * dLow;
            }
        }
        double load = spec.loadOhms();
        if (!Double.isInfinite(load)) {
            for (int k = 0; k < out.length; k++) {
                out[k] = vt[k] * load / (rt[k] + load);
            }
        }
    }

    private static double conductance(double ohms) {
        return Double.isInfinite(ohms) ? 0 : 1 / ohms;
    }

    private static double loadFactor(double sourceOhms, double loadOhms) {
        return Double.isInfinite(loadOhms) ? 1 : loadOhms / (sourceOhms + loadOhms);
    }
}
