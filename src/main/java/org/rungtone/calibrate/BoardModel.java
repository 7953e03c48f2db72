package org.rungtone.calibrate;

/**
 * A fitted description of one board's transfer: the output level of every code from a few parameters.
 * Two kinds: {@link Superposition} (offset plus one step per bit) and {@link SwitchedLoad} (each pin's
 * source conductance changes with its level, so the steps interact through the common node).
 */
public sealed interface BoardModel permits Superposition, SwitchedLoad {
    /** The model's name in reports and profiles: "superposition" or "switched-load". */
    String key();

    /** Bit depth N. */
    int bits();

    /** The modelled level of one code, volts. */
    double volts(int code);

    /** The number of fitted parameters. */
    int parameterCount();

    /** The fitted parameters, a copy, in the model's documented order. */
    double[] parameters();

    /** The modelled level of every code, index = code. */
    default double[] levels() {
        double[] v = new double[1 << bits()];
        for (int k = 0; k < v.length; k++) {
            v[k] = volts(k);
        }
        return v;
    }

    /** The level of code 0, volts. */
    default double offsetVolts() {
        return volts(0);
    }

    /** How far one bit alone moves the output from code 0, volts. */
    default double stepVolts(int bit) {
        return volts(1 << bit) - volts(0);
    }
}
