package org.rungtone.source;

import org.rungtone.internal.Checks;

/**
 * Mono samples at one rate that are read by range rather than held whole: a {@link Signal} already in
 * memory, or a WAV file decoded on demand ({@link WavReader#open}). Long sources are conditioned through this
 * interface so that the decoded source never exists as one array; the resampler reads the stretch each of its
 * output blocks needs, from several threads at once.
 *
 * <p>{@link #read} must be safe to call from several threads. Damaged data (a NaN sample, a file cut short
 * while reading) raises {@link org.rungtone.internal.InputError} naming the first bad sample of the range.
 */
public interface SampleSource extends AutoCloseable {
    /** Sample rate in hertz. */
    double sampleRateHz();

    /** Number of samples. */
    int length();

    /**
     * Copies samples {@code from .. from + count - 1} into {@code dst[offset ..]}.
     *
     * @throws IllegalArgumentException when the range is outside the source or the array
     * @throws org.rungtone.internal.InputError when the data there is damaged
     */
    void read(int from, double[] dst, int offset, int count);

    /** Samples {@code from .. to - 1} as a new signal (always a fresh array). */
    default Signal read(int from, int to) {
        double[] x = new double[to - from];
        read(from, x, 0, x.length);
        return Signal.wrap(x, sampleRateHz());
    }

    /** Releases what the source holds open (nothing for a signal in memory). */
    @Override
    default void close() {
    }

    /** A source reading from {@code signal} (not copied). */
    static SampleSource of(Signal signal) {
        return new SampleSource() {
            @Override
            public double sampleRateHz() {
                return signal.sampleRateHz();
            }

            @Override
            public int length() {
                return signal.length();
            }

            @Override
            public void read(int from, double[] dst, int offset, int count) {
                Checks.checkArgument(from >= 0 && count >= 0 && from + count <= signal.length(),
                        "range %d+%d outside 0..%d", from, count, signal.length());
                System.arraycopy(signal.unsafeSamples(), from, dst, offset, count);
            }
        };
    }
}
