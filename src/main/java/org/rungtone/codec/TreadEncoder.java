package org.rungtone.codec;

import org.rungtone.internal.Checks;
import org.rungtone.internal.Setting;
import org.rungtone.quantize.Codes;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.Signal;

/**
 * Encodes a signal in Tread by searching ahead against the decoder's exact integer behaviour (see
 * {@link TreadSearch}): the codes are chosen so that the decoded ladder codes, played on the quantizer's level
 * table (the board's real levels when compensating), follow the quantizer's target with the least weighted
 * error ({@link Weighting}). The quantizer supplies everything else a plain quantization would use: the span
 * that full scale maps onto, the dither (added to the target, in the table's average steps) and the
 * error-feedback filter, which here sees the decoded level. Delayed-decision (trellis) coding of ADPCM is a
 * published method; the search here never ends worse than the greedy coder: both run and the cheaper path by
 * the same weighted cost is kept.
 *
 * <p>Start state: the predictor is the code nearest the first target; the search tries step indices spread
 * over 0..kmax and keeps the one its cheapest path started from. No headroom is kept for noise shaping (the
 * shaped target is clamped at the end levels by the decoder itself).
 *
 * <p>Immutable; {@link #encode} is pure and reproducible for a given seed.
 */
public final class TreadEncoder {
    /** Paths kept per sample by default. */
    public static final int DEFAULT_WIDTH = 8;
    /** Samples a decision waits by default. */
    public static final int DEFAULT_DEPTH = 16;

    private final TreadFormat format;
    private final Quantizer quantizer;
    private final Weighting weighting;
    private final int width;
    private final int depth;

    /**
     * An encoder onto the quantizer's table, span, dither, shaping and seed, with the default search.
     *
     * @throws org.rungtone.internal.SettingError when the format cannot decode to the table's depth
     */
    public TreadEncoder(TreadFormat format, Quantizer quantizer, Weighting weighting) {
        this(format, quantizer, weighting, DEFAULT_WIDTH, DEFAULT_DEPTH);
    }

    private TreadEncoder(TreadFormat format, Quantizer quantizer, Weighting weighting, int width, int depth) {
        format.checkLadderBits(quantizer.table().bits());
        Checks.checkArgument(width >= 1 && width <= 64, "search width must be 1..64: %d", width);
        Checks.checkArgument(depth >= 1 && depth * format.codeBits() <= 64, "search depth must be 1..%d: %d",
                64 / format.codeBits(), depth);
        this.format = format;
        this.quantizer = quantizer;
        this.weighting = weighting;
        this.width = width;
        this.depth = depth;
    }

    /**
     * The same encoder with another search: {@code width} paths kept, decisions {@code depth} samples late
     * (1 and 1 is the greedy coder).
     *
     * @throws IllegalArgumentException when the width is outside 1..64 or the depth outside 1..64/b
     */
    public TreadEncoder withSearch(int width, int depth) {
        return new TreadEncoder(format, quantizer, weighting, width, depth);
    }

    /** The format encoded to. */
    public TreadFormat format() {
        return format;
    }

    /** The quantizer whose target, levels, dither and shaping the encoder follows. */
    public Quantizer quantizer() {
        return quantizer;
    }

    /**
     * The stream, what it decodes to, and how the decoded codes use the table.
     *
     * @param stream the Tread stream
     * @param quantized the decoded ladder codes with the quantizer's counts (clipped, end levels, overload;
     *     no headroom gain)
     * @param weightedCost the chosen path's total weighted error, in volts squared
     */
    public record Encoded(TreadStream stream, Quantizer.Quantized quantized, double weightedCost) {
    }

    /**
     * Encodes a signal.
     *
     * @throws org.rungtone.internal.SettingError when the signal is shorter than one block
     *     ({@value TreadFormat#BLOCK_CODES} samples)
     */
    public Encoded encode(Signal signal) {
        double[] x = signal.unsafeSamples();
        Setting.STORAGE.check(x.length >= TreadFormat.BLOCK_CODES, "%s needs at least one block of %d samples;"
                + " the sound has %d; use a longer sound, or %s packed", format.optionName(),
                TreadFormat.BLOCK_CODES, x.length, Setting.STORAGE.ref());
        TreadDecoder decoder = new TreadDecoder(format, quantizer.table().bits());
        long seed = quantizer.seed();
        TreadSearch.Result best = new TreadSearch(decoder, quantizer, weighting, width, depth).run(x, 1, seed);
        if (width > 1 || depth > 1) {
            TreadSearch.Result greedy = new TreadSearch(decoder, quantizer, weighting, 1, 1).run(x, 1, seed);
            if (greedy.cost() < best.cost()) {
                best = greedy;
            }
        }
        TreadStream stream = TreadStream.of(format, decoder.ladderBits(), signal.sampleRateHz(), best.start(),
                best.codes());
        Codes decoded = stream.decoded();
        return new Encoded(stream, counted(x, decoded), best.cost());
    }

    /** The decoded codes with the quantizer's counts: clipped input, end levels, overload. */
    private Quantizer.Quantized counted(double[] x, Codes decoded) {
        double[] levels = quantizer.table().levels();
        double low = Double.POSITIVE_INFINITY;
        double high = Double.NEGATIVE_INFINITY;
        for (double v : levels) {
            low = Math.min(low, v);
            high = Math.max(high, v);
        }
        double lowStep = Double.POSITIVE_INFINITY;
        double highStep = Double.POSITIVE_INFINITY;
        for (double v : levels) {
            if (v > low) {
                lowStep = Math.min(lowStep, v - low);
            }
            if (v < high) {
                highStep = Math.min(highStep, high - v);
            }
        }
        long clipped = 0;
        long end = 0;
        long overload = 0;
        int[] c = decoded.unsafeCodes();
        for (int i = 0; i < x.length; i++) {
            if (x[i] > 1 || x[i] < -1) {
                clipped++;
            }
            double y = levels[c[i]];
            if (y == low || y == high) {
                end++;
                double t = quantizer.targetVolts(x[i]);
                if (t < low - lowStep / 2 || t > high + highStep / 2) {
                    overload++;
                }
            }
        }
        return new Quantizer.Quantized(decoded, clipped, end, overload, 0, true);
    }
}
