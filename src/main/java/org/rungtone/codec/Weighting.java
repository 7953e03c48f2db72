package org.rungtone.codec;

import java.util.ArrayList;
import java.util.List;
import org.rungtone.internal.Checks;

/**
 * How the Tread encoder weighs its error: the squared output of a weighting filter on the error plus the plain
 * squared error, in equal parts, so that the error the A-weighted figures count and the error the in-band
 * figures count both weigh, and no band, DC included, is free. (Measured on the benchmark material, the A
 * weighting alone let low-frequency error grow until the decoder clamped; the sum did better than either.)
 *
 * <p>The A weighting is that of IEC 61672-1:2013, {@code A(s) = G·s⁴ / ((s + ω1)²(s + ω2)(s + ω3)(s + ω4)²)}
 * with f1 = 20.60 Hz, f2 = 107.7 Hz, f3 = 737.9 Hz, f4 = 12194 Hz, taken to the sample rate by the bilinear
 * transform {@code s = 2·fs·(1 − z⁻¹)/(1 + z⁻¹)} (Oppenheim and Schafer, Discrete-Time Signal Processing),
 * as three biquads, normalised to 0 dB at 1 kHz (or at rate/4 when 1 kHz is not below rate/2). The warp of the
 * transform near rate/2 makes it an approximation there; the encoder needs only the weights' shape. When the
 * in-band figures stop below rate/2 (a reconstruction filter), a second-order Butterworth low-pass at that
 * cutoff follows, so error the filter removes costs little.
 *
 * <p>Filters run in transposed direct form II; each biquad keeps two state values, which the encoder keeps
 * per search path.
 */
public final class Weighting {
    /** The weight of the plain squared error added to the weighted one. */
    static final double FLOOR = 1;
    private static final double F1 = 20.60;
    private static final double F2 = 107.7;
    private static final double F3 = 737.9;
    private static final double F4 = 12194;

    private final String name;
    /** Per biquad: b0, b1, b2, a1, a2 (a0 = 1). */
    private final double[] coefficients;
    private final double floor;

    private Weighting(String name, List<double[]> biquads, double floor) {
        this.name = name;
        this.coefficients = new double[biquads.size() * 5];
        for (int i = 0; i < biquads.size(); i++) {
            System.arraycopy(biquads.get(i), 0, coefficients, 5 * i, 5);
        }
        this.floor = floor;
    }

    /** The plain squared error: every frequency weighs the same. */
    public static Weighting flat() {
        return new Weighting("flat", List.of(), 0);
    }

    /**
     * The A weighting at {@code rateHz}, followed by a low-pass at {@code inBandCutoffHz} when that is below
     * rate/2.
     *
     * @throws IllegalArgumentException when a frequency is not positive
     */
    public static Weighting aWeighted(double rateHz, double inBandCutoffHz) {
        Checks.checkArgument(rateHz > 0 && inBandCutoffHz > 0, "rate and cutoff must be positive: %s, %s", rateHz,
                inBandCutoffHz);
        double k = 2 * rateHz;
        double w1 = 2 * Math.PI * F1;
        double w2 = 2 * Math.PI * F2;
        double w3 = 2 * Math.PI * F3;
        double w4 = 2 * Math.PI * F4;
        List<double[]> biquads = new ArrayList<>();
        biquads.add(product(highPass(k, w1), highPass(k, w1)));
        biquads.add(product(highPass(k, w2), highPass(k, w3)));
        biquads.add(product(lowPass(k, w4), lowPass(k, w4)));
        if (inBandCutoffHz < rateHz / 2 * (1 - 1e-9)) {
            biquads.add(butterworth(rateHz, inBandCutoffHz));
        }
        double reference = 1000 < rateHz / 2 ? 1000 : rateHz / 4;
        Weighting unscaled = new Weighting("A", biquads, FLOOR);
        double g = 1 / unscaled.gain(reference / rateHz);
        double[] first = biquads.get(0);
        for (int i = 0; i < 3; i++) {
            first[i] *= g;
        }
        return new Weighting("A", biquads, FLOOR);
    }

    /** Its name for reports: flat or A. */
    public String name() {
        return name;
    }

    /** State values a filter keeps: two per biquad. */
    int stateSize() {
        return coefficients.length / 5 * 2;
    }

    /** The weight of the plain squared error. */
    double floor() {
        return floor;
    }

    /**
     * The filter's output for input 0 given the state at {@code state[offset ..]}: its output for input e is
     * {@code gain()·e} plus this, so the cost of every candidate error costs one multiply-add.
     */
    double bias(double[] state, int offset) {
        double y = 0;
        double[] c = coefficients;
        for (int i = 0, s = offset; i < c.length; i += 5, s += 2) {
            y = c[i] * y + state[s];
        }
        return y;
    }

    /** The filter's immediate gain: the product of the biquads' b0 (1 without biquads). */
    double gain() {
        double g = 1;
        for (int i = 0; i < coefficients.length; i += 5) {
            g *= coefficients[i];
        }
        return g;
    }

    /** The weighted squared error of input {@code e} whose filter output is {@code gain()·e + bias}. */
    double cost(double e, double gain, double bias) {
        double y = gain * e + bias;
        return y * y + floor * e * e;
    }

    /** Runs input {@code e} through the filter, updating {@code state[offset ..]}. */
    void update(double e, double[] state, int offset) {
        double x = e;
        double[] c = coefficients;
        for (int i = 0, s = offset; i < c.length; i += 5, s += 2) {
            double y = c[i] * x + state[s];
            state[s] = c[i + 1] * x - c[i + 3] * y + state[s + 1];
            state[s + 1] = c[i + 2] * x - c[i + 4] * y;
            x = y;
        }
    }

    /** |W(e^jω)| at {@code cyclesPerSample} (0 .. 0.5), the floor left out. */
    public double gain(double cyclesPerSample) {
        double w = 2 * Math.PI * cyclesPerSample;
        double re = 1;
        double im = 0;
        double[] c = coefficients;
        for (int i = 0; i < c.length; i += 5) {
            double nr = c[i] + c[i + 1] * Math.cos(w) + c[i + 2] * Math.cos(2 * w);
            double ni = -c[i + 1] * Math.sin(w) - c[i + 2] * Math.sin(2 * w);
            double dr = 1 + c[i + 3] * Math.cos(w) + c[i + 4] * Math.cos(2 * w);
            double di = -c[i + 3] * Math.sin(w) - c[i + 4] * Math.sin(2 * w);
            double den = dr * dr + di * di;
            double qr = (nr * dr + ni * di) / den;
            double qi = (ni * dr - nr * di) / den;
            double r = re * qr - im * qi;
            im = re * qi + im * qr;
            re = r;
        }
        return Math.hypot(re, im);
    }

    /** s/(s + ω) by the bilinear transform: {b0, b1, a1}. */
    private static double[] highPass(double k, double w) {
        return new double[] {k / (k + w), -k / (k + w), (w - k) / (k + w)};
    }

    /** ω/(s + ω) by the bilinear transform: {b0, b1, a1}. */
    private static double[] lowPass(double k, double w) {
        return new double[] {w / (k + w), w / (k + w), (w - k) / (k + w)};
    }

    /** Two first-order sections as one biquad. */
    private static double[] product(double[] p, double[] q) {
        return new double[] {p[0] * q[0], p[0] * q[1] + p[1] * q[0], p[1] * q[1], p[2] + q[2], p[2] * q[2]};
    }

    /** Second-order Butterworth low-pass, bilinear with the cutoff prewarped. */
    private static double[] butterworth(double rateHz, double cutoffHz) {
        double c = 1 / Math.tan(Math.PI * cutoffHz / rateHz);
        double r = Math.sqrt(2);
        double a0 = 1 + r * c + c * c;
        return new double[] {1 / a0, 2 / a0, 1 / a0, 2 * (1 - c * c) / a0, (1 - r * c + c * c) / a0};
    }

    @Override
    public String toString() {
        return name;
    }
}
