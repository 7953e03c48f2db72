package org.rungtone.condition;

import org.rungtone.source.Signal;

/** Changes a signal's sample rate with an anti-alias (or anti-image) low-pass filter. */
public interface Resampler {
    /**
     * Resamples {@code signal} to {@code targetRateHz}. The output has {@code ceil(n·fout/fin)} samples
     * (give or take one) and is time-aligned with the input (no added delay).
     *
     * @throws IllegalArgumentException when the target rate is not positive
     */
    Signal resample(Signal signal, double targetRateHz);

    /** A short name for reports. */
    String name();
}
