package org.rungtone.analysis;

import java.util.Arrays;
import java.util.Optional;
import org.rungtone.source.Signal;

/**
 * The sustained part of a sound: the longest stretch whose level stays steady, found on an envelope of RMS
 * frames. A loop must start and end inside it, where the level at the loop end matches the level at the start.
 *
 * <p>Frames are {@value #FRAME_SECONDS} s long, two periods of a 50 Hz hum, so that a frame's RMS does not
 * swing with the phase of the waveform. The steady level is the median RMS of the frames within
 * {@value #QUIET_DB} dB of the loudest (the quiet lead-in and tail do not count); the sustained part is the
 * longest run of frames within ±{@value #STEADY_DB} dB of it (a rule of thumb of ours, no source: a
 * tremolo or a slow swell of the level stays inside, an attack and a release stay outside).
 *
 * @param start first sample of the sustained part
 * @param end one past its last sample
 * @param rms RMS of the signal over the part (full scale 1)
 */
public record SustainedPart(int start, int end, double rms) {
    /** Length of one envelope frame in seconds. */
    static final double FRAME_SECONDS = 0.04;
    /** Frames quieter than this below the loudest are not part of the sound's body. */
    static final double QUIET_DB = 40;
    /** How far a frame's level may stray from the steady level and still count as sustained. */
    static final double STEADY_DB = 3;

    /** Samples in the part. */
    public int length() {
        return end - start;
    }

    /** The sustained part of {@code signal}, or empty for silence or a sound shorter than two frames. */
    public static Optional<SustainedPart> of(Signal signal) {
        double[] x = signal.unsafeSamples();
        int frame = Math.max(1, (int) Math.round(FRAME_SECONDS * signal.sampleRateHz()));
        int frames = x.length / frame;
        if (frames < 2) {
            return Optional.empty();
        }
        double[] env = new double[frames];
        double loudest = 0;
        for (int f = 0; f < frames; f++) {
            env[f] = Math.sqrt(meanSquare(x, f * frame, (f + 1) * frame));
            loudest = Math.max(loudest, env[f]);
        }
        if (!(loudest > 0)) {
            return Optional.empty();
        }
        double quiet = loudest * Math.pow(10, -QUIET_DB / 20);
        double level = median(Arrays.stream(env).filter(e -> e >= quiet).toArray());
        double low = level * Math.pow(10, -STEADY_DB / 20);
        double high = level * Math.pow(10, STEADY_DB / 20);
        int bestStart = 0;
        int bestLength = 0;
        int runStart = 0;
        for (int f = 0; f <= frames; f++) {
            boolean steady = f < frames && env[f] >= low && env[f] <= high;
            if (!steady) {
                if (f - runStart > bestLength) {
                    bestStart = runStart;
                    bestLength = f - runStart;
                }
                runStart = f + 1;
            }
        }
        if (bestLength == 0) {
            return Optional.empty();
        }
        int start = bestStart * frame;
        int end = (bestStart + bestLength) * frame;
        return Optional.of(new SustainedPart(start, end, Math.sqrt(meanSquare(x, start, end))));
    }

    static double meanSquare(double[] x, int from, int to) {
        double sum = 0;
        for (int i = from; i < to; i++) {
            sum += x[i] * x[i];
        }
        return to > from ? sum / (to - from) : 0;
    }

    private static double median(double[] values) {
        double[] v = values.clone();
        Arrays.sort(v);
        int n = v.length;
        return n % 2 == 1 ? v[n / 2] : 0.5 * (v[n / 2 - 1] + v[n / 2]);
    }
}
