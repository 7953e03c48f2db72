package org.rungtone.calibrate;

import java.nio.file.Path;
import java.util.SplittableRandom;
import org.rungtone.source.Signal;
import org.rungtone.source.WavWriter;

/**
 * A sound card's recording of a board playing a {@link RecordingSweep}, computed exactly: the board's levels
 * at its own clock, a first-order high-pass (the line input's coupling capacitor) solved step by step, a gain
 * (negative for an inverting input) and an offset, mains hum with two harmonics, white Gaussian noise, the
 * card's anti-alias filter as a short linear-phase low-pass, and rounding to 16-bit PCM with clipping at full
 * scale. Every parameter is the test's to draw; the fit is told none of them.
 */
public final class SyntheticRecording {
    /**
     * What the recording is made of.
     *
     * @param rateHz the card's sample rate
     * @param gain full-scale units per volt, negative for an inverting input
     * @param offset the card's DC offset, full-scale units
     * @param cornerHz the input's high-pass corner
     * @param clockPpm how much longer a board tick is than 1 ms of the card's clock, ppm
     * @param leadSeconds recording before the sweep starts
     * @param tailSeconds recording after it ends
     * @param noiseRms white noise per sample, full-scale units
     * @param humHz the mains frequency (0 for no hum)
     * @param humRms the hum's fundamental, rms full-scale units (harmonics 2 and 3 at half and a quarter)
     * @param filtered whether the card's anti-alias filter rings at the edges
     * @param seed the noise's seed
     */
    public record Card(double rateHz, double gain, double offset, double cornerHz, double clockPpm, double leadSeconds,
            double tailSeconds, double noiseRms, double humHz, double humRms, boolean filtered, long seed) {
    }

    private SyntheticRecording() {
    }

    /** The recording of {@code sweep} played on a board with {@code volts} per code, as 16-bit PCM values. */
    public static double[] record(RecordingSweep sweep, double[] volts, Card card) {
        double fs = card.rateHz();
        long[] ticks = sweep.stepStartTicks();
        int[] steps = sweep.stepCodes();
        double tick = fs / 1000 * (1 + card.clockPpm() * 1e-6);
        double start = card.leadSeconds() * fs;
        int n = (int) Math.ceil(start + ticks[ticks.length - 1] * tick + card.tailSeconds() * fs);
        double tau = fs / (2 * Math.PI * card.cornerHz());
        double[] y = new double[n];
        // before the sweep the board sits at mid code, long enough for the capacitor to have settled there
        double level = volts[volts.length / 2];
        double amplitude = 0;
        int i = (int) Math.ceil(start);
        for (int k = 0; k < steps.length; k++) {
            double edge = start + ticks[k] * tick;
            double next = k + 1 < steps.length ? start + ticks[k + 1] * tick : n;
            // the capacitor holds the level minus what the output has left: the jump passes whole
            double state = level - amplitude;
            level = volts[steps[k]];
            amplitude = level - state;
            double decay = Math.exp(-1 / tau);
            double out = amplitude * Math.exp(-(i - edge) / tau);
            for (; i < next && i < n; i++) {
                y[i] = card.gain() * out;
                out *= decay;
            }
            amplitude = amplitude * Math.exp(-(next - edge) / tau);
        }
        if (card.filtered()) {
            y = lowPass(y);
        }
        SplittableRandom random = new SplittableRandom(card.seed());
        double phase = random.nextDouble() * 2 * Math.PI;
        double w = 2 * Math.PI * card.humHz() / fs;
        double hum = Math.sqrt(2) * card.humRms();
        for (int j = 0; j < n; j++) {
            double v = y[j] + card.offset() + card.noiseRms() * random.nextGaussian();
            if (card.humHz() > 0) {
                double t = w * j + phase;
                v += hum * (Math.sin(t) + 0.5 * Math.sin(2 * t + 1) + 0.25 * Math.sin(3 * t + 2));
            }
            y[j] = Math.max(-32768, Math.min(32767, Math.rint(v * 32768))) / 32768;
        }
        return y;
    }

    /** Writes the recording as a 16-bit PCM WAV file (lossless: {@link #record} rounds to 16 bits). */
    public static Path wav(Path file, double[] y, double rateHz) {
        WavWriter.write(file, Signal.of(y, rateHz), WavWriter.Format.PCM16);
        return file;
    }

    /** A clean card: no hum, noise at {@code noiseRms}, the 5 V swing at {@code swing} full scale, 100 ppm. */
    public static Card card(double rateHz, double swing, double noiseRms, double leadSeconds, double tailSeconds) {
        return new Card(rateHz, swing / 5, 0, 4, 100, leadSeconds, tailSeconds, noiseRms, 0, 0, false, 3);
    }

    /** A 31-tap Hann-windowed sinc low-pass at 0.45 of the rate: the ringing of a card's decimation filter. */
    private static double[] lowPass(double[] x) {
        int half = 15;
        double[] h = new double[2 * half + 1];
        double sum = 0;
        for (int k = -half; k <= half; k++) {
            double t = 2 * 0.45 * k;
            double sinc = k == 0 ? 1 : Math.sin(Math.PI * t) / (Math.PI * t);
            h[k + half] = sinc * (0.5 + 0.5 * Math.cos(Math.PI * k / (half + 1)));
            sum += h[k + half];
        }
        double[] padded = new double[x.length + 2 * half];
        System.arraycopy(x, 0, padded, half, x.length);
        java.util.Arrays.fill(padded, 0, half, x[0]);
        java.util.Arrays.fill(padded, half + x.length, padded.length, x[x.length - 1]);
        double[] y = new double[x.length];
        for (int i = 0; i < x.length; i++) {
            double v = 0;
            for (int k = 0; k < h.length; k++) {
                v += h[k] * padded[i + k];
            }
            y[i] = v / sum;
        }
        return y;
    }
}
