package org.rungtone.analysis;

import be.tarsos.dsp.pitch.PitchDetectionResult;
import be.tarsos.dsp.pitch.Yin;
import java.util.Arrays;
import java.util.OptionalDouble;
import org.rungtone.source.Signal;

/**
 * The pitch period of a stretch of a sound, in samples, from TarsosDSP's YIN detector (de Cheveigné and
 * Kawahara, "YIN, a fundamental frequency estimator for speech and music", JASA 111(4), 2002) run on up to
 * {@value #FRAMES} frames spread evenly over the stretch. Of the frames YIN calls pitched, those within
 * {@value #NEAR_MEDIAN} of the median period (an octave slip is far outside) give the mean frequency, whose
 * inverse is the period: a vibrato's swings cancel in a mean of frequencies, as they do in the phase.
 *
 * <p>Why YIN rather than TarsosDSP's McLeod (MPM) detector: YIN's difference function
 * {@code d(τ) = Σ (x[j] − x[j+τ])²} is the very mismatch a loop of τ samples leaves at its seam, and its
 * threshold on the normalized difference (0.2, the library's default) is a limit on the share of the power
 * that does not repeat, the question a loop search asks. TarsosDSP's {@code McLeodPitchMethod} also reports
 * no pitch below 80 Hz (its {@code LOWER_PITCH_CUTOFF}), which would rule out mains hum at 50 or 60 Hz; YIN's
 * lowest pitch is set by its buffer alone (the longest period it tries is half the buffer), here
 * {@value #LOWEST_PITCH_HZ} Hz.
 */
public final class PitchPeriod {
    /** The lowest fundamental looked for, in hertz: below a 50 Hz hum with room to spare. */
    static final double LOWEST_PITCH_HZ = 40;
    /** The most frames analysed; their median is robust against a few octave slips. */
    static final int FRAMES = 16;

    /** Frames whose period is within this fraction of the median count towards the mean. */
    static final double NEAR_MEDIAN = 0.3;

    private PitchPeriod() {
    }

    /**
     * The median pitch period over {@code from .. to} (samples), or empty when the stretch is shorter than
     * one YIN buffer or fewer than half of its frames have a pitch (noise, a chord of unrelated tones).
     */
    public static OptionalDouble of(Signal signal, int from, int to) {
        double rate = signal.sampleRateHz();
        int buffer = Integer.highestOneBit((int) Math.ceil(2 * rate / LOWEST_PITCH_HZ) - 1) << 1;
        int span = to - from;
        if (span < buffer) {
            return OptionalDouble.empty();
        }
        int frames = Math.min(FRAMES, 1 + (span - buffer) / (buffer / 2));
        Yin yin = new Yin((float) rate, buffer);
        double[] x = signal.unsafeSamples();
        float[] frame = new float[buffer];
        double[] periods = new double[frames];
        int pitched = 0;
        for (int f = 0; f < frames; f++) {
            int at = from + (frames == 1 ? 0 : (int) ((long) (span - buffer) * f / (frames - 1)));
            for (int i = 0; i < buffer; i++) {
                frame[i] = (float) x[at + i];
            }
            PitchDetectionResult r = yin.getPitch(frame);
            if (r.isPitched() && r.getPitch() > 0) {
                periods[pitched++] = rate / r.getPitch();
            }
        }
        if (2 * pitched < frames || pitched == 0) {
            return OptionalDouble.empty();
        }
        double[] p = Arrays.copyOf(periods, pitched);
        Arrays.sort(p);
        double median = pitched % 2 == 1 ? p[pitched / 2] : 0.5 * (p[pitched / 2 - 1] + p[pitched / 2]);
        // the mean frequency of the frames near the median: a vibrato's swings cancel in it
        double sum = 0;
        int near = 0;
        for (double period : p) {
            if (Math.abs(period / median - 1) <= NEAR_MEDIAN) {
                sum += 1 / period;
                near++;
            }
        }
        return OptionalDouble.of(near / sum);
    }
}
