package org.rungtone.analysis;

import org.rungtone.condition.KaiserKernel;
import org.rungtone.internal.Checks;

/**
 * Band-limited resampling by any ratio with a Kaiser-windowed sinc, the one design of {@link KaiserKernel}
 * (window length, β and window are the conditioning resampler's too).
 *
 * <p>The low-pass kernel {@code h(t)} (t in input samples) is tabulated at 512 phases per input sample and
 * interpolated linearly between phases (error below −110 dB for kernels that pass at most a quarter of
 * the input rate). An optional short symmetric FIR is folded into the kernel. Input arrives through a
 * {@link Source} in blocks and is held in a sliding buffer, so memory does not grow with the signal's
 * length. Output sample j is taken at input position {@code j·inRate/outRate + offset}; input before
 * index 0 is zero.
 */
final class SincResampler {
    private static final int PHASES = 512;
    /** Longest period (in outputs) of a whole ratio of code and output rates that is tabulated. */
    private static final int MAX_PERIOD = 4096;

    /** Sequential input. */
    interface Source {
        /** Writes the next {@code count} input samples into {@code dst[offset ..]}. */
        void fill(double[] dst, int offset, int count);
    }

    private final double ratio;
    private final int half;
    private final double[] table;

    /**
     * A resampler from {@code inRateHz} to {@code outRateHz} whose kernel passes up to {@code passHz} and
     * stops from {@code stopHz} with {@code attenuationDb}, convolved with {@code extraTaps} (centred,
     * odd length; may be empty).
     */
    SincResampler(double inRateHz, double outRateHz, double passHz, double stopHz, double attenuationDb,
            double[] extraTaps) {
        Checks.checkArgument(stopHz > passHz && stopHz < inRateHz / 2, "bad resampler band edges");
        Checks.checkArgument(extraTaps.length % 2 == 1 || extraTaps.length == 0, "extra taps must be odd");
        ratio = inRateHz / outRateHz;
        KaiserKernel h = KaiserKernel.lowPass(inRateHz, passHz, stopHz, attenuationDb);
        int extraHalf = extraTaps.length / 2;
        half = h.halfWidth() + extraHalf + 1;
        int taps = 2 * half;
        table = new double[(PHASES + 1) * taps];
        // The extra taps shift the kernel by whole samples, which keeps the phase: each phase's kernel is
        // evaluated once at taps + 2·extraHalf points and the extra FIR is applied to that row.
        double[] row = new double[taps + 2 * extraHalf];
        for (int p = 0; p <= PHASES; p++) {
            double frac = (double) p / PHASES;
            for (int k2 = 0; k2 < row.length; k2++) {
                // row[k2] is the kernel at t = (k2 - extraHalf) - half + 1 - frac
                row[k2] = h.at(k2 - extraHalf - half + 1 - frac);
            }
            for (int k = 0; k < taps; k++) {
                double v;
                if (extraTaps.length == 0) {
                    v = row[k];
                } else {
                    v = 0;
                    for (int e = 0; e < extraTaps.length; e++) {
                        // kernel(t - (e - extraHalf)) with t = k - half + 1 - frac
                        v += extraTaps[e] * row[k - e + 2 * extraHalf];
                    }
                }
                table[p * taps + k] = v;
            }
        }
    }

    /** Half the kernel length in input samples: an output at input time c reads inputs c − half + 1 .. c + half. */
    int half() {
        return half;
    }

    /**
     * Computes outputs {@code from} (inclusive) to {@code to} (exclusive) into {@code out}. The source's next
     * sample is input index {@code sourceStart}; inputs it is asked for before the first one needed are read
     * and dropped (a filter inside the source settles on them), and it must return zeros for negative indices.
     */
    void resampleInto(Source source, long sourceStart, int from, int to, double offset, double[] out) {
        int taps = 2 * half;
        int capacity = Math.max(1 << 16, 4 * taps);
        double[] buf = new double[capacity];
        long bufStart = sourceStart;
        int filled = 0;
        for (int j = from; j < to; j++) {
            double c = j * ratio + offset;
            long i0 = (long) Math.floor(c);
            double frac = c - i0;
            long first = i0 - half + 1;
            long last = i0 + half;
            if (last >= bufStart + filled) {
                long kept = bufStart + filled - first;
                int keep = (int) Math.max(0, kept);
                if (keep > 0) {
                    System.arraycopy(buf, filled - keep, buf, 0, keep);
                }
                for (long skip = -kept; skip > 0; skip -= capacity) {
                    source.fill(buf, 0, (int) Math.min(skip, capacity));
                }
                int need = capacity - keep;
                source.fill(buf, keep, need);
                bufStart = first;
                filled = capacity;
            }
            int base = (int) (first - bufStart);
            double pos = frac * PHASES;
            int p = (int) pos;
            double w = pos - p;
            int row0 = p * taps;
            int row1 = row0 + taps;
            // Two partial sums per row: independent additions overlap in the CPU (taps is even).
            double acc0 = 0;
            double acc1 = 0;
            double odd0 = 0;
            double odd1 = 0;
            for (int k = 0; k < taps; k += 2) {
                double x = buf[base + k];
                double y = buf[base + k + 1];
                acc0 += x * table[row0 + k];
                acc1 += x * table[row1 + k];
                odd0 += y * table[row0 + k + 1];
                odd1 += y * table[row1 + k + 1];
            }
            acc0 += odd0;
            acc1 += odd1;
            out[j] = acc0 + w * (acc1 - acc0);
        }
    }

    /**
     * The kernel summed over each hold of a zero-order-held input, for {@link #resampleHeld}: with fine
     * samples {@code s} holding {@code v[floor(s / factor)]}, an output at fine position {@code c = factor·a
     * + r + frac} is {@code Σ_d v[a − d]·G_(r, frac)(d)}, {@code G_(r, frac)(d) = Σ_(m=0..factor−1)
     * H(factor·d + r − m + frac)}. Rows are tabulated at the same 512 phases per fine sample as the kernel
     * itself (from its table, so no new kernel values), so results equal {@link #resampleInto} over the held
     * signal to rounding while each output reads {@code factor} times fewer values.
     */
    final class Held {
        private final int factor;
        private final int dMin;
        private final int width;
        private final double[] g;

        Held(int factor) {
            Checks.checkArgument(factor >= 1, "hold factor must be at least 1: %d", factor);
            this.factor = factor;
            int taps = 2 * half;
            dMin = -((half + factor) / factor) - 1;
            int dMax = (half + factor) / factor + 1;
            width = dMax - dMin + 1;
            g = new double[factor * (PHASES + 1) * width];
            for (int r = 0; r < factor; r++) {
                for (int p = 0; p <= PHASES; p++) {
                    int row = (r * (PHASES + 1) + p) * width;
                    for (int dd = 0; dd < width; dd++) {
                        int d = dMin + dd;
                        double sum = 0;
                        for (int m = 0; m < factor; m++) {
                            // H(x + p/512) is table[p][half − 1 − x]
                            int k = half - 1 - (factor * d + r - m);
                            if (k >= 0 && k < taps) {
                                sum += table[p * taps + k];
                            }
                        }
                        g[row + dd] = sum;
                    }
                }
            }
        }
    }

    /**
     * Computes outputs {@code from} to {@code to} (exclusive) into {@code out} from a zero-order-held input:
     * fine sample {@code s} holds {@code level[codes[floor(s / factor)]]}, and 0 outside the codes. Output j
     * is taken at fine position {@code j·ratio + offset}, as in {@link #resampleInto}.
     *
     * <p>When the code rate and the output rate are in a small whole ratio (16 kHz to 44.1 kHz is 160 codes
     * per 441 outputs), output j and output j + q (q outputs a period) sit at the same place between codes,
     * so the kernel interpolated between its two nearest phases is the same for both: it is made once per
     * place in the period, and every output is one dot product over the codes, with its position taken
     * from whole numbers instead of a growing product j·ratio.
     */
    void resampleHeld(Held held, int[] codes, double[] level, int from, int to, double offset, double[] out) {
        int q = period(held.factor);
        if (q == 0 || q > Math.max(1, to - from)) {
            resampleHeldEach(held, codes, level, from, to, offset, out);
            return;
        }
        int width = held.width;
        long codesPerPeriod = Math.round(q * ratio / held.factor);
        double[] rows = new double[q * width];
        long[] firstCode = new long[q];
        for (int t = 0; t < q; t++) {
            Place at = place(held, t, offset);
            firstCode[t] = at.code - held.dMin;
            for (int dd = 0; dd < width; dd++) {
                double g0 = held.g[at.row0 + dd];
                rows[t * width + dd] = g0 + at.weight * (held.g[at.row0 + width + dd] - g0);
            }
        }
        int n = codes.length;
        // output j is place t = j mod q of period j / q, both stepped along instead of divided out
        int t = from % q;
        long periodStart = (long) (from / q) * codesPerPeriod;
        for (int j = from; j < to; j++, t++) {
            if (t == q) {
                t = 0;
                periodStart += codesPerPeriod;
            }
            long top = firstCode[t] + periodStart;
            int row = t * width;
            double acc0 = 0;
            double acc1 = 0;
            if (top - (width - 1) >= 0 && top < n) {
                int k = (int) top;
                int dd = 0;
                for (; dd + 1 < width; dd += 2) {
                    acc0 += level[codes[k - dd]] * rows[row + dd];
                    acc1 += level[codes[k - dd - 1]] * rows[row + dd + 1];
                }
                if (dd < width) {
                    acc0 += level[codes[k - dd]] * rows[row + dd];
                }
            } else {
                for (int dd = 0; dd < width; dd++) {
                    long k = top - dd;
                    if (k >= 0 && k < n) {
                        acc0 += level[codes[(int) k]] * rows[row + dd];
                    }
                }
            }
            out[j] = acc0 + acc1;
        }
    }

    /**
     * The fewest outputs after which the output grid and the code grid line up again (a whole number of codes
     * per that many outputs), up to {@value #MAX_PERIOD}; 0 when there is no such period.
     */
    private int period(int factor) {
        double codesPerOutput = ratio / factor;
        for (int q = 1; q <= MAX_PERIOD; q++) {
            double codes = q * codesPerOutput;
            if (Math.abs(codes - Math.rint(codes)) <= 1e-9 * Math.max(1, codes)) {
                return q;
            }
        }
        return 0;
    }

    /** Where output j falls: the code it starts from, the summed kernel's first phase row and the weight. */
    private record Place(long code, int row0, double weight) {
    }

    private Place place(Held held, long j, double offset) {
        double c = j * ratio + offset;
        long i0 = (long) Math.floor(c);
        double frac = c - i0;
        long a = Math.floorDiv(i0, held.factor);
        int r = (int) Math.floorMod(i0, (long) held.factor);
        double pos = frac * PHASES;
        int p = (int) pos;
        return new Place(a, (r * (PHASES + 1) + p) * held.width, pos - p);
    }

    /** {@link #resampleHeld} output by output, for rates in no small whole ratio. */
    private void resampleHeldEach(Held held, int[] codes, double[] level, int from, int to, double offset,
            double[] out) {
        int width = held.width;
        int dMin = held.dMin;
        double[] g = held.g;
        int n = codes.length;
        for (int j = from; j < to; j++) {
            Place at = place(held, j, offset);
            int row0 = at.row0;
            int row1 = row0 + width;
            double acc0 = 0;
            double acc1 = 0;
            long top = at.code - dMin;
            long bottom = at.code - (dMin + width - 1);
            if (bottom >= 0 && top < n) {
                int k = (int) top;
                for (int dd = 0; dd < width; dd++) {
                    double x = level[codes[k - dd]];
                    acc0 += x * g[row0 + dd];
                    acc1 += x * g[row1 + dd];
                }
            } else {
                for (int dd = 0; dd < width; dd++) {
                    long k = top - dd;
                    double x = k >= 0 && k < n ? level[codes[(int) k]] : 0;
                    acc0 += x * g[row0 + dd];
                    acc1 += x * g[row1 + dd];
                }
            }
            out[j] = acc0 + at.weight * (acc1 - acc0);
        }
    }
}
