package org.rungtone.calibrate;

import org.rungtone.internal.Checks;

/**
 * The superposition model {@code V(k) = V0 + Σ_i b_i(k)·w_i}: an offset and one step per bit, exact for a
 * linear network whose pins have equal high and low output resistance (IEEE Std 1658-2011 calls the w_i
 * the bit weights). Parameters: V0, then w_0 .. w_{N−1}.
 */
public final class Superposition implements BoardModel {
    private final double offsetVolts;
    private final double[] steps;

    /**
     * A model from its offset and per-bit steps, bit 0 first.
     *
     * @throws IllegalArgumentException when a value is not finite or there are not 1..16 steps
     */
    public Superposition(double offsetVolts, double[] stepVolts) {
        Checks.checkArgument(stepVolts.length >= 1 && stepVolts.length <= 16, "need 1..16 bit steps: %d",
                stepVolts.length);
        Checks.checkArgument(Double.isFinite(offsetVolts), "offset is not finite");
        for (double w : stepVolts) {
            Checks.checkArgument(Double.isFinite(w), "a bit step is not finite");
        }
        this.offsetVolts = offsetVolts;
        this.steps = stepVolts.clone();
    }

    /** The model from the parameter vector {@code [V0, w_0 .. w_{N−1}]}. */
    static Superposition ofParameters(double[] theta) {
        return new Superposition(theta[0], java.util.Arrays.copyOfRange(theta, 1, theta.length));
    }

    @Override
    public String key() {
        return "superposition";
    }

    @Override
    public int bits() {
        return steps.length;
    }

    @Override
    public double volts(int code) {
        double v = offsetVolts;
        for (int i = 0; i < steps.length; i++) {
            if ((code >> i & 1) != 0) {
                v += steps[i];
            }
        }
        return v;
    }

    @Override
    public double[] levels() {
        double[] v = new double[1 << steps.length];
        v[0] = offsetVolts;
        for (int k = 1; k < v.length; k++) {
            v[k] = v[k & (k - 1)] + steps[Integer.numberOfTrailingZeros(k)];
        }
        return v;
    }

    @Override
    public int parameterCount() {
        return steps.length + 1;
    }

    @Override
    public double[] parameters() {
        double[] p = new double[steps.length + 1];
        p[0] = offsetVolts;
        System.arraycopy(steps, 0, p, 1, steps.length);
        return p;
    }

    @Override
    public double offsetVolts() {
        return offsetVolts;
    }

    @Override
    public double stepVolts(int bit) {
        return steps[bit];
    }
}
