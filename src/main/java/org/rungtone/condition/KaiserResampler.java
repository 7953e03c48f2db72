package org.rungtone.condition;

import java.util.stream.IntStream;
import org.rungtone.internal.Checks;
import org.rungtone.source.SampleSource;
import org.rungtone.source.Signal;

/**
 * A polyphase windowed-sinc resampler with a Kaiser window whose stopband attenuation is chosen by the
 * caller, typically from the target bit depth so that aliases sit below the quantization noise.
 *
 * <p>Each output sample at input time t is {@code Σ x[k]·h(t − k)}, with
 * h the {@link KaiserKernel} (its window length, β and window are designed there, for every resampler).
 * The passband ends at {@code passbandFraction} of the lower Nyquist frequency and the stopband starts at
 * that Nyquist frequency.
 * When the ratio of the rates is a fraction with a denominator of at most 4096 every output phase has its
 * own exact coefficient row; otherwise 1024 rows are interpolated linearly. Output samples are computed in
 * parallel blocks across the available cores; results do not depend on the number of cores.
 *
 * <p>Going down by more than about two, halving stages may run first (multistage decimation, R. E.
 * Crochiere and L. R. Rabiner, Multirate Digital Signal Processing, 1983, ch. 5): a halving stage at rate r
 * keeps the passband and stops from r/2 − fout/2 with the same attenuation, so nothing it folds reaches the
 * final band, and the last stage's narrow transition then runs at a lower rate with fewer taps. The number of
 * halvings is the one that needs the fewest multiplies per output by the tap counts above; 44.1 → 16 kHz at
 * 62 dB takes 26 + 104 taps (36 multiplies per output for the first) instead of 208.
 */
public final class KaiserResampler implements Resampler {
    private static final int MAX_EXACT_PHASES = 4096;
    private static final int INTERPOLATED_PHASES = 1024;
    private static final int BLOCK = 8192;

    private final double stopbandDb;
    private final double passbandFraction;

    /**
     * A resampler with the given stopband attenuation (40..160 dB) and passband edge as a fraction of the
     * lower Nyquist frequency (0.5..0.98).
     */
    public KaiserResampler(double stopbandDb, double passbandFraction) {
        Checks.checkArgument(stopbandDb >= 40 && stopbandDb <= 160, "stopband must be 40..160 dB: %s",
                stopbandDb);
        Checks.checkArgument(passbandFraction >= 0.5 && passbandFraction <= 0.98,
                "passband fraction must be 0.5..0.98: %s", passbandFraction);
        this.stopbandDb = stopbandDb;
        this.passbandFraction = passbandFraction;
    }

    /**
     * A resampler whose aliases sit below the quantization noise of an N-bit target: stopband
     * 6.02·N + 1.76 dB plus a 12 dB margin (the margin is common practice, no source), at least 60 dB.
     */
    public static KaiserResampler forBits(int bits) {
        return new KaiserResampler(Math.min(150, Math.max(60, 6.02 * bits + 1.76 + 12)), 0.9);
    }

    @Override
    public String name() {
        return String.format(java.util.Locale.ROOT, "kaiser polyphase, %.0f dB stopband", stopbandDb);
    }

    @Override
    public Signal resample(Signal signal, double targetRateHz) {
        return signal.sampleRateHz() == targetRateHz ? signal
                : resample(SampleSource.of(signal), 0, signal.length(), targetRateHz);
    }

    /**
     * Resamples a range of a source block by block: each block of output samples reads just the input it
     * needs (its span plus the filter's half-length either side), so a file-backed source is decoded in
     * parallel pieces and never held whole. A damaged sample is reported for the earliest block that meets
     * it, so the message names the first bad sample whatever the number of cores.
     */
    @Override
    public Signal resample(SampleSource source, int from, int to, double targetRateHz) {
        Checks.checkArgument(Double.isFinite(targetRateHz) && targetRateHz > 0,
                "target rate must be positive: %s", targetRateHz);
        Checks.checkArgument(from >= 0 && to <= source.length() && from <= to, "bad range %d..%d", from, to);
        double fin = source.sampleRateHz();
        if (fin == targetRateHz) {
            return source.read(from, to);
        }
        double step = fin / targetRateHz;
        int length = to - from;
        int outLen = (int) Math.ceil(length / step - 1e-9);
        java.util.List<Kernel> stages = stages(fin, targetRateHz);
        int count = stages.size();
        // Lengths of the signal at each level: the input range, the halved intermediates, the output.
        long[] lengths = new long[count + 1];
        lengths[0] = length;
        for (int s = 0; s < count; s++) {
            lengths[s + 1] = s == count - 1 ? outLen : (long) Math.ceil(lengths[s] / stages.get(s).step - 1e-9);
        }
        double[] y = new double[outLen];
        int blocks = (outLen + BLOCK - 1) / BLOCK;
        RuntimeException[] failures = new RuntimeException[blocks];
        IntStream.range(0, blocks).parallel().forEach(b -> {
            // The range each level must supply for this block of outputs, from the output back to the input.
            long[] lo = new long[count + 1];
            long[] hi = new long[count + 1];
            lo[count] = (long) b * BLOCK;
            hi[count] = Math.min(outLen, lo[count] + BLOCK);
            for (int s = count - 1; s >= 0; s--) {
                Kernel k = stages.get(s);
                lo[s] = Math.max(0, k.base(lo[s + 1]) - k.half + 1);
                hi[s] = Math.min(lengths[s], k.base(hi[s + 1] - 1) + k.half + 1);
                hi[s] = Math.max(lo[s], hi[s]);
            }
            double[] x = new double[(int) (hi[0] - lo[0])];
            try {
                source.read(from + (int) lo[0], x, 0, x.length);
            } catch (RuntimeException e) {
                failures[b] = e;
                return;
            }
            for (int s = 0; s < count; s++) {
                Kernel k = stages.get(s);
                boolean last = s == count - 1;
                double[] next = last ? y : new double[(int) (hi[s + 1] - lo[s + 1])];
                int shift = last ? 0 : (int) lo[s + 1];
                int at = (int) -lo[s];
                int len = (int) lengths[s];
                k.run(x, at, len, lo[s + 1], hi[s + 1], next, shift);
                x = next;
            }
        });
        for (RuntimeException e : failures) {
            if (e != null) {
                throw e;
            }
        }
        return Signal.wrap(y, targetRateHz);
    }

    /**
     * The filter stages from {@code fin} to {@code fout}: one polyphase filter, or when it costs fewer
     * multiplies per output, halving stages first. A halving stage at rate r keeps the passband and stops from
     * r/2 − fout/2, so that what it folds lands above the final Nyquist frequency and the last stage removes
     * it; the last stage's narrow transition then runs at a lower rate, where it needs fewer taps.
     */
    private java.util.List<Kernel> stages(double fin, double fout) {
        double nyquist = Math.min(fin, fout) / 2;
        double pass = passbandFraction * nyquist;
        int halvings = halvings(fin, fout);
        java.util.List<Kernel> stages = new java.util.ArrayList<>();
        double rate = fin;
        for (int h = 0; h < halvings; h++) {
            stages.add(new Kernel(rate, rate / 2, pass, rate / 2 - fout / 2, new long[] {2, 1}));
            rate /= 2;
        }
        stages.add(new Kernel(rate, fout, pass, nyquist, fraction(fin, fout * (1L << halvings))));
        return stages;
    }

    /** How many halving stages need the fewest multiplies per output, from the tap counts alone. */
    private int halvings(double fin, double fout) {
        double nyquist = Math.min(fin, fout) / 2;
        double pass = passbandFraction * nyquist;
        int best = 0;
        double bestCost = tapsFor(fin, pass, nyquist) * (isExact(fraction(fin, fout)) ? 1 : 2);
        double rate = fin;
        double halvingCost = 0;
        for (int h = 1; rate / 2 > fout; h++) {
            halvingCost += tapsFor(rate, pass, rate / 2 - fout / 2) * (rate / 2) / fout;
            rate /= 2;
            double last = tapsFor(rate, pass, fout / 2) * (isExact(fraction(fin, fout * (1L << h))) ? 1 : 2);
            if (halvingCost + last < bestCost) {
                bestCost = halvingCost + last;
                best = h;
            }
        }
        return best;
    }

    @Override
    public String describe(double fromHz, double toHz) {
        int halvings = fromHz == toHz ? 0 : halvings(fromHz, toHz);
        return halvings == 0 ? name() : name() + (halvings == 1 ? ", halving first" : ", halving " + halvings
                + " times first");
    }

    /** How many filters run from {@code fin} to {@code fout} (for tests). */
    int stageCount(double fin, double fout) {
        return fin == fout ? 0 : halvings(fin, fout) + 1;
    }

    private static boolean isExact(long[] frac) {
        return frac != null && frac[1] <= MAX_EXACT_PHASES;
    }

    /** Taps of a Kaiser low-pass at rate {@code fin} from {@code passHz} to {@code stopHz}. */
    private int tapsFor(double fin, double passHz, double stopHz) {
        return 2 * KaiserKernel.halfWidth(fin, passHz, stopHz, stopbandDb);
    }

    /** The coefficient table for one pair of rates. */
    private final class Kernel {
        private final int taps;
        private final int half;
        private final double[][] rows;
        private final boolean exact;
        private final long num;
        private final long den;
        private final double step;

        /** A low-pass from rate {@code fin} to {@code fout}, flat to {@code passHz}, stopped from {@code stopHz}. */
        Kernel(double fin, double fout, double passHz, double stopHz, long[] frac) {
            step = fin / fout;
            KaiserKernel h = KaiserKernel.lowPass(fin, passHz, stopHz, stopbandDb);
            half = h.halfWidth();
            taps = 2 * half;
            exact = isExact(frac);
            num = exact ? frac[0] : 0;
            den = exact ? frac[1] : INTERPOLATED_PHASES;
            int phases = (int) den + (exact ? 0 : 1);
            rows = new double[phases][taps];
            for (int p = 0; p < phases; p++) {
                double phase = (double) p / den;
                for (int j = 0; j < taps; j++) {
                    // tap j multiplies x[floor(t) - half + 1 + j]; its distance from t is:
                    rows[p][j] = h.at((j - half + 1) - phase);
                }
            }
        }

        /** The input position at or before output sample n's time. */
        long base(long n) {
            return exact ? n * num / den : (long) Math.floor(n * step);
        }

        /**
         * Outputs {@code nFrom .. nTo − 1} of a range of {@code length} samples whose sample p is
         * {@code x[from + p]}, into {@code out[n − shift]}. With an exact ratio the input position and phase
         * are stepped from output to output (no division per output), and an output whose window lies wholly
         * inside the range (the common case, kept apart from the edges so that the compiled loop never meets
         * a clamped window) is one dot product; the edges and inexact ratios go through {@link #at}.
         */
        void run(double[] x, int from, int length, long nFrom, long nTo, double[] out, int shift) {
            if (!exact) {
                for (long n = nFrom; n < nTo; n++) {
                    out[(int) n - shift] = at(x, from, length, (int) n);
                }
                return;
            }
            long pos = nFrom * num;
            long base = pos / den;
            long phase = pos % den;
            long wholeStep = num / den;
            long phaseStep = num % den;
            for (long n = nFrom; n < nTo; n++) {
                long start = base - half + 1;
                out[(int) n - shift] = start >= 0 && start + taps <= length
                        ? dot(rows[(int) phase], x, (int) start + from) : at(x, from, length, (int) n);
                base += wholeStep;
                phase += phaseStep;
                if (phase >= den) {
                    phase -= den;
                    base++;
                }
            }
        }

        /**
         * {@code Σ row[j]·x[k + j]} with two partial sums: independent additions overlap in the CPU; the result
         * differs from one running sum only by rounding, never between runs.
         */
        private double dot(double[] row, double[] x, int k) {
            double even = 0;
            double odd = 0;
            for (int j = 0; j < taps; j += 2, k += 2) {
                even += row[j] * x[k];
                odd += row[j + 1] * x[k + 1];
            }
            return even + odd;
        }

        /** Output sample n of a range of {@code length} samples whose sample p is {@code x[from + p]}. */
        double at(double[] x, int from, int length, int n) {
            long base;
            double[] row;
            double[] row2 = null;
            double mix = 0;
            if (exact) {
                long pos = n * num;
                base = pos / den;
                row = rows[(int) (pos % den)];
            } else {
                double t = n * step;
                base = (long) Math.floor(t);
                double ph = (t - base) * den;
                int p = (int) ph;
                mix = ph - p;
                row = rows[p];
                row2 = rows[p + 1];
            }
            long start = base - half + 1;
            int j0 = (int) Math.max(0, -start);
            int j1 = (int) Math.min(taps, length - start);
            double acc = 0;
            int off = (int) start + from;
            if (row2 == null) {
                for (int j = j0; j < j1; j++) {
                    acc += row[j] * x[off + j];
                }
            } else {
                double acc2 = 0;
                for (int j = j0; j < j1; j++) {
                    double v = x[off + j];
                    acc += row[j] * v;
                    acc2 += row2[j] * v;
                }
                acc += mix * (acc2 - acc);
            }
            return acc;
        }
    }

    /** fin/fout as a reduced fraction num/den when both rates are whole numbers, else null. */
    static long[] fraction(double fin, double fout) {
        if (fin != Math.rint(fin) || fout != Math.rint(fout) || fin > 1e9 || fout > 1e9) {
            return null;
        }
        long a = (long) fin;
        long b = (long) fout;
        long g = gcd(a, b);
        return new long[] {a / g, b / g};
    }

    private static long gcd(long a, long b) {
        return b == 0 ? a : gcd(b, a % b);
    }

}
