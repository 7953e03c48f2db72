package org.rungtone.quantize;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.rungtone.internal.Checks;
import org.rungtone.ladder.LevelTable;
import org.rungtone.source.Signal;

/**
 * Maps a signal onto the nearest level of a {@link LevelTable}, with dither and error feedback.
 *
 * <p>The signal's full scale [-1, 1] maps linearly onto [lowVolts, highVolts] (by default the table's
 * lowest and highest level). Each sample goes to the code whose level is nearest in volts, found by binary
 * search over the levels sorted by voltage, so non-uniform and non-monotonic tables use every level in order
 * of voltage. Dither is in units of the table's average step {@code (high − low)/(2^N − 1)}. With an error
 * filter the quantizer's error is fed back (see {@link ErrorFilter}); the fed-back error is clamped to ±4
 * average steps so that overload cannot make the loop run away.
 *
 * <p>Headroom for noise shaping ({@link Headroom#SHAPING}, the default): the feedback and the dither move the
 * quantizer's input away from the signal by at most {@code E = Σ|h|·(g/2 + d) + d}, with {@code Σ|h|} the
 * filter's {@link ErrorFilter#absoluteTapSum}, g the largest step between adjacent levels and d the dither's
 * peak (0, ½ or 1 average step); the quantizer is overloaded when its input passes an end level by more than
 * half the end step. So a shaped signal whose peak (at most full scale) would come closer to the end levels
 * than {@code E} less that half step is scaled down just enough, once for the whole signal. With the ideal
 * table and TPDF dither E − g/2 is 2 steps for first order and 5 for second order (Gerzon and Craven, AES
 * preprint 2822, 1989, loop equation bounded term by term; no shaping leaves the signal as it is). When
 * even a silent signal could not keep that room, nothing is scaled.
 *
 * <p>Counts: samples beyond full scale (clipped), samples on the lowest or highest level (codes 0 and
 * 2^N − 1 on a monotonic ladder), and samples whose quantizer input lay beyond those levels by more than
 * half the end step (overload: the error there exceeds half a step).
 *
 * <p>Immutable; {@link #apply} is pure and reproducible for a given seed.
 */
public final class Quantizer {
    private static final double FEEDBACK_CLAMP_LSB = 4.0;
    /** Slots of the per-block counts. */
    private static final int COUNTS = 3;
    private static final int CLIPPED = 0;
    private static final int END_CODE = 1;
    private static final int OVERLOAD = 2;

    /** Whether a shaped quantizer keeps room for its feedback at the end levels. */
    public enum Headroom {
        /** Scale a loud shaped signal down so the feedback cannot overload (see the class comment). */
        SHAPING,
        /** No room kept: a loud shaped signal overloads the loop. */
        NONE
    }

    private final LevelTable table;
    private final double lowVolts;
    private final double highVolts;
    private final Dither dither;
    private final ErrorFilter shaping;
    private final long seed;
    private final Headroom headroom;
    private final double[] sortedVolts;
    private final int[] sortedCodes;
    /** For evenly spaced levels (the ideal ladder) the nearest index is computed, not searched: the step. */
    private final double uniformStep;

    /** A quantizer over the table's full span, no shaping. */
    public Quantizer(LevelTable table, Dither dither, long seed) {
        this(table, table.minVolts(), table.maxVolts(), dither, ErrorFilter.NONE, seed);
    }

    /**
     * A quantizer over an explicit span that keeps the headroom shaping needs ({@link Headroom#SHAPING}).
     *
     * @throws IllegalArgumentException when the span is empty or not finite
     */
    public Quantizer(LevelTable table, double lowVolts, double highVolts, Dither dither, ErrorFilter shaping,
            long seed) {
        this(table, lowVolts, highVolts, dither, shaping, seed, Headroom.SHAPING);
    }

    /**
     * A quantizer over an explicit span with the given headroom policy.
     *
     * @throws IllegalArgumentException when the span is empty or not finite
     */
    public Quantizer(LevelTable table, double lowVolts, double highVolts, Dither dither, ErrorFilter shaping,
            long seed, Headroom headroom) {
        Checks.checkArgument(Double.isFinite(lowVolts) && Double.isFinite(highVolts) && highVolts > lowVolts,
                "the output span must have high > low: %s .. %s V", lowVolts, highVolts);
        this.table = table;
        this.lowVolts = lowVolts;
        this.highVolts = highVolts;
        this.dither = dither;
        this.shaping = shaping;
        this.seed = seed;
        this.headroom = headroom;
        int n = table.size();
        Integer[] order = new Integer[n];
        for (int i = 0; i < n; i++) {
            order[i] = i;
        }
        double[] levels = table.levels();
        // Stable sort by voltage; equal levels keep the lower code first.
        Arrays.sort(order, (a, b) -> Double.compare(levels[a], levels[b]));
        sortedVolts = new double[n];
        sortedCodes = new int[n];
        for (int i = 0; i < n; i++) {
            sortedVolts[i] = levels[order[i]];
            sortedCodes[i] = order[i];
        }
        uniformStep = uniformStep(sortedVolts);
    }

    /** The common step when the sorted levels are evenly spaced (to 1e-9 of a step), else NaN. */
    private static double uniformStep(double[] sorted) {
        int n = sorted.length;
        if (n < 2) {
            return Double.NaN;
        }
        double step = (sorted[n - 1] - sorted[0]) / (n - 1);
        if (!(step > 0)) {
            return Double.NaN;
        }
        for (int i = 0; i < n; i++) {
            if (Math.abs(sorted[i] - (sorted[0] + i * step)) > 1e-9 * step) {
                return Double.NaN;
            }
        }
        return step;
    }

    /** The table quantized onto. */
    public LevelTable table() {
        return table;
    }

    /** Average step in volts: (high − low)/(2^N − 1). */
    public double lsbVolts() {
        return (highVolts - lowVolts) / Math.max(1, table.size() - 1);
    }

    /** Span low end in volts (signal −1). */
    public double lowVolts() {
        return lowVolts;
    }

    /** Span high end in volts (signal +1). */
    public double highVolts() {
        return highVolts;
    }

    /** Dither kind. */
    public Dither dither() {
        return dither;
    }

    /** Error filter. */
    public ErrorFilter shaping() {
        return shaping;
    }

    /** Seed of the dither. */
    public long seed() {
        return seed;
    }

    /** Headroom policy. */
    public Headroom headroom() {
        return headroom;
    }

    /** The volts a signal value maps onto before quantization. */
    public double targetVolts(double x) {
        return 0.5 * (lowVolts + highVolts) + 0.5 * x * (highVolts - lowVolts);
    }

    /** The signal value (full scale [-1, 1]) that a level in volts stands for: inverse of targetVolts. */
    public double signalOf(double volts) {
        return (volts - 0.5 * (lowVolts + highVolts)) / (0.5 * (highVolts - lowVolts));
    }

    /**
     * Samples per dither block (a power of two): each block draws from its own random stream (see
     * {@link #apply}).
     */
    static final int BLOCK = 1 << 16;

    /**
     * Quantizes a whole signal. The dither comes from one random stream per block of {@value #BLOCK} samples,
     * split in order from a generator seeded with the seed, so that without an error filter the blocks are
     * quantized in parallel and the codes are the same whatever the number of cores. With an error filter
     * the samples depend on each other and run in order (same streams, same codes).
     */
    public Quantized apply(Signal signal) {
        double[] x = signal.unsafeSamples();
        int[] out = new int[x.length];
        int blocks = (x.length + BLOCK - 1) / BLOCK;
        SplittableRandom root = new SplittableRandom(seed);
        SplittableRandom[] streams = new SplittableRandom[blocks];
        for (int b = 0; b < blocks; b++) {
            streams[b] = root.split();
        }
        long[] counts = new long[COUNTS];
        double gain = 1;
        boolean kept = true;
        if (shaping.order() == 0) {
            long[][] perBlock = new long[blocks][];
            java.util.stream.IntStream.range(0, blocks).parallel().forEach(b -> perBlock[b] = quantizeFlat(x,
                    out, b * BLOCK, Math.min(x.length, (b + 1) * BLOCK), streams[b]));
            for (long[] c : perBlock) {
                for (int k = 0; k < COUNTS; k++) {
                    counts[k] += c[k];
                }
            }
        } else {
            double needed = headroomGain(x);
            kept = needed > 0 && (needed == 1 || headroom == Headroom.SHAPING);
            gain = headroom == Headroom.SHAPING && needed > 0 ? needed : 1;
            counts = quantizeShaped(x, gain, out, streams);
        }
        return new Quantized(Codes.wrap(table.bits(), signal.sampleRateHz(), out), counts[CLIPPED],
                counts[END_CODE], counts[OVERLOAD], 20 * Math.log10(gain), kept);
    }

    /** Samples {@code from .. to − 1} without error feedback; returns the counts (clipped, end code, overload). */
    private long[] quantizeFlat(double[] x, int[] out, int from, int to, SplittableRandom random) {
        double lsb = lsbVolts();
        double mid = 0.5 * (lowVolts + highVolts);
        double half = 0.5 * (highVolts - lowVolts);
        int top = sortedVolts.length - 1;
        double below = lowerOverloadVolts();
        double above = upperOverloadVolts();
        long[] counts = new long[COUNTS];
        for (int i = from; i < to; i++) {
            double xi = x[i];
            if (xi > 1 || xi < -1) {
                counts[CLIPPED]++;
            }
            double d = dither == Dither.NONE ? 0 : dither.next(random) * lsb;
            double w = mid + xi * half + d;
            int idx = nearestIndex(w);
            out[i] = sortedCodes[idx];
            if (idx == 0 || idx == top) {
                counts[END_CODE]++;
                if (w < below || w > above) {
                    counts[OVERLOAD]++;
                }
            }
        }
        return counts;
    }

    /** All samples in order with the error fed back, the signal scaled by {@code gain}; returns the counts. */
    private long[] quantizeShaped(double[] x, double gain, int[] out, SplittableRandom[] streams) {
        double lsb = lsbVolts();
        double mid = 0.5 * (lowVolts + highVolts);
        double half = 0.5 * (highVolts - lowVolts);
        double[] taps = shaping.taps();
        int order = taps.length;
        int top = sortedVolts.length - 1;
        double below = lowerOverloadVolts();
        double above = upperOverloadVolts();
        double[] past = new double[order]; // fed-back errors, newest first
        long[] counts = new long[COUNTS];
        double clamp = FEEDBACK_CLAMP_LSB * lsb;
        SplittableRandom random = null;
        for (int i = 0; i < x.length; i++) {
            if ((i & (BLOCK - 1)) == 0) {
                random = streams[i / BLOCK];
            }
            double xi = x[i];
            if (xi > 1 || xi < -1) {
                counts[CLIPPED]++;
            }
            // gain is exactly 1 when no headroom is needed, so those codes are those of the plain loop
            double v = mid + gain * xi * half;
            double fb = 0;
            for (int k = 0; k < order; k++) {
                fb += taps[k] * past[k];
            }
            v -= fb;
            double d = dither == Dither.NONE ? 0 : dither.next(random) * lsb;
            double w = v + d;
            int idx = nearestIndex(w);
            out[i] = sortedCodes[idx];
            if (idx == 0 || idx == top) {
                counts[END_CODE]++;
                if (w < below || w > above) {
                    counts[OVERLOAD]++;
                }
            }
            double e = sortedVolts[idx] - v;
            e = Math.max(-clamp, Math.min(clamp, e));
            System.arraycopy(past, 0, past, 1, order - 1);
            past[0] = e;
        }
        return counts;
    }

    /** Below this the quantizer's input is past the lowest level by more than half the end step. */
    private double lowerOverloadVolts() {
        return sortedVolts[0] - 0.5 * (sortedVolts[1] - sortedVolts[0]);
    }

    /** Above this the quantizer's input is past the highest level by more than half the end step. */
    private double upperOverloadVolts() {
        int top = sortedVolts.length - 1;
        return sortedVolts[top] + 0.5 * (sortedVolts[top] - sortedVolts[top - 1]);
    }

    /**
     * How far the feedback and the dither can move the quantizer's input away from the signal, in volts:
     * {@code Σ|h|·(g/2 + d) + d} (see the class comment).
     */
    public double feedbackExcursionVolts() {
        if (shaping.order() == 0) {
            return 0;
        }
        double gap = 0;
        for (int i = 1; i < sortedVolts.length; i++) {
            gap = Math.max(gap, sortedVolts[i] - sortedVolts[i - 1]);
        }
        double d = ditherPeakLsb() * lsbVolts();
        return shaping.absoluteTapSum() * (0.5 * gap + d) + d;
    }

    private double ditherPeakLsb() {
        switch (dither) {
            case RPDF:
                return 0.5;
            case TPDF:
                return 1.0;
            default:
                return 0;
        }
    }

    /**
     * The gain (at most 1) that keeps the signal's peaks, taken at most at full scale, the feedback's
     * excursion away from the overload points; 1 when they already are, 0 when no gain could.
     */
    private double headroomGain(double[] x) {
        double max = 0;
        double min = 0;
        for (double v : x) {
            max = Math.max(max, v);
            min = Math.min(min, v);
        }
        double mid = 0.5 * (lowVolts + highVolts);
        double half = 0.5 * (highVolts - lowVolts);
        double excursion = feedbackExcursionVolts();
        double upRoom = upperOverloadVolts() - excursion - mid;
        double downRoom = mid - excursion - lowerOverloadVolts();
        if (!(upRoom > 0 && downRoom > 0)) {
            return 0;
        }
        double gain = 1;
        double up = Math.min(1, max) * half;
        double down = Math.min(1, -min) * half;
        if (up > upRoom) {
            gain = upRoom / up;
        }
        if (down > downRoom) {
            gain = Math.min(gain, downRoom / down);
        }
        return gain;
    }

    /** Index into the sorted levels of the level nearest to {@code volts}. */
    int nearestIndex(double volts) {
        double[] s = sortedVolts;
        if (!Double.isNaN(uniformStep)) {
            double k = Math.rint((volts - s[0]) / uniformStep);
            int i = k <= 0 ? 0 : k >= s.length - 1 ? s.length - 1 : (int) k;
            // rint rounds halves to even; the search below keeps ties on the lower level: match it exactly
            if (i > 0 && volts - s[i - 1] <= s[i] - volts) {
                return i - 1;
            }
            if (i < s.length - 1 && s[i + 1] - volts < volts - s[i]) {
                return i + 1;
            }
            return i;
        }
        int lo = 0;
        int hi = s.length - 1;
        if (volts <= s[0]) {
            return 0;
        }
        if (volts >= s[hi]) {
            return hi;
        }
        while (hi - lo > 1) {
            int m = (lo + hi) >>> 1;
            if (s[m] <= volts) {
                lo = m;
            } else {
                hi = m;
            }
        }
        return volts - s[lo] <= s[hi] - volts ? lo : hi;
    }

    /** The code whose level is nearest to {@code volts}. */
    public int nearestCode(double volts) {
        return sortedCodes[nearestIndex(volts)];
    }

    /**
     * The result of quantizing: the codes and how they use the table's range.
     *
     * @param codes the codes
     * @param clippedSamples input samples with |x| &gt; 1
     * @param endCodeSamples samples on the lowest or highest level
     * @param overloadSamples samples whose quantizer input lay past an end level by more than half the end
     *     step (the error there exceeds half a step)
     * @param headroomGainDb the gain applied to leave the headroom shaping needs (0 dB when none was)
     * @param headroomKept the signal's peak plus the feedback's worst-case excursion stays clear of overload
     *     (always true without shaping; false when no gain could make room, or none was kept)
     */
    public record Quantized(Codes codes, long clippedSamples, long endCodeSamples, long overloadSamples,
            double headroomGainDb, boolean headroomKept) {

        /** Fraction of the samples on the lowest or highest level (0 for no samples). */
        public double endCodeFraction() {
            return codes.length() == 0 ? 0 : (double) endCodeSamples / codes.length();
        }

        /** Fraction of the samples that overloaded the quantizer (0 for no samples). */
        public double overloadFraction() {
            return codes.length() == 0 ? 0 : (double) overloadSamples / codes.length();
        }
    }
}
