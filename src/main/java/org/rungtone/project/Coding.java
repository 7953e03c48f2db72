package org.rungtone.project;

import java.util.Optional;
import org.rungtone.analysis.CodeUse;
import org.rungtone.codec.TreadEncoder;
import org.rungtone.codec.TreadFormat;
import org.rungtone.codec.TreadStream;
import org.rungtone.codec.Weighting;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.Signal;

/**
 * How a sound's codes are made with a quantizer: by the quantizer itself, or, for a Tread store, by the Tread
 * encoder through it, whose codes are what the decoder makes of the stream (so every figure, the preview and
 * every plot describe the decoder's output). The encoder weighs its error A-weighted (low-passed where the
 * in-band figures stop, when a reconstruction filter sets that below rate/2) plus plain ({@link Weighting}).
 */
final class Coding {
    private final Optional<TreadFormat> codec;
    private final Weighting weighting;

    private Coding(Optional<TreadFormat> codec, Weighting weighting) {
        this.codec = codec;
        this.weighting = weighting;
    }

    /**
     * The codes made by one quantizer.
     *
     * @param quantized the codes and their counts
     * @param stream the Tread stream they decode from, for a Tread store
     * @param use how the codes use the range
     */
    record Coded(Quantizer.Quantized quantized, Optional<TreadStream> stream, CodeUse use) {
    }

    /** The coding of a plan's codec at {@code rateHz}, weighted up to {@code inBandCutoffHz}. */
    static Coding of(BuildPlan plan, double rateHz, double inBandCutoffHz) {
        return new Coding(plan.quantize().codec(), Weighting.aWeighted(rateHz, inBandCutoffHz));
    }

    /** The codec, if the codes are stored in Tread. */
    Optional<TreadFormat> codec() {
        return codec;
    }

    /**
     * Makes the codes of {@code reference} with {@code quantizer}.
     *
     * @throws org.rungtone.internal.SettingError when a Tread store gets less than one block of samples
     */
    Coded apply(Quantizer quantizer, Signal reference) {
        if (codec.isEmpty()) {
            Quantizer.Quantized q = quantizer.apply(reference);
            return new Coded(q, Optional.empty(), CodeUse.of(quantizer, q));
        }
        TreadEncoder.Encoded e = new TreadEncoder(codec.get(), quantizer, weighting).encode(reference);
        Quantizer.Quantized q = e.quantized();
        // no headroom is kept for a Tread store, and the feedback's excursion has no bound in steps
        return new Coded(q, Optional.of(e.stream()), new CodeUse(q.codes().length(), q.endCodeSamples(),
                q.overloadSamples(), 0, quantizer.shaping().order() > 0, 0, true));
    }
}
