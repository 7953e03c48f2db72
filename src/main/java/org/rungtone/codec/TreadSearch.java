package org.rungtone.codec;

import java.util.SplittableRandom;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.Quantizer;

/**
 * One run of the Tread encoder's breadth-limited search (the M-algorithm of delayed-decision coding): the
 * {@code width} cheapest paths survive each sample; every survivor tries the codes near the one the target
 * asks for, decoded with the decoder's exact integer arithmetic and judged on the board's real levels by the
 * weighted error; paths that reach the same decoder state merge, keeping the cheaper; the code {@code depth}
 * samples back is then decided from the cheapest path, and paths that disagree with it are dropped. Each path
 * carries its own weighting-filter and error-feedback state, and its last {@code depth} codes packed in a
 * {@code long}. Width 1 and depth 1 is the greedy coder.
 *
 * <p>Mutable working state; one instance encodes one signal.
 */
final class TreadSearch {
    /** Codes tried per survivor and sample at most (all four codes of tread2; else up to four near the aim). */
    private static final int MAX_TRIES = 4;
    /** The fed-back error is clamped to this share of the output span, so an overload cannot run away. */
    private static final double FEEDBACK_CLAMP_SPAN = 1.0 / 16;

    private final TreadDecoder decoder;
    private final Quantizer quantizer;
    private final double[] levels;
    private final Weighting weighting;
    private final double[] taps;
    private final int width;
    private final int depth;
    private final int bits;
    private final int magnitudes;
    private final long mask;
    private final int ws;
    private final int order;
    private final double clamp;
    private final double weightGain;
    private double bias;

    private int size;
    private int[] pred;
    private int[] prev;
    private int[] index;
    private int[] start;
    private long[] hist;
    private double[] cost;
    private double[] wstate;
    private double[] fb;
    private int[] nPred;
    private int[] nPrev;
    private int[] nIndex;
    private int[] nStart;
    private long[] nHist;
    private double[] nCost;
    private double[] nWstate;
    private double[] nFb;

    private int tries;
    private final int[] tParent;
    private final int[] tCode;
    private final int[] tPred;
    private final int[] tIndex;
    private final long[] tKey;
    private final double[] tCost;
    private final double[] tError;
    private final double[] tFeedback;
    private final int[] kept;
    private final double[] keptCost;
    private final long[] keptKey;
    private int keptCount;

    /**
     * The outcome of a run.
     *
     * @param start the start state of the chosen path
     * @param codes the chosen codes
     * @param cost the chosen path's total weighted cost
     */
    record Result(TreadState start, int[] codes, double cost) {
    }

    TreadSearch(TreadDecoder decoder, Quantizer quantizer, Weighting weighting, int width, int depth) {
        this.decoder = decoder;
        this.quantizer = quantizer;
        this.levels = quantizer.table().levels();
        this.weighting = weighting;
        this.taps = quantizer.shaping().taps();
        this.width = width;
        this.depth = depth;
        this.bits = decoder.format().codeBits();
        this.magnitudes = decoder.format().magnitudes();
        this.mask = (1L << bits) - 1;
        this.ws = weighting.stateSize();
        this.order = taps.length;
        this.clamp = FEEDBACK_CLAMP_SPAN * (quantizer.highVolts() - quantizer.lowVolts());
        this.weightGain = weighting.gain();
        pred = new int[width];
        prev = new int[width];
        index = new int[width];
        start = new int[width];
        hist = new long[width];
        cost = new double[width];
        wstate = new double[width * ws];
        fb = new double[width * order];
        nPred = new int[width];
        nPrev = new int[width];
        nIndex = new int[width];
        nStart = new int[width];
        nHist = new long[width];
        nCost = new double[width];
        nWstate = new double[width * ws];
        nFb = new double[width * order];
        int n = width * MAX_TRIES;
        tParent = new int[n];
        tCode = new int[n];
        tPred = new int[n];
        tIndex = new int[n];
        tKey = new long[n];
        tCost = new double[n];
        tError = new double[n];
        tFeedback = new double[n];
        kept = new int[width];
        keptCost = new double[width];
        keptKey = new long[width];
    }

    /** Encodes {@code x} (full scale [-1, 1]) scaled by {@code gain}, the dither drawn from {@code seed}. */
    Result run(double[] x, double gain, long seed) {
        int n = x.length;
        int[] out = new int[n];
        Dither dither = quantizer.dither();
        SplittableRandom random = new SplittableRandom(seed);
        double lsb = quantizer.lsbVolts();
        int firstPredictor = quantizer.nearestCode(quantizer.targetVolts(n == 0 ? 0 : gain * x[0]));
        begin(firstPredictor);
        double offset = 0;
        int committed = 0;
        for (int i = 0; i < n; i++) {
            double t = quantizer.targetVolts(gain * x[i]);
            double d = dither == Dither.NONE ? 0 : dither.next(random) * lsb;
            expand(t, d);
            advance();
            double least = cost[0];
            for (int s = 0; s < size; s++) {
                cost[s] -= least;
            }
            offset += least;
            if (i >= depth - 1) {
                out[committed] = decide(committed);
                committed++;
            }
        }
        for (int pos = committed; pos < n; pos++) {
            out[pos] = (int) (hist[0] >>> ((n - 1 - pos) * bits) & mask);
        }
        return new Result(new TreadState(firstPredictor, firstPredictor, start[0]), out, offset + cost[0]);
    }

    /** The first survivors: both past codes at the first target, step indices spread over 0..kmax. */
    private void begin(int firstPredictor) {
        int kmax = decoder.maxIndex();
        size = Math.min(width, kmax + 1);
        for (int s = 0; s < size; s++) {
            pred[s] = firstPredictor;
            prev[s] = firstPredictor;
            index[s] = size == 1 ? 0 : (int) Math.round((double) s * kmax / (size - 1));
            start[s] = index[s];
            hist[s] = 0;
            cost[s] = 0;
        }
        java.util.Arrays.fill(wstate, 0);
        java.util.Arrays.fill(fb, 0);
    }

    /** Tries the codes near the aim from every survivor for target {@code t} volts and dither {@code d}. */
    private void expand(double t, double d) {
        tries = 0;
        keptCount = 0;
        for (int j = 0; j < size; j++) {
            double v = t;
            for (int h = 0; h < order; h++) {
                v -= taps[h] * fb[j * order + h];
            }
            double w = v + d;
            int k = index[j];
            bias = weighting.bias(wstate, j * ws);
            int q = Math.max(0, Math.min(decoder.maxCode(), 2 * pred[j] - prev[j]));
            if (magnitudes <= 2) {
                for (int c = 0; c < 2 * magnitudes; c++) {
                    tryCode(j, c, k, v, w);
                }
                continue;
            }
            int delta = quantizer.nearestCode(w) - q;
            int sign = delta < 0 ? magnitudes : 0;
            int aim = Math.abs(delta);
            int best = 0;
            for (int m = 1; m < magnitudes; m++) {
                if (Math.abs(TreadFormat.difference(k, m) - aim) < Math.abs(TreadFormat.difference(k, best) - aim)) {
                    best = m;
                }
            }
            tryCode(j, sign | best, k, v, w);
            if (best > 0) {
                tryCode(j, sign | (best - 1), k, v, w);
            }
            if (best < magnitudes - 1) {
                tryCode(j, sign | (best + 1), k, v, w);
            }
            tryCode(j, (sign ^ magnitudes) | (best == 0 ? 1 : 0), k, v, w);
        }
    }

    /** Decodes {@code c} from survivor {@code j} and keeps it if it is among the cheapest. */
    private void tryCode(int j, int c, int k, double v, double w) {
        int q = tries++;
        int out = decoder.output(pred[j], prev[j], k, c);
        double y = levels[out];
        double e = y - w;
        tParent[q] = j;
        tCode[q] = c;
        tPred[q] = out;
        tIndex[q] = decoder.nextIndex(k, c);
        tCost[q] = cost[j] + weighting.cost(e, weightGain, bias);
        tKey[q] = (long) out << 40 | (long) pred[j] << 20 | tIndex[q];
        tError[q] = e;
        tFeedback[q] = Math.max(-clamp, Math.min(clamp, y - v));
        keep(q);
    }

    /** Keeps try {@code q} in the sorted list of the cheapest, one per decoder state. */
    private void keep(int q) {
        double c = tCost[q];
        int n = keptCount;
        if (n == width && c >= keptCost[n - 1]) {
            return;
        }
        long key = tKey[q];
        for (int s = 0; s < n; s++) {
            if (keptKey[s] == key) {
                if (c >= keptCost[s]) {
                    return;
                }
                remove(s);
                n--;
                break;
            }
        }
        int at = Math.min(n, width - 1);
        while (at > 0 && keptCost[at - 1] > c) {
            kept[at] = kept[at - 1];
            keptCost[at] = keptCost[at - 1];
            keptKey[at] = keptKey[at - 1];
            at--;
        }
        kept[at] = q;
        keptCost[at] = c;
        keptKey[at] = key;
        keptCount = Math.min(width, n + 1);
    }

    private void remove(int s) {
        int tail = keptCount - s - 1;
        System.arraycopy(kept, s + 1, kept, s, tail);
        System.arraycopy(keptCost, s + 1, keptCost, s, tail);
        System.arraycopy(keptKey, s + 1, keptKey, s, tail);
        keptCount--;
    }

    /** The kept tries become the survivors, each with its parent's filter states moved on. */
    private void advance() {
        for (int s = 0; s < keptCount; s++) {
            int q = kept[s];
            int j = tParent[q];
            nPred[s] = tPred[q];
            nPrev[s] = pred[j];
            nIndex[s] = tIndex[q];
            nStart[s] = start[j];
            nCost[s] = tCost[q];
            nHist[s] = hist[j] << bits | tCode[q];
            System.arraycopy(wstate, j * ws, nWstate, s * ws, ws);
            weighting.update(tError[q], nWstate, s * ws);
            if (order > 0) {
                nFb[s * order] = tFeedback[q];
                System.arraycopy(fb, j * order, nFb, s * order + 1, order - 1);
            }
        }
        size = keptCount;
        int[] ti = pred;
        pred = nPred;
        nPred = ti;
        ti = prev;
        prev = nPrev;
        nPrev = ti;
        ti = index;
        index = nIndex;
        nIndex = ti;
        ti = start;
        start = nStart;
        nStart = ti;
        long[] tl = hist;
        hist = nHist;
        nHist = tl;
        double[] td = cost;
        cost = nCost;
        nCost = td;
        td = wstate;
        wstate = nWstate;
        nWstate = td;
        td = fb;
        fb = nFb;
        nFb = td;
    }

    /**
     * Decides the code {@code depth − 1} samples back from the cheapest path and drops the paths that
     * disagree with it there (or, at the first decision, in their start state).
     */
    private int decide(int position) {
        int shift = (depth - 1) * bits;
        int code = (int) (hist[0] >>> shift & mask);
        int firstStart = start[0];
        int w = 0;
        for (int s = 0; s < size; s++) {
            if ((hist[s] >>> shift & mask) == code && (position > 0 || start[s] == firstStart)) {
                if (w != s) {
                    move(s, w);
                }
                w++;
            }
        }
        size = w;
        return code;
    }

    private void move(int from, int to) {
        pred[to] = pred[from];
        prev[to] = prev[from];
        index[to] = index[from];
        start[to] = start[from];
        hist[to] = hist[from];
        cost[to] = cost[from];
        System.arraycopy(wstate, from * ws, wstate, to * ws, ws);
        System.arraycopy(fb, from * order, fb, to * order, order);
    }
}
