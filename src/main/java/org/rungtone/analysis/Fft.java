package org.rungtone.analysis;

import java.util.concurrent.atomic.AtomicReferenceArray;
import org.rungtone.internal.Checks;

/**
 * The discrete Fourier transform of a power-of-two length, in place on separate real and imaginary arrays:
 * {@code X_k = Σ x_n·e^(−2πi·nk/N)} forward and {@code x_n = (1/N)·Σ X_k·e^(+2πi·nk/N)} back, as the textbook
 * (and Commons Math's {@code DftNormalization.STANDARD}) defines them. Cooley–Tukey decimation in time
 * (J. W. Cooley and J. W. Tukey, Math. Comp. 19, 1965): the input in bit-reversed order, then radix-2 stages
 * taken two at a time ("radix-2²": four points, three twiddle products and a quarter turn), which halves the
 * passes over the data. Each length's twiddle factors are computed once, each directly from cos and sin (no
 * recurrence, so no error builds up along a stage), and shared by every thread. Spectra of long sounds spend
 * most of their time here.
 */
final class Fft {
    /** Twiddle tables by log2 of the length: made on first use, then shared. */
    private static final AtomicReferenceArray<Twiddles> TABLES = new AtomicReferenceArray<>(31);

    private Fft() {
    }

    /** The forward transform of {@code re + i·im}, in place. */
    static void forward(double[] re, double[] im) {
        transform(re, im, false);
    }

    /** The inverse transform of {@code re + i·im} (with the 1/N), in place. */
    static void inverse(double[] re, double[] im) {
        transform(re, im, true);
        int n = re.length;
        double scale = 1.0 / n;
        for (int i = 0; i < n; i++) {
            re[i] *= scale;
            im[i] *= scale;
        }
    }

    private static void checkLengths(int n, int m) {
        Checks.checkArgument(m == n && n >= 1 && Integer.bitCount(n) == 1,
                "a transform needs two arrays of one power-of-two length: %d and %d", n, m);
    }

    private static void transform(double[] re, double[] im, boolean inverse) {
        checkLengths(re.length, im.length);
        Twiddles t = twiddles(Integer.numberOfTrailingZeros(re.length));
        reverseBits(re, im, t.swaps);
        stages(re, im, t, inverse);
    }

    /** The butterflies, on input in bit-reversed order. */
    private static void stages(double[] re, double[] im, Twiddles t, boolean inverse) {
        int n = re.length;
        if (n == 1) {
            return;
        }
        // the sine's sign: e^(∓iθ) = cos θ ∓ i·sin θ
        double sign = inverse ? 1 : -1;
        int stages = Integer.numberOfTrailingZeros(n);
        int h = 1;
        if (stages % 2 == 1) {
            // an odd number of stages: the first alone (its one twiddle is 1)
            for (int i = 0; i < n; i += 2) {
                double ar = re[i];
                double ai = im[i];
                double br = re[i + 1];
                double bi = im[i + 1];
                re[i] = ar + br;
                im[i] = ai + bi;
                re[i + 1] = ar - br;
                im[i + 1] = ai - bi;
            }
            h = 2;
        }
        double[] cos = t.cos;
        double[] sin = t.sin;
        if (h == 1 && n >= 4) {
            firstFour(re, im, sign);
            h = 4;
        }
        for (; h < n; h *= 4) {
            fusedStages(re, im, h, cos, sin, sign);
        }
    }

    /**
     * The stages of half-widths q and 2q as one pass: per group of four points at stride q, the first stage
     * pairs (0, 1) and (2, 3) with twiddle {@code W_2q^j}, the second (0, 2) with {@code W_4q^j} and (1, 3)
     * with {@code W_4q^(j+q) = W_4q^j·(∓i)}. The twiddles of half-width h sit at {@code [h, 2h)} in the tables.
     */
    private static void fusedStages(double[] re, double[] im, int q, double[] cos, double[] sin, double sign) {
        int n = re.length;
        int span = 4 * q;
        // block by block, and within a block point by point: the four points' memory is read in order
        for (int block = 0; block < n; block += span) {
            for (int j = 0; j < q; j++) {
                double w1r = cos[q + j];
                double w1i = sign * sin[q + j];
                double w2r = cos[2 * q + j];
                double w2i = sign * sin[2 * q + j];
                int p0 = block + j;
                int p1 = p0 + q;
                int p2 = p1 + q;
                int p3 = p2 + q;
                double x0r = re[p0];
                double x0i = im[p0];
                double x1r = re[p1];
                double x1i = im[p1];
                double x2r = re[p2];
                double x2i = im[p2];
                double x3r = re[p3];
                double x3i = im[p3];
                // first stage: (0, 1) and (2, 3) by W_2q^j
                double tr = w1r * x1r - w1i * x1i;
                double ti = w1r * x1i + w1i * x1r;
                double ur = w1r * x3r - w1i * x3i;
                double ui = w1r * x3i + w1i * x3r;
                double y0r = x0r + tr;
                double y0i = x0i + ti;
                double y1r = x0r - tr;
                double y1i = x0i - ti;
                double y2r = x2r + ur;
                double y2i = x2i + ui;
                double y3r = x2r - ur;
                double y3i = x2i - ui;
                // second stage: (0, 2) by W_4q^j, (1, 3) by W_4q^j and a quarter turn (−i forward, +i back)
                double vr = w2r * y2r - w2i * y2i;
                double vi = w2r * y2i + w2i * y2r;
                double sr0 = w2r * y3r - w2i * y3i;
                double si0 = w2r * y3i + w2i * y3r;
                // (∓i)·(a + ib) = ±b ∓ ia, with sign = −1 forward
                double sr = -sign * si0;
                double si = sign * sr0;
                re[p0] = y0r + vr;
                im[p0] = y0i + vi;
                re[p2] = y0r - vr;
                im[p2] = y0i - vi;
                re[p1] = y1r + sr;
                im[p1] = y1i + si;
                re[p3] = y1r - sr;
                im[p3] = y1i - si;
            }
        }
    }

    /** {@link #fusedStages} for q = 1, whose twiddles are all 1: four-point transforms without products. */
    private static void firstFour(double[] re, double[] im, double sign) {
        int n = re.length;
        for (int p0 = 0; p0 < n; p0 += 4) {
            double y0r = re[p0] + re[p0 + 1];
            double y0i = im[p0] + im[p0 + 1];
            double y1r = re[p0] - re[p0 + 1];
            double y1i = im[p0] - im[p0 + 1];
            double y2r = re[p0 + 2] + re[p0 + 3];
            double y2i = im[p0 + 2] + im[p0 + 3];
            double y3r = re[p0 + 2] - re[p0 + 3];
            double y3i = im[p0 + 2] - im[p0 + 3];
            double sr = -sign * y3i;
            double si = sign * y3r;
            re[p0] = y0r + y2r;
            im[p0] = y0i + y2i;
            re[p0 + 2] = y0r - y2r;
            im[p0 + 2] = y0i - y2i;
            re[p0 + 1] = y1r + sr;
            im[p0 + 1] = y1i + si;
            re[p0 + 3] = y1r - sr;
            im[p0 + 3] = y1i - si;
        }
    }

    /**
     * Puts element i at the place whose index is i's bits reversed: the swaps listed in the table, one array
     * at a time (each pass then stays within half the memory, which keeps a 32,768-point transform's swaps in
     * the processor's cache).
     */
    private static void reverseBits(double[] re, double[] im, int[] swaps) {
        swap(re, swaps);
        swap(im, swaps);
    }

    private static void swap(double[] a, int[] swaps) {
        for (int s = 0; s < swaps.length; s += 2) {
            int i = swaps[s];
            int j = swaps[s + 1];
            double t = a[i];
            a[i] = a[j];
            a[j] = t;
        }
    }

    private static Twiddles twiddles(int log2) {
        Twiddles t = TABLES.get(log2);
        if (t == null) {
            // two threads may both make it: the same values, either is kept
            TABLES.compareAndSet(log2, null, new Twiddles(1 << log2));
            t = TABLES.get(log2);
        }
        return t;
    }

    /**
     * cos and sin of {@code πj/h} at {@code [h + j]} for every half-width h = 1, 2, 4 .. N/2 and j < h, and
     * the bit-reversal permutation as pairs (i, j), i < j, to swap.
     */
    private static final class Twiddles {
        final double[] cos;
        final double[] sin;
        final int[] swaps;

        Twiddles(int n) {
            cos = new double[Math.max(2, n)];
            sin = new double[Math.max(2, n)];
            for (int h = 1; h < n; h *= 2) {
                for (int j = 0; j < h; j++) {
                    double angle = Math.PI * j / h;
                    cos[h + j] = Math.cos(angle);
                    sin[h + j] = Math.sin(angle);
                }
            }
            int bits = Integer.numberOfTrailingZeros(n);
            int[] pairs = new int[n];
            int count = 0;
            for (int i = 0; i < n; i++) {
                int j = bits == 0 ? 0 : Integer.reverse(i) >>> (32 - bits);
                if (i < j) {
                    pairs[count++] = i;
                    pairs[count++] = j;
                }
            }
            swaps = java.util.Arrays.copyOf(pairs, count);
        }
    }
}
