package org.rungtone.examples;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.rungtone.source.Signal;
import org.rungtone.source.WavWriter;

/**
 * The example WAV files are made by this generator, not recorded: the test checks that the committed files
 * are exactly what it makes. Run with {@code -Drungtone.regenerate=true} to rewrite them.
 */
class ExampleAssetsTest {
    static final Path CHIME = Path.of("examples/greenhouse/door-chime.wav");
    static final Path VOICE = Path.of("examples/speech-band/vent-announcement.wav");

    /**
     * The greenhouse door chime: a two-note "ding-dong" (E5 then C5, equal temperament from A4 = 440 Hz) with
     * three decaying partials each, 22.05 kHz mono, 1.6 s. Invented demo data.
     */
    static Signal doorChime() {
        double rate = 22_050;
        int n = (int) (1.6 * rate);
        double[] x = new double[n];
        double[][] notes = {{0.0, 440 * Math.pow(2, 7 / 12.0)}, {0.55, 440 * Math.pow(2, 3 / 12.0)}};
        double[] partial = {1, 2, 3.01};
        double[] level = {0.55, 0.22, 0.08};
        double[] decay = {0.45, 0.25, 0.12};
        for (double[] note : notes) {
            int start = (int) (note[0] * rate);
            for (int i = start; i < n; i++) {
                double t = (i - start) / rate;
                double attack = Math.min(1, t / 0.004);
                double v = 0;
                for (int p = 0; p < partial.length; p++) {
                    v += level[p] * Math.exp(-t / decay[p]) * Math.sin(2 * Math.PI * note[1] * partial[p] * t);
                }
                x[i] += attack * v;
            }
        }
        for (int i = 0; i < n; i++) {
            double tail = Math.min(1, (n - 1 - i) / (0.05 * rate));
            x[i] *= 0.8 * tail;
        }
        return Signal.wrap(x, rate);
    }

    /**
     * A speech-like announcement for the speech-band example: a source-filter vowel synthesizer (a glottal
     * pulse train at a gliding pitch through three formant resonators per vowel, with a short fricative of
     * filtered noise), 22.05 kHz mono, 2 s. Formant frequencies are typical adult values for the vowels
     * /a/, /i/ and /u/ (from memory). It is not a recording; invented demo data.
     */
    static Signal ventAnnouncement() {
        double rate = 22_050;
        int n = (int) (2.0 * rate);
        double[][] vowels = {{730, 1090, 2440}, {270, 2290, 3010}, {300, 870, 2240}, {730, 1090, 2440}};
        double[] x = new double[n];
        java.util.SplittableRandom noise = new java.util.SplittableRandom(3);
        double phase = 0;
        double[][] state = new double[3][2];
        for (int i = 0; i < n; i++) {
            double t = i / rate;
            int seg = Math.min(vowels.length - 1, (int) (t / 0.45));
            double f0 = 120 + 25 * Math.sin(2 * Math.PI * 0.6 * t);
            phase += f0 / rate;
            double pulse = 0;
            if (phase >= 1) {
                phase -= 1;
                pulse = 1;
            }
            boolean fricative = t > 1.80 && t < 1.95;
            double excitation = fricative ? 0.05 * (noise.nextDouble() - 0.5) : pulse;
            double y = excitation;
            for (int f = 0; f < 3; f++) {
                double fc = fricative ? 4200 + 600 * f : vowels[seg][f];
                double bw = 60 + 30 * f;
                double r = Math.exp(-Math.PI * bw / rate);
                double a1 = 2 * r * Math.cos(2 * Math.PI * fc / rate);
                double a2 = -r * r;
                double out = (1 - r) * y + a1 * state[f][0] + a2 * state[f][1];
                state[f][1] = state[f][0];
                state[f][0] = out;
                y = out;
            }
            boolean voiced = t > 0.05 && t < 1.80;
            double envelope = fricative ? 1 : voiced ? Math.min(1, Math.min(t - 0.05, 1.80 - t) / 0.03) : 0;
            x[i] = envelope * y;
        }
        double peak = 0;
        for (double v : x) {
            peak = Math.max(peak, Math.abs(v));
        }
        for (int i = 0; i < n; i++) {
            x[i] *= 0.7 / peak;
        }
        return Signal.wrap(x, rate);
    }

    static byte[] wavBytes(Signal s) throws IOException {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        WavWriter.write(out, s, WavWriter.Format.PCM16);
        return out.toByteArray();
    }

    @Test
    void committedChimeIsWhatTheGeneratorMakes() throws IOException {
        byte[] made = wavBytes(doorChime());
        if (Boolean.getBoolean("rungtone.regenerate")) {
            Files.write(CHIME, made);
        }
        assertArrayEquals(made, Files.readAllBytes(CHIME), "regenerate with -Drungtone.regenerate=true");
    }

    @Test
    void committedAnnouncementIsWhatTheGeneratorMakes() throws IOException {
        byte[] made = wavBytes(ventAnnouncement());
        if (Boolean.getBoolean("rungtone.regenerate")) {
            Files.write(VOICE, made);
        }
        assertArrayEquals(made, Files.readAllBytes(VOICE), "regenerate with -Drungtone.regenerate=true");
    }
}
