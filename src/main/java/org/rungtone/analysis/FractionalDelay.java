package org.rungtone.analysis;

import java.util.stream.IntStream;
import org.rungtone.internal.Bessel;
import org.rungtone.internal.Checks;

/**
 * Delays a signal by any number of samples, whole or not, and band-limits it: one Kaiser-windowed sinc
 * low-pass evaluated at the fractional offset (J. F. Kaiser, "Nonrecursive Digital Filter Design Using the
 * I0-sinh Window Function", Proc. IEEE ISCAS 1974: half-length {@code (A − 8)/(2.285·Δω)/2}, {@code β =
 * 0.1102·(A − 8.7)}), flat to the pass edge and at least A dB down at half the rate. Samples outside the
 * input are zero. The same kernel serves every output, so this costs one short FIR per sample; outputs are
 * computed in fixed chunks in parallel (the result does not depend on the number of cores).
 */
final class FractionalDelay {
    private static final int CHUNK = 1 << 16;

    private final double[] kernel;
    private final int first;

    /**
     * A delay of {@code delaySamples} that passes up to {@code passHz} at {@code sampleRateHz} and stops
     * {@code attenuationDb} from half the rate.
     *
     * @throws IllegalArgumentException when the pass edge is not below half the rate
     */
    FractionalDelay(double delaySamples, double sampleRateHz, double passHz, double attenuationDb) {
        Checks.checkArgument(passHz > 0 && passHz < sampleRateHz / 2, "pass edge must be below half the rate");
        double stopHz = sampleRateHz / 2;
        double dw = 2 * Math.PI * (stopHz - passHz) / sampleRateHz;
        double half = Math.ceil((attenuationDb - 8) / (2.285 * dw) / 2);
        double beta = 0.1102 * (attenuationDb - 8.7);
        double fc = 0.5 * (passHz + stopHz) / sampleRateHz;
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

    /** The first {@code length} samples of {@code x} delayed and band-limited. */
    double[] apply(double[] x, int length) {
        double[] y = new double[length];
        int chunks = (length + CHUNK - 1) / CHUNK;
        IntStream.range(0, chunks).parallel().forEach(c -> {
            int to = Math.min(length, (c + 1) * CHUNK);
            for (int n = c * CHUNK; n < to; n++) {
                // x index of tap j: n − first − j
                int top = n - first;
                double acc = 0;
                int jFrom = Math.max(0, top - (x.length - 1));
                int jTo = Math.min(kernel.length - 1, top);
                for (int j = jFrom; j <= jTo; j++) {
                    acc += kernel[j] * x[top - j];
                }
                y[n] = acc;
            }
        });
        return y;
    }
}
