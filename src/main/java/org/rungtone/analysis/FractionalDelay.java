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
 * every output; outputs are computed in fixed chunks in parallel (the result does not depend on the number
 * of cores).
 */
final class FractionalDelay {
    private static final int CHUNK = 1 << 16;
    /** Shorter outputs are summed directly (see {@link #apply}). */
    static final int DIRECT_BELOW = 1 << 16;

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

    /** The kernel's taps: output n is {@code Σ_k kernel[k]·x[n − first − k]}. */
    double[] kernel() {
        return kernel.clone();
    }

    /** The offset of the kernel's first tap, see {@link #kernel()}. */
    int first() {
        return first;
    }

    /**
     * The first {@code length} samples of {@code x} delayed. The FIR is applied by fast convolution
     * (overlap-save: A. V. Oppenheim and R. W. Schafer, Discrete-Time Signal Processing, 3rd ed., ch. 8):
     * blocks of L input samples are transformed, multiplied by the kernel's spectrum and transformed back,
     * and the last L − taps + 1 outputs of each block are the linear convolution's. Two real blocks share
     * one complex transform (the kernel is real, so the real and imaginary parts stay apart). With 70 taps
     * (a 20 kHz pass edge at 44.1 kHz) and L = 1024 that is about a fifth of the multiplications of the
     * direct sum; the results agree with it to rounding. Below {@value #DIRECT_BELOW} outputs the direct sum
     * is taken instead: in a short run the transform's code would still be interpreted, and costs more.
     */
    double[] apply(double[] x, int length) {
        return length < DIRECT_BELOW ? direct(x, length) : convolved(x, length);
    }

    /** The first {@code length} outputs by fast convolution (see {@link #apply}). */
    double[] convolved(double[] x, int length) {
        double[] y = new double[length];
        int taps = kernel.length;
        int size = Math.max(64, Integer.highestOneBit(8 * taps - 1) << 1);
        int block = size - taps + 1;
        double[] hr = new double[size];
        double[] hi = new double[size];
        System.arraycopy(kernel, 0, hr, 0, taps);
        Fft.forward(hr, hi);
        int chunks = (length + CHUNK - 1) / CHUNK;
        IntStream.range(0, chunks).parallel().forEach(c -> {
            double[] re = new double[size];
            double[] im = new double[size];
            int to = Math.min(length, (c + 1) * CHUNK);
            for (int n0 = c * CHUNK; n0 < to; n0 += 2 * block) {
                int n1 = n0 + block;
                fill(x, n0 - first - (taps - 1), re);
                if (n1 < to) {
                    fill(x, n1 - first - (taps - 1), im);
                } else {
                    java.util.Arrays.fill(im, 0);
                }
                Fft.forward(re, im);
                for (int k = 0; k < size; k++) {
                    double a = re[k];
                    double b = im[k];
                    re[k] = a * hr[k] - b * hi[k];
                    im[k] = a * hi[k] + b * hr[k];
                }
                Fft.inverse(re, im);
                System.arraycopy(re, taps - 1, y, n0, Math.min(block, to - n0));
                if (n1 < to) {
                    System.arraycopy(im, taps - 1, y, n1, Math.min(block, to - n1));
                }
            }
        });
        return y;
    }

    /** The first {@code length} outputs by the direct sum {@code Σ_k kernel[k]·x[n − first − k]}. */
    double[] direct(double[] x, int length) {
        double[] y = new double[length];
        int taps = kernel.length;
        for (int n = 0; n < length; n++) {
            // taps k whose sample n − first − k lies within x
            int kLo = Math.max(0, n - first - (x.length - 1));
            int kHi = Math.min(taps - 1, n - first);
            double acc = 0;
            for (int k = kLo; k <= kHi; k++) {
                acc += kernel[k] * x[n - first - k];
            }
            y[n] = acc;
        }
        return y;
    }

    /** {@code dst[i] = x[from + i]}, zero where that lies outside x. */
    private static void fill(double[] x, int from, double[] dst) {
        int lo = Math.max(0, -from);
        int hi = Math.max(lo, Math.min(dst.length, x.length - from));
        java.util.Arrays.fill(dst, 0, lo, 0);
        if (hi > lo) {
            System.arraycopy(x, from + lo, dst, lo, hi - lo);
        }
        java.util.Arrays.fill(dst, hi, dst.length, 0);
    }
}
