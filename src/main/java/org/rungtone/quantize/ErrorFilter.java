package org.rungtone.quantize;

import java.util.Arrays;
import org.rungtone.internal.Checks;

/**
 * The error-feedback filter of a noise-shaping quantizer: the value sent to the quantizer is
 * {@code v[n] = x[n] − Σ h[k]·e[n−1−k]}, where {@code e = y − v} is the quantizer's own error, so the
 * output error has the noise transfer function {@code NTF(z) = 1 − Σ h[k] z^−(k+1)}.
 *
 * <p>First order, {@code h = {1}}, gives {@code NTF = 1 − z^−1} with {@code |NTF| = 2·sin(ω/2)}: error pushed
 * to high frequencies, total error power doubled (Gerzon, Craven, "Optimal Noise Shaping and Dither of
 * Digital Signals", AES preprint 2822, 1989). Second order, {@code h = {2, −1}}, gives {@code (1 − z^−1)²}.
 *
 * <p>Headroom: the feedback moves the value sent to the quantizer away from the signal by
 * {@code |Σ h[k]·e[n−1−k]| ≤ Σ|h[k]|·max|e|} ({@link #absoluteTapSum}). Without dither and while the
 * quantizer is not overloaded {@code |e| ≤ q/2}, so the excursion is at most {@code Σ|h[k]|·q/2}: q/2 for
 * first order, 3q/2 for second order (the error-feedback loop of Gerzon and Craven, 1989, bounded term by
 * term). Dither inside the loop widens the error bound by the dither's peak (½ LSB RPDF, 1 LSB TPDF).
 * {@link Quantizer} leaves that room by default so a loud signal does not overload the loop.
 */
public final class ErrorFilter {
    /** No shaping: plain quantization. */
    public static final ErrorFilter NONE = new ErrorFilter("none", new double[0]);
    /** First-order shaping, NTF = 1 − z^−1. */
    public static final ErrorFilter FIRST_ORDER = new ErrorFilter("first-order", new double[] {1});
    /** Second-order shaping, NTF = (1 − z^−1)². */
    public static final ErrorFilter SECOND_ORDER = new ErrorFilter("second-order", new double[] {2, -1});

    private final String name;
    private final double[] taps;

    private ErrorFilter(String name, double[] taps) {
        this.name = name;
        this.taps = taps;
    }

    /**
     * The filter an option or project key names: none, first or second (order).
     *
     * @throws org.rungtone.internal.InputError for any other name
     */
    public static ErrorFilter parse(String text) {
        switch (text.toLowerCase(java.util.Locale.ROOT)) {
            case "none":
                return NONE;
            case "first":
                return FIRST_ORDER;
            case "second":
                return SECOND_ORDER;
            default:
                throw org.rungtone.internal.Setting.SHAPING.error("must be none, first or second: %s", text);
        }
    }

    /**
     * A user-given FIR error filter h[0..K−1] (h[0] weights the previous sample's error).
     *
     * @throws IllegalArgumentException when there are more than 32 taps or a tap is not finite
     */
    public static ErrorFilter fir(double... taps) {
        Checks.checkArgument(taps.length <= 32, "an error filter has at most 32 taps: %d", taps.length);
        for (double t : taps) {
            Checks.checkArgument(Double.isFinite(t), "error filter taps must be finite: %s", t);
        }
        return new ErrorFilter("fir" + Arrays.toString(taps), taps.clone());
    }

    /** Name for reports. */
    public String name() {
        return name;
    }

    /** A copy of the taps. */
    public double[] taps() {
        return taps.clone();
    }

    /** Number of taps; 0 means no shaping. */
    public int order() {
        return taps.length;
    }

    double tap(int k) {
        return taps[k];
    }

    /**
     * {@code Σ|h[k]|}: the largest factor by which the fed-back errors can add up, so the feedback moves the
     * quantizer's input by at most this times the largest error (0 without shaping, 1 first order, 3 second).
     */
    public double absoluteTapSum() {
        double sum = 0;
        for (double t : taps) {
            sum += Math.abs(t);
        }
        return sum;
    }

    /** |NTF(e^jω)| at normalised angular frequency ω (radians per sample). */
    public double noiseGain(double omega) {
        double re = 1;
        double im = 0;
        for (int k = 0; k < taps.length; k++) {
            re -= taps[k] * Math.cos(omega * (k + 1));
            im += taps[k] * Math.sin(omega * (k + 1));
        }
        return Math.hypot(re, im);
    }

    @Override
    public String toString() {
        return name;
    }
}
