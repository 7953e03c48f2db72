package org.rungtone.analysis;

import org.rungtone.quantize.Quantizer;

/**
 * How a case's codes use the range of the level table (see {@link Quantizer}): samples on the end codes,
 * samples that overloaded the quantizer, and the headroom it left for noise shaping.
 *
 * @param samples number of codes
 * @param endCodeSamples codes on the lowest or highest level (0 and 2^N − 1 on a monotonic ladder)
 * @param overloadSamples samples whose quantizer input lay past an end level by more than half the end step
 * @param headroomGainDb gain applied to leave the headroom noise shaping needs (0 dB when none was)
 * @param shaped whether the codes came from an error-feedback (noise-shaping) quantizer
 * @param feedbackExcursionLsb how far the feedback and dither can move the quantizer's input, in average
 *     steps ({@link Quantizer#feedbackExcursionVolts}; 0 without shaping)
 * @param headroomKept the peak plus that excursion stays clear of overload (always true without shaping)
 */
public record CodeUse(long samples, long endCodeSamples, long overloadSamples, double headroomGainDb,
        boolean shaped, double feedbackExcursionLsb, boolean headroomKept) {
    /** Shaping overloads on more than this fraction of the samples are worth a warning. */
    public static final double OVERLOAD_WARNING_FRACTION = 0.001;

    /** How the codes {@code quantizer} made ({@code result}) use the range. */
    public static CodeUse of(Quantizer quantizer, Quantizer.Quantized result) {
        return new CodeUse(result.codes().length(), result.endCodeSamples(), result.overloadSamples(),
                result.headroomGainDb(), quantizer.shaping().order() > 0,
                quantizer.feedbackExcursionVolts() / quantizer.lsbVolts(), result.headroomKept());
    }

    /** Fraction of the codes on the end levels (0 for no codes). */
    public double endCodeFraction() {
        return samples == 0 ? 0 : (double) endCodeSamples / samples;
    }

    /** Fraction of the samples that overloaded the quantizer (0 for no codes). */
    public double overloadFraction() {
        return samples == 0 ? 0 : (double) overloadSamples / samples;
    }

    /** True when noise shaping overloaded on more than {@link #OVERLOAD_WARNING_FRACTION} of the samples. */
    public boolean shapingOverloads() {
        return shaped && overloadFraction() > OVERLOAD_WARNING_FRACTION;
    }
}
