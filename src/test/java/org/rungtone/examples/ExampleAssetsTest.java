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
}
