package org.rungtone.condition;

import org.rungtone.source.SampleSource;
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

    /**
     * Resamples samples {@code from} to {@code to} (exclusive) of {@code source}, as if that range were the
     * whole signal. The default reads the range into memory; implementations may read it block by block.
     */
    default Signal resample(SampleSource source, int from, int to, double targetRateHz) {
        return resample(source.read(from, to), targetRateHz);
    }

    /** A short name for reports. */
    String name();

    /** The name for reports of a conversion from {@code fromHz} to {@code toHz} (the default: {@link #name}). */
    default String describe(double fromHz, double toHz) {
        return name();
    }
}
