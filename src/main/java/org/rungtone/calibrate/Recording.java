package org.rungtone.calibrate;

import java.nio.file.Path;
import java.util.Objects;
import org.rungtone.internal.Checks;
import org.rungtone.internal.InputError;
import org.rungtone.source.WavFormat;
import org.rungtone.source.WavReader;

/**
 * A sound card's recording of the sweep: one channel's samples in full-scale units, its rate, and the
 * largest value its format can hold (a sample there may be clipped). Of a stereo file the louder channel is
 * taken: a mono cable in a stereo jack leaves the other one silent.
 *
 * @param source the file name, for messages
 * @param samples the samples, handed over without a copy (never changed)
 * @param sampleRateHz samples per second
 * @param pcmBits bits of an integer format, 0 for floating point
 * @param channel the channel used, 1-based
 * @param channels the file's channel count
 */
public record Recording(String source, double[] samples, double sampleRateHz, int pcmBits, int channel,
        int channels) {
    /** The lowest rate the fit accepts. */
    public static final double MIN_RATE_HZ = 8000;
    /** The fewest integer bits the fit accepts. */
    public static final int MIN_PCM_BITS = 16;

    /** Checks the values. */
    public Recording {
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(samples, "samples");
        Checks.checkArgument(sampleRateHz > 0, "rate must be positive: %s", sampleRateHz);
    }

    /**
     * Reads a WAV recording and refuses a format the fit cannot use: fewer than {@value #MIN_PCM_BITS}
     * integer bits (an 8-bit step is coarser than a 10-bit ladder's) or a rate below 8 kHz (the input filter
     * then rings for milliseconds after every step).
     *
     * @throws InputError naming the file for an unreadable file or an unusable format
     */
    public static Recording read(Path file) {
        WavFormat f;
        try (WavReader.Stream s = WavReader.open(file, 0)) {
            f = s.format();
        }
        boolean floating = f.encoding() == WavFormat.Encoding.FLOAT32 || f.encoding() == WavFormat.Encoding.FLOAT64;
        int bits = floating ? 0 : f.validBits();
        if (!floating && bits < MIN_PCM_BITS) {
            throw InputError.inFile(file, "a recording of " + bits + "-bit samples is too coarse for the fit;"
                    + " record with 16 bits or more (or float)");
        }
        if (f.sampleRateHz() < MIN_RATE_HZ) {
            throw InputError.inFile(file, "a recording at " + f.sampleRateHz() + " Hz is too slow for the fit;"
                    + " record at 44.1 or 48 kHz (8 kHz at least)");
        }
        double[][] all = WavReader.readChannels(file);
        int best = 0;
        double bestPower = -1;
        for (int c = 0; c < all.length; c++) {
            double p = 0;
            for (double v : all[c]) {
                p += v * v;
            }
            if (p > bestPower) {
                bestPower = p;
                best = c;
            }
        }
        return new Recording(file.toString(), all[best], f.sampleRateHz(), bits, best + 1, all.length);
    }

    /** Samples in the recording. */
    public int length() {
        return samples.length;
    }

    /** Length in seconds. */
    public double durationSeconds() {
        return samples.length / sampleRateHz;
    }

    /** The largest magnitude a sample can show without clipping: the top integer code, or 1 for floats. */
    public double railLevel() {
        return pcmBits == 0 ? 1.0 : 1.0 - Math.pow(2, -(pcmBits - 1));
    }
}
