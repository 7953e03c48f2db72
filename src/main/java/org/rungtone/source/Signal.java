package org.rungtone.source;

import java.util.Arrays;
import org.rungtone.internal.Checks;

/**
 * A mono sampled signal: the value type that flows between the stages.
 *
 * <p>Numeric conventions, fixed once for the whole tool: samples are {@code double} and full scale is
 * [-1, 1] (values outside are allowed in intermediate signals and count as clipping when quantized);
 * {@code sampleRateHz} is in hertz; levels in dB are relative to full scale (dBFS) unless a name says
 * otherwise. Codes, elsewhere, are {@code int} in [0, 2^N − 1], offset binary.
 *
 * <p>The sample array is copied on the way in and out; {@link #unsafeSamples()} hands over the internal
 * array without a copy for the stages' inner loops, which must not modify it.
 */
public final class Signal {
    private final double[] samples;
    private final double sampleRateHz;

    private Signal(double[] samples, double sampleRateHz) {
        this.samples = samples;
        this.sampleRateHz = sampleRateHz;
    }

    /**
     * Creates a signal from a copy of {@code samples}.
     *
     * @throws IllegalArgumentException when the rate is not finite and positive
     */
    public static Signal of(double[] samples, double sampleRateHz) {
        return wrap(samples.clone(), sampleRateHz);
    }

    /**
     * Creates a signal that takes ownership of {@code samples} without copying: the caller must not touch
     * the array afterwards. For stages that have just built the array.
     */
    public static Signal wrap(double[] samples, double sampleRateHz) {
        Checks.checkArgument(Double.isFinite(sampleRateHz) && sampleRateHz > 0,
                "sample rate must be positive: %s", sampleRateHz);
        return new Signal(samples, sampleRateHz);
    }

    /** Sample rate in hertz. */
    public double sampleRateHz() {
        return sampleRateHz;
    }

    /** Number of samples. */
    public int length() {
        return samples.length;
    }

    /** Duration in seconds. */
    public double durationSeconds() {
        return samples.length / sampleRateHz;
    }

    /** Sample {@code i}. */
    public double sample(int i) {
        return samples[i];
    }

    /** A copy of the samples. */
    public double[] samples() {
        return samples.clone();
    }

    /** The internal array, not copied: read-only by contract. */
    public double[] unsafeSamples() {
        return samples;
    }

    /** Largest absolute sample value (0 for an empty signal). */
    public double peak() {
        double p = 0;
        for (double v : samples) {
            p = Math.max(p, Math.abs(v));
        }
        return p;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Signal s && s.sampleRateHz == sampleRateHz && Arrays.equals(s.samples, samples);
    }

    @Override
    public int hashCode() {
        return 31 * Double.hashCode(sampleRateHz) + Arrays.hashCode(samples);
    }

    @Override
    public String toString() {
        return "Signal[" + samples.length + " samples @ " + sampleRateHz + " Hz]";
    }
}
