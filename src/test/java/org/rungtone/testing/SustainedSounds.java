package org.rungtone.testing;

import java.util.Random;

/**
 * Synthesized sustained sounds with a known period, for the loop tests: an organ tone, a hum, a siren, and
 * noise that has no period at all. Each is samples in [-1, 1]; the rate is the caller's.
 */
public final class SustainedSounds {
    private SustainedSounds() {
    }

    /**
     * An organ-like tone: {@code hz} with harmonics 2, 3 and 4 at 0.5, 0.3 and 0.15 of the fundamental, an
     * attack that rises as {@code 1 − e^(−t/15 ms)}, a 100 ms linear release at the end, and white noise
     * {@code noiseDb} below the tone's peak (seeded, so the same every run).
     */
    public static double[] organ(double hz, double rate, double seconds, double noiseDb, long seed) {
        int n = (int) Math.round(seconds * rate);
        double[] x = new double[n];
        double[] level = {1, 0.5, 0.3, 0.15};
        Random random = new Random(seed);
        double noise = Math.pow(10, noiseDb / 20);
        int release = (int) Math.round(0.1 * rate);
        for (int i = 0; i < n; i++) {
            double t = i / rate;
            double v = 0;
            for (int h = 0; h < level.length; h++) {
                v += level[h] * Math.sin(2 * Math.PI * (h + 1) * hz * t + 0.3 * h);
            }
            double envelope = (1 - Math.exp(-t / 0.015)) * Math.min(1, (n - i) / (double) release);
            x[i] = 0.4 * envelope * v + noise * (2 * random.nextDouble() - 1);
        }
        return x;
    }

    /**
     * Mains hum: {@code hz} with its odd harmonics 3, 5, 7 (0.4, 0.2, 0.1 of the fundamental), as a transformer
     * hums, at a steady level from the first sample.
     */
    public static double[] hum(double hz, double rate, double seconds) {
        int n = (int) Math.round(seconds * rate);
        double[] x = new double[n];
        double[] level = {1, 0.4, 0.2, 0.1};
        for (int i = 0; i < n; i++) {
            double t = i / rate;
            double v = 0;
            for (int h = 0; h < level.length; h++) {
                v += level[h] * Math.sin(2 * Math.PI * (2 * h + 1) * hz * t + 0.5 * h);
            }
            x[i] = 0.35 * v;
        }
        return x;
    }

    /**
     * A siren: a tone of mean pitch {@code hz} whose pitch swings ±{@code depth} (a fraction) at
     * {@code vibratoHz}, with its second harmonic at half level; the phase is the integral of the frequency.
     */
    public static double[] siren(double hz, double depth, double vibratoHz, double rate, double seconds) {
        int n = (int) Math.round(seconds * rate);
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            double t = i / rate;
            // ∫ hz·(1 + depth·sin(2π·fv·t)) dt
            double phase = 2 * Math.PI * hz * (t + depth * (1 - Math.cos(2 * Math.PI * vibratoHz * t))
                    / (2 * Math.PI * vibratoHz));
            x[i] = 0.5 * (Math.sin(phase) + 0.5 * Math.sin(2 * phase));
        }
        return x;
    }

    /** White noise, uniform in ±{@code amplitude}, seeded. */
    public static double[] noise(double amplitude, double rate, double seconds, long seed) {
        Random random = new Random(seed);
        double[] x = new double[(int) Math.round(seconds * rate)];
        for (int i = 0; i < x.length; i++) {
            x[i] = amplitude * (2 * random.nextDouble() - 1);
        }
        return x;
    }
}
