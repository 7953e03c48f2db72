package org.rungtone.calibrate;

import java.util.Arrays;
import org.rungtone.internal.Checks;

/**
 * The switched-load model {@code V(k) = (c + Σ_i b_i(k)·a_i) / (1 + Σ_i b_i(k)·d_i)}: each pin is a source
 * whose conductance into the summing node differs between high and low, so the node's total conductance,
 * and with it every other bit's share, depends on the code. By Millman's theorem
 * {@code V = Σ g_i·V_i / (g_load + Σ g_i)} (e.g. Hayt and Kemmerly, Engineering Circuit Analysis) this is
 * exact for a single-node (weighted or custom) ladder with unequal pin resistances and any load, divided
 * through by the all-low conductance: {@code d_i = (g_i,high − g_i,low)/G_0}. An output buffer's gain and
 * offset keep the form. For an R-2R ladder it is the first-order form of the exact ratio of multilinear
 * polynomials. Parameters: c, then a_0 .. a_{N−1} (volts), then d_0 .. d_{N−1} (no unit).
 */
public final class SwitchedLoad implements BoardModel {
    private final double c;
    private final double[] a;
    private final double[] d;

    /**
     * A model from its parameters, bit 0 first.
     *
     * @throws IllegalArgumentException when the lists differ in length or a value is not finite
     */
    public SwitchedLoad(double c, double[] a, double[] d) {
        Checks.checkArgument(a.length == d.length && a.length >= 1 && a.length <= 16,
                "need 1..16 numerator and load terms of equal count: %d and %d", a.length, d.length);
        Checks.checkArgument(Double.isFinite(c), "offset term is not finite");
        for (int i = 0; i < a.length; i++) {
            Checks.checkArgument(Double.isFinite(a[i]) && Double.isFinite(d[i]), "bit %d terms are not finite", i);
        }
        this.c = c;
        this.a = a.clone();
        this.d = d.clone();
    }

    /** The model from the parameter vector {@code [c, a_0 .. a_{N−1}, d_0 .. d_{N−1}]}. */
    static SwitchedLoad ofParameters(double[] theta) {
        int n = (theta.length - 1) / 2;
        return new SwitchedLoad(theta[0], Arrays.copyOfRange(theta, 1, 1 + n), Arrays.copyOfRange(theta, 1 + n,
                1 + 2 * n));
    }

    @Override
    public String key() {
        return "switched-load";
    }

    @Override
    public int bits() {
        return a.length;
    }

    @Override
    public double volts(int code) {
        double num = c;
        double den = 1;
        for (int i = 0; i < a.length; i++) {
            if ((code >> i & 1) != 0) {
                num += a[i];
                den += d[i];
            }
        }
        return num / den;
    }

    @Override
    public double[] levels() {
        int n = 1 << a.length;
        double[] num = new double[n];
        double[] den = new double[n];
        double[] v = new double[n];
        num[0] = c;
        den[0] = 1;
        v[0] = c;
        for (int k = 1; k < n; k++) {
            int parent = k & (k - 1);
            int bit = Integer.numberOfTrailingZeros(k);
            num[k] = num[parent] + a[bit];
            den[k] = den[parent] + d[bit];
            v[k] = num[k] / den[k];
        }
        return v;
    }

    @Override
    public int parameterCount() {
        return 2 * a.length + 1;
    }

    @Override
    public double[] parameters() {
        double[] p = new double[2 * a.length + 1];
        p[0] = c;
        System.arraycopy(a, 0, p, 1, a.length);
        System.arraycopy(d, 0, p, 1 + a.length, a.length);
        return p;
    }

    /** The numerator terms c, a_0 .. a_{N−1}, volts. */
    public double[] numeratorVolts() {
        double[] p = new double[a.length + 1];
        p[0] = c;
        System.arraycopy(a, 0, p, 1, a.length);
        return p;
    }

    /** The load terms d_0 .. d_{N−1}: each pin's relative change of the node's conductance when high. */
    public double[] loadTerms() {
        return d.clone();
    }
}
