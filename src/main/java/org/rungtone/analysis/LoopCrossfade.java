package org.rungtone.analysis;

import java.util.Arrays;
import org.rungtone.internal.Checks;
import org.rungtone.source.Signal;

/**
 * The crossfade baked into the stored samples of a {@link SeamlessLoop}, and the seam level it leaves.
 *
 * <p>Before the loop end: the last C samples of the loop fade from the sound's own samples into the C samples
 * that lead into the loop start, {@code y[e−C+i] = (1 − wᵢ)·x[e−C+i] + wᵢ·x[s−C+i]} with
 * {@code wᵢ = (i+1)/C}, so the sample played just before the jump back is exactly the one that precedes the
 * loop start in the sound, and the jump continues the waveform. After the loop end (the part a player goes
 * on to once the loop is released, or straight through when the sound is played once): the first C samples
 * fade from the continuation of the loop start back into the sound's own tail,
 * {@code y[e+i] = (1 − vᵢ)·x[s+i] + vᵢ·x[e+i]} with {@code vᵢ = i/C}, so leaving the loop is as smooth as
 * repeating it.
 *
 * <p>Linear rather than equal-power: the two stretches blended are matched in phase (the loop holds whole
 * periods, its end refined to the sample), so they add like one signal and gains summing to 1 keep the
 * level; equal-power gains ({@code cos² + sin² = 1}) suit unrelated signals and would swell matched ones by
 * up to 3 dB halfway through.
 */
public final class LoopCrossfade {
    /** The seam level reported for a seam that leaves nothing (an exactly periodic sound): -120 dB. */
    public static final double FLOOR_DB = -120;

    private LoopCrossfade() {
    }

    /** The gain of the loop-start lead-in at step {@code i} of a crossfade of {@code length} samples. */
    static double weight(int i, int length) {
        return (i + 1) / (double) length;
    }

    /**
     * The seam level of a loop {@code start .. end − 1} with a crossfade of {@code length} samples: the RMS,
     * over the crossfade, of the difference between the samples played and the samples that lead into the
     * loop start in the sound, {@code (1 − wᵢ)·(x[e−C+i] − x[s−C+i])}, in dB relative to {@code rms} (the
     * sustained sound's); never below {@link #FLOOR_DB}.
     */
    public static double seamLevelDb(double[] x, int start, int end, int length, double rms) {
        double sum = 0;
        for (int i = 0; i < length; i++) {
            double d = (1 - weight(i, length)) * (x[end - length + i] - x[start - length + i]);
            sum += d * d;
        }
        double level = 10 * Math.log10(sum / length / (rms * rms));
        return Double.isNaN(level) ? FLOOR_DB : Math.max(FLOOR_DB, level);
    }

    /**
     * The sound's first {@code keep} samples (at least up to the loop end) with the loop's crossfades baked in:
     * the one before the loop end always, the one after it over as much of the kept tail as there is.
     *
     * @throws IllegalArgumentException when {@code keep} cuts into the loop or runs past the sound
     */
    public static Signal bake(Signal sound, SeamlessLoop loop, int keep) {
        Checks.checkArgument(keep >= loop.end() && keep <= sound.length(), "keep %d samples of %d with a loop"
                + " ending at %d", keep, sound.length(), loop.end());
        double[] x = sound.unsafeSamples();
        double[] y = Arrays.copyOf(x, keep);
        int s = loop.start();
        int e = loop.end();
        int c = loop.crossfadeSamples();
        for (int i = 0; i < c; i++) {
            double w = weight(i, c);
            y[e - c + i] = (1 - w) * x[e - c + i] + w * x[s - c + i];
        }
        int tail = Math.min(c, keep - e);
        for (int i = 0; i < tail; i++) {
            double v = i / (double) c;
            y[e + i] = (1 - v) * x[s + i] + v * x[e + i];
        }
        return Signal.wrap(y, sound.sampleRateHz());
    }
}
