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
 * <p>Immutable; {@link #apply} is pure and reproducible for a given seed.
 */
public final class Quantizer {
    private static final double FEEDBACK_CLAMP_LSB = 4.0;

    private final LevelTable table;
    private final double lowVolts;
    private final double highVolts;
    private final Dither dither;
    private final ErrorFilter shaping;
    private final long seed;
    private final double[] sortedVolts;
    private final int[] sortedCodes;
    /** For evenly spaced levels (the ideal ladder) the nearest index is computed, not searched: the step. */
    private final double uniformStep;

    /** A quantizer over the table's full span, no shaping. */
    public Quantizer(LevelTable table, Dither dither, long seed) {
        this(table, table.minVolts(), table.maxVolts(), dither, ErrorFilter.NONE, seed);
    }

    /**
     * A quantizer over an explicit span.
     *
     * @throws IllegalArgumentException when the span is empty or not finite
     */
    public Quantizer(LevelTable table, double lowVolts, double highVolts, Dither dither, ErrorFilter shaping,
            long seed) {
        Checks.checkArgument(Double.isFinite(lowVolts) && Double.isFinite(highVolts) && highVolts > lowVolts,
                "the output span must have high > low: %s .. %s V", lowVolts, highVolts);
        this.table = table;
        this.lowVolts = lowVolts;
        this.highVolts = highVolts;
        this.dither = dither;
        this.shaping = shaping;
        this.seed = seed;
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
        long clipped;
        if (shaping.order() == 0) {
            long[] counts = new long[blocks];
            java.util.stream.IntStream.range(0, blocks).parallel().forEach(b -> counts[b] = quantizeFlat(x,
                    out, b * BLOCK, Math.min(x.length, (b + 1) * BLOCK), streams[b]));
            clipped = 0;
            for (long c : counts) {
                clipped += c;
            }
        } else {
            clipped = quantizeShaped(x, out, streams);
        }
        return new Quantized(Codes.wrap(table.bits(), signal.sampleRateHz(), out), clipped);
    }

    /** Samples {@code from .. to − 1} without error feedback; returns how many lay beyond full scale. */
    private long quantizeFlat(double[] x, int[] out, int from, int to, SplittableRandom random) {
        double lsb = lsbVolts();
        double mid = 0.5 * (lowVolts + highVolts);
        double half = 0.5 * (highVolts - lowVolts);
        long clipped = 0;
        for (int i = from; i < to; i++) {
            double xi = x[i];
            if (xi > 1 || xi < -1) {
                clipped++;
            }
            double d = dither == Dither.NONE ? 0 : dither.next(random) * lsb;
            out[i] = sortedCodes[nearestIndex(mid + xi * half + d)];
        }
        return clipped;
    }

    /** All samples in order with the error fed back; returns how many lay beyond full scale. */
    private long quantizeShaped(double[] x, int[] out, SplittableRandom[] streams) {
        double lsb = lsbVolts();
        double mid = 0.5 * (lowVolts + highVolts);
        double half = 0.5 * (highVolts - lowVolts);
        double[] taps = shaping.taps();
        int order = taps.length;
        double[] past = new double[order]; // fed-back errors, newest first
        long clipped = 0;
        double clamp = FEEDBACK_CLAMP_LSB * lsb;
        SplittableRandom random = null;
        for (int i = 0; i < x.length; i++) {
            if ((i & (BLOCK - 1)) == 0) {
                random = streams[i / BLOCK];
            }
            double xi = x[i];
            if (xi > 1 || xi < -1) {
                clipped++;
            }
            double v = mid + xi * half;
            double fb = 0;
            for (int k = 0; k < order; k++) {
                fb += taps[k] * past[k];
            }
            v -= fb;
            double d = dither == Dither.NONE ? 0 : dither.next(random) * lsb;
            int idx = nearestIndex(v + d);
            out[i] = sortedCodes[idx];
            double e = sortedVolts[idx] - v;
            e = Math.max(-clamp, Math.min(clamp, e));
            System.arraycopy(past, 0, past, 1, order - 1);
            past[0] = e;
        }
        return clipped;
    }

    /** Index into the sorted levels of the level nearest to {@code volts}. */
    int nearestIndex(double volts) {
        double[] s = sortedVolts;
        if (uniformStep == uniformStep) {
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
     * The result of quantizing: the codes and how many input samples lay outside full scale.
     *
     * @param codes the codes
     * @param clippedSamples input samples with |x| &gt; 1
     */
    public record Quantized(Codes codes, long clippedSamples) {
    }
}
