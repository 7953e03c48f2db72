package org.rungtone.analysis;

import java.util.stream.IntStream;
import org.rungtone.internal.Checks;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.source.SampleSource;
import org.rungtone.source.Signal;

/**
 * Figures of what the listener gets ({@link ListenerReport}): the board's reconstructed output, as the
 * {@link AnalogModel} renders it, against the source as supplied at its own rate, so that what the target
 * rate loses (treble above half of it, images the hold lets through) shows, which the quantization-only
 * figures of {@link AudioMetrics} cannot show: they compare with the source already resampled to the
 * target rate.
 *
 * <p>Method. The source is resampled once to the preview rate (band-limited to 20 kHz, or 0.4536 of a rate
 * below 44.1 kHz), at most its first {@value #MAX_SECONDS} s. For an output: its delay behind the source is the peak of
 * their cross-correlation (interpolated to a small fraction of a sample), and the source is delayed by it
 * ({@link FractionalDelay}, exact in the band). Welch's auto and cross spectra ({@link CrossSpectrum})
 * then give per bin k the source's power {@code P_r}, the output's {@code P_o} and their cross spectrum
 * {@code S}. The output is compared with the source at one gain g for all frequencies but its own phase
 * in every bin, so that a filter's phase shift is not an error while its loss of treble is: the error in
 * bin k is {@code E_k = min over phase |O − g·e^(jφ)·R|² = P_o − 2g·|S| + g²·P_r}, which is the output's
 * power not coherent with the source plus {@code (|H_k| − g)²·P_r} with {@code |H_k| = |S|/P_r} the
 * output's response. The gain minimising the error in the band is {@code g = Σ|S| / ΣP_r}. Then listener
 * SNR (20 kHz band) {@code = g²·ΣP_r / ΣE_k} over the bins from 20 Hz to 20 kHz, and listener SNR
 * (A-weighted) {@code = g²·ΣP_r / Σ A(f_k)·E_k} with the A weighting of IEC 61672-1 on the error only, as
 * AES17 weights noise. With K segments the noise part of {@code E} reads low by about 1/K; segments are
 * chosen so that K ≥ 32 where the signal allows (at most 0.14 dB).
 *
 * <p>Immutable once prepared; {@link #measure} may be called from several threads.
 */
public final class ListenerMetrics {
    /** At most this much of the start of a sound is compared, as for the preview. */
    public static final double MAX_SECONDS = 60;
    /** Lower edge of the audio band. */
    public static final double BAND_LOW_HZ = 20;
    /** Stopband of the resampling and of the delay, in dB. */
    private static final double ATTENUATION_DB = 100;
    private static final int MIN_SEGMENTS = 32;
    private static final int MAX_SEGMENT = 1 << 15;
    private static final int MIN_SEGMENT = 256;
    /** The shortest output (and prepared source) the figures are measured on, at the preview rate. */
    public static final int MIN_SAMPLES = 2 * MIN_SEGMENT;
    /** Samples of the start used to find the delay. */
    private static final int DELAY_PROBE = 1 << 18;
    private static final int DELAY_SEGMENT = 1 << 13;
    private static final int CHUNK = 1 << 16;

    private final AnalogModel model;
    private final double[] reference;
    private final double passHz;

    private ListenerMetrics(AnalogModel model, double[] reference, double passHz) {
        this.model = model;
        this.reference = reference;
        this.passHz = passHz;
    }

    /**
     * The stretch of the source the listener hears: its first sample, its length, and the linear fades the
     * conditioning puts on it (as {@link org.rungtone.condition.Conditioner} does, over the kept samples).
     *
     * @param firstSample first kept sample (after trimming silence)
     * @param samples number of kept samples
     * @param fadeInSeconds linear fade-in length
     * @param fadeOutSeconds linear fade-out length
     */
    public record Span(int firstSample, int samples, double fadeInSeconds, double fadeOutSeconds) {
        /** All of a source of {@code samples} samples, without fades. */
        public static Span all(int samples) {
            return new Span(0, samples, 0, 0);
        }

        /**
         * What conditioning kept of a source of {@code samples} samples at {@code rateHz}: the silence it
         * trimmed at either end (in seconds, as {@code Conditioner.Conditioned} reports it) left out, and its
         * fades; empty when nothing is left.
         */
        public static java.util.Optional<Span> kept(int samples, double rateHz, double trimmedStartSeconds,
                double trimmedEndSeconds, double fadeInSeconds, double fadeOutSeconds) {
            int first = (int) Math.round(trimmedStartSeconds * rateHz);
            int kept = samples - first - (int) Math.round(trimmedEndSeconds * rateHz);
            return kept < 2 ? java.util.Optional.empty()
                    : java.util.Optional.of(new Span(first, kept, fadeInSeconds, fadeOutSeconds));
        }
    }

    /**
     * Prepares figures against {@code source} over {@code span}: reads at most the first
     * {@value #MAX_SECONDS} s of it and resamples them to the model's preview rate. The source is not kept.
     *
     * @throws IllegalArgumentException when the span lies outside the source or is empty
     */
    public static ListenerMetrics prepare(SampleSource source, Span span, AnalogModel model) {
        Checks.checkArgument(span.firstSample() >= 0 && span.samples() > 0
                && (long) span.firstSample() + span.samples() <= source.length(),
                "the listener span %d + %d lies outside the source's %d samples", span.firstSample(),
                span.samples(), source.length());
        double in = source.sampleRateHz();
        double out = model.previewRateHz();
        double pass = bandTopHz(Math.min(in, out));
        int kept = (int) Math.min(span.samples(), Math.ceil(MAX_SECONDS * in));
        Faded faded = new Faded(source, span, kept);
        double[] reference;
        if (in == out) {
            reference = new double[kept];
            faded.read(0, reference, 0, kept);
        } else {
            double stop = Math.min(0.49999 * in, out - pass);
            SincResampler resampler = new SincResampler(in, out, pass, stop, ATTENUATION_DB, new double[0]);
            int length = (int) Math.floor(kept * out / in);
            reference = new double[length];
            int chunks = (length + CHUNK - 1) / CHUNK;
            IntStream.range(0, chunks).parallel().forEach(c -> {
                int from = c * CHUNK;
                // a sample or two early: the resampler drops what it does not need
                long start = (long) Math.floor(from * in / out) - resampler.half() - 1;
                resampler.resampleInto(faded.from(start), start, from, Math.min(length, from + CHUNK), 0,
                        reference);
            });
        }
        return new ListenerMetrics(model, reference, Math.min(pass, bandTopHz(out)));
    }

    /** The model whose preview rate the figures use. */
    public AnalogModel model() {
        return model;
    }

    /** Length of the prepared reference at the preview rate. */
    public int length() {
        return reference.length;
    }

    /** True when an output of {@code samples} at the preview rate is long enough to measure. */
    public boolean measurable(int samples) {
        return Math.min(samples, reference.length) >= MIN_SAMPLES;
    }

    /** Top of the band the figures cover: 20 kHz from 44.1 kHz up, else 0.4536 of the rate. */
    static double bandTopHz(double rateHz) {
        return Math.min(AnalogModel.AUDIO_BAND_TOP_HZ, 0.4536 * rateHz);
    }

    /**
     * What the listener gets from codes played through a level table: renders the reconstructed output
     * (as long as the prepared source) and measures it.
     *
     * @throws IllegalArgumentException when the bit depths differ
     */
    public ListenerReport measure(Codes codes, LevelTable table) {
        int needed = (int) Math.min(codes.length(),
                Math.ceil((reference.length + 1) * codes.sampleRateHz() / model.previewRateHz()) + 1);
        Codes head = needed == codes.length() ? codes
                : Codes.of(codes.bits(), codes.sampleRateHz(), java.util.Arrays.copyOf(codes.unsafeCodes(), needed));
        return measure(model.render(head, table).signal());
    }

    /**
     * What the listener gets from a reconstructed output at the preview rate (its units are free: the gain
     * is fitted).
     *
     * @throws IllegalArgumentException when the output is at another rate, or either is too short to measure
     */
    public ListenerReport measure(Signal output) {
        double rate = model.previewRateHz();
        Checks.checkArgument(output.sampleRateHz() == rate, "output at %s Hz, the listener figures at %s Hz",
                output.sampleRateHz(), rate);
        double[] o = output.unsafeSamples();
        int n = Math.min(o.length, reference.length);
        Checks.checkArgument(n >= MIN_SAMPLES, "the listener figures need %d samples: %d", MIN_SAMPLES, n);
        int probe = Math.min(n, DELAY_PROBE);
        double delay = CrossSpectrum.of(reference, 0, o, probe, rate, Math.min(DELAY_SEGMENT,
                Integer.highestOneBit(probe))).delaySamples();
        double[] aligned = new FractionalDelay(delay, rate, passHz, ATTENUATION_DB).apply(reference, n);
        CrossSpectrum x = CrossSpectrum.of(aligned, 0, o, n, rate, segment(n));
        return figures(x, n, rate, delay);
    }

    private ListenerReport figures(CrossSpectrum x, int n, double rate, double delay) {
        double top = bandTopHz(rate);
        double sumR = 0;
        double sumS = 0;
        for (int k = 0; k < x.bins(); k++) {
            double f = x.frequencyHz(k);
            if (f >= BAND_LOW_HZ && f <= top) {
                sumR += x.referencePower(k);
                sumS += x.crossMagnitude(k);
            }
        }
        double g = sumR > 0 ? sumS / sumR : 0;
        double error = 0;
        double weighted = 0;
        for (int k = 0; k < x.bins(); k++) {
            double f = x.frequencyHz(k);
            if (f >= BAND_LOW_HZ && f <= top) {
                double e = Math.max(0, x.outputPower(k) - 2 * g * x.crossMagnitude(k) + g * g * x.referencePower(k));
                error += e;
                weighted += e * AWeighting.powerGain(f);
            }
        }
        double signal = g * g * sumR;
        return new ListenerReport(rate, n / rate, BAND_LOW_HZ, top, db(signal / error), db(signal / weighted),
                delay / rate);
    }

    /** The largest power of two up to {@value #MAX_SEGMENT} that gives at least 32 half-overlapping segments. */
    private static int segment(int n) {
        int l = MAX_SEGMENT;
        while (l > MIN_SEGMENT && 1 + (n - l) / (l / 2) < MIN_SEGMENTS) {
            l /= 2;
        }
        return Math.min(l, Integer.highestOneBit(n));
    }

    private static double db(double ratio) {
        return 10 * Math.log10(ratio);
    }

    /** The kept stretch of a source with the conditioning's fades, read by range; zero outside it. */
    private record Faded(SampleSource source, Span span, int kept) {
        void read(int from, double[] dst, int offset, int count) {
            int lo = Math.max(from, 0);
            int hi = Math.min(from + count, kept);
            java.util.Arrays.fill(dst, offset, offset + count, 0);
            if (hi <= lo) {
                return;
            }
            source.read(span.firstSample() + lo, dst, offset + lo - from, hi - lo);
            double rate = source.sampleRateHz();
            int n = span.samples();
            int fadeIn = (int) Math.min(n, Math.round(span.fadeInSeconds() * rate));
            int fadeOut = (int) Math.min(n, Math.round(span.fadeOutSeconds() * rate));
            for (int i = lo; i < hi; i++) {
                double v = dst[offset + i - from];
                if (i < fadeIn) {
                    v *= (double) i / fadeIn;
                }
                if (n - 1 - i < fadeOut) {
                    v *= (double) (n - 1 - i) / fadeOut;
                }
                dst[offset + i - from] = v;
            }
        }

        /** The stretch as a sequential source whose next sample is {@code start} (may be negative). */
        SincResampler.Source from(long start) {
            int[] next = {(int) start};
            return (dst, offset, count) -> {
                read(next[0], dst, offset, count);
                next[0] += count;
            };
        }
    }
}
