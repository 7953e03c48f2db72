package org.rungtone.project;

import java.util.concurrent.atomic.AtomicLong;
import java.util.function.DoubleConsumer;
import org.rungtone.source.SampleSource;

/**
 * A source that tells, after each read, what share of its samples has been read so far, for a progress line
 * while a long file is decoded. Reads overlap a little (a resampler's kernel reaches past its block), so the
 * share is capped at 1. The samples pass through unchanged.
 */
final class ReadShare implements SampleSource {
    private final SampleSource source;
    private final DoubleConsumer share;
    private final AtomicLong read = new AtomicLong();

    ReadShare(SampleSource source, DoubleConsumer share) {
        this.source = source;
        this.share = share;
    }

    @Override
    public double sampleRateHz() {
        return source.sampleRateHz();
    }

    @Override
    public int length() {
        return source.length();
    }

    @Override
    public void read(int from, double[] dst, int offset, int count) {
        source.read(from, dst, offset, count);
        share.accept(Math.min(1, read.addAndGet(count) / (double) Math.max(1, source.length())));
    }

    @Override
    public void close() {
        source.close();
    }
}
