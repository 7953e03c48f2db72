package org.rungtone.analysis;

import java.util.stream.IntStream;
import org.rungtone.internal.Bessel;
import org.rungtone.internal.Checks;

/**
 * Delays a signal by any number of samples, whole or not: the band-limited interpolation
 * {@code y[n] = Σ x[m]·sinc(n − d − m)} with the sinc shortened by a Kaiser window (J. F. Kaiser,
 * "Nonrecursive Digital Filter Design Using the I0-sinh Window Function", Proc. IEEE ISCAS 1974: half-length
 * {@code (A − 8)/(2.285·Δω)/2}, {@code β = 0.1102·(A − 8.7)}). The sinc's cutoff is half the rate and its
 * transition is centred there, so the delay is exact to A dB up to the pass edge, and only the band above
 * it, which the caller does not use, is shaped. Samples outside the input are zero. The same kernel serves
 * every output, so this costs one short FIR per sample; outputs are computed in fixed chunks in parallel
 * (the result does not depend on the number of cores).
 */
final class FractionalDelay {
    private static final int CHUNK = 1 << 16;

    private final double[] kernel;
    private final int first;

    /**
     * A delay of {@code delaySamples} exact to {@code attenuationDb} up to {@code passHz} at
     * {@code sampleRateHz}.
     *
     * @throws IllegalArgumentException when the pass edge is not below half the rate
     */
    FractionalDelay(double delaySamples, double sampleRateHz, double passHz, double attenuationDb) {
        Checks.checkArgument(passHz > 0 && passHz < sampleRateHz / 2, "pass edge must be below half the rate");
        // transition from the pass edge to its mirror image about half the rate
        double dw = 2 * Math.PI * 2 * (sampleRateHz / 2 - passHz) / sampleRateHz;
        double half = Math.ceil((attenuationDb - 8) / (2.285 * dw) / 2);
        double beta = 0.1102 * (attenuationDb - 8.7);
        double fc = 0.5;
        double whole = Math.floor(delaySamples);
        double frac = delaySamples - whole;
        // y[n] = Σ_k h(k − frac)·x[n − whole − k]: taps k = −half + 1 .. half
        int taps = 2 * (int) half;
        kernel = new double[taps];
        double i0Beta = Bessel.i0(beta);
        for (int j = 0; j < taps; j++) {
            double t = j - half + 1 - frac;
            double u = t / half;
            double x = 2 * fc * t;
            double sinc = x == 0 ? 1 : Math.sin(Math.PI * x) / (Math.PI * x);
            kernel[j] = Math.abs(u) >= 1 ? 0 : 2 * fc * sinc * Bessel.i0(beta * Math.sqrt(1 - u * u)) / i0Beta;
        }
        first = (int) (whole - half + 1);
    }

    /** The first {@code length} samples of {@code x} delayed. */
    double[] apply(double[] x, int length) {
        double[] y = new double[length];
        // taps reversed, so that output n reads x[n − first − (taps − 1) ..] forwards
        int taps = kernel.length;
        double[] reversed = new double[taps];
        for (int j = 0; j < taps; j++) {
            reversed[j] = kernel[taps - 1 - j];
        }
        int chunks = (length + CHUNK - 1) / CHUNK;
        IntStream.range(0, chunks).parallel().forEach(c -> {
            int to = Math.min(length, (c + 1) * CHUNK);
            for (int n = c * CHUNK; n < to; n++) {
                int base = n - first - (taps - 1);
                if (base >= 0 && base + taps <= x.length) {
                    y[n] = dot(reversed, x, base);
                } else {
                    double acc = 0;
                    for (int j = Math.max(0, -base); j < taps && base + j < x.length; j++) {
                        acc += reversed[j] * x[base + j];
                    }
                    y[n] = acc;
                }
            }
        });
        return y;
    }

    /** {@code Σ k[j]·x[base + j]} with two partial sums (independent additions overlap in the CPU). */
    private static double dot(double[] k, double[] x, int base) {
        double a0 = 0;
        double a1 = 0;
        int j = 0;
        for (; j + 1 < k.length; j += 2) {
            a0 += k[j] * x[base + j];
            a1 += k[j + 1] * x[base + j + 1];
        }
        if (j < k.length) {
            a0 += k[j] * x[base + j];
        }
        return a0 + a1;
    }
}
