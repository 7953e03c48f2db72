package org.rungtone.analysis;

import org.rungtone.internal.Checks;

/**
 * A loop found in a sustained sound ({@link LoopFinder}): playback repeats samples {@code start .. end − 1},
 * whose last {@code crossfadeSamples} have a crossfade into the lead-in of the start baked into them
 * ({@link LoopCrossfade}).
 *
 * @param start first sample of the loop
 * @param end one past its last sample
 * @param periodSamples the pitch period, in samples: the loop length over the whole number of periods it holds
 * @param seamLevelDb what the seam leaves after the crossfade, in dB relative to the RMS of the sustained sound
 *     (negative: below it); see {@link LoopCrossfade#seamLevelDb}
 * @param crossfadeSamples length of the baked crossfade, in samples
 */
public record SeamlessLoop(int start, int end, double periodSamples, double seamLevelDb, int crossfadeSamples) {
    /** Passes of the loop a preview plays, so that the seam can be heard (three times over). */
    public static final int PREVIEW_PASSES = 4;

    /** Checks that the loop is a stretch of whole periods with room for its crossfade before the start. */
    public SeamlessLoop {
        Checks.checkArgument(crossfadeSamples >= 1 && start >= crossfadeSamples && end - start >= crossfadeSamples,
                "loop %d..%d needs a crossfade of 1..%d samples: %d", start, end, Math.min(start, end - start),
                crossfadeSamples);
        Checks.checkArgument(periodSamples > 0 && periodSamples <= end - start, "period %s does not fit loop %d..%d",
                periodSamples, start, end);
    }

    /** Samples in the loop. */
    public int lengthSamples() {
        return end - start;
    }

    /** The whole number of periods the loop holds. */
    public long periods() {
        return Math.round(lengthSamples() / periodSamples);
    }

    /** The pitch in hertz at {@code rateHz}. */
    public double pitchHz(double rateHz) {
        return rateHz / periodSamples;
    }
}
