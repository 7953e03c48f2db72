package org.rungtone.script;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.rungtone.source.Signal;

/** Every example script parses, renders within full scale and makes sound. */
class ExamplesTest {
    private static final Path FOLDER = Path.of("examples", "scripts");

    static List<Path> scripts() throws IOException {
        try (Stream<Path> files = Files.list(FOLDER)) {
            return files.filter(p -> p.toString().endsWith(".rung")).sorted().collect(Collectors.toList());
        }
    }

    @Test
    void theFourScenariosAreThere() throws IOException {
        List<String> names = scripts().stream().map(p -> p.getFileName().toString()).collect(Collectors.toList());
        assertTrue(names.containsAll(List.of("greenhouse-door-chime.rung", "freezer-warble-alarm.rung",
                "bench-log-sweep.rung", "wavetable-256.rung")), names.toString());
    }

    @ParameterizedTest
    @MethodSource("scripts")
    void rendersWithinFullScale(Path file) {
        RungScript script = RungScript.load(file);
        Signal s = script.render(Double.NaN, 1);
        int expected = script.kind() == RungScript.Kind.CLIP
                ? (int) Math.round(script.durationSeconds() * s.sampleRateHz()) : script.tableLength();
        assertEquals(expected, s.length());
        assertTrue(s.peak() <= 1.0, "peak " + s.peak());
        double energy = 0;
        for (double v : s.unsafeSamples()) {
            energy += v * v;
        }
        assertTrue(Math.sqrt(energy / s.length()) > 0.05, "too quiet");
        assertFalse(script.toSExpression().isEmpty());
    }

    @Test
    void wavetableIsOneCycleOf256Samples() {
        Signal s = RungScript.load(FOLDER.resolve("wavetable-256.rung")).render(Double.NaN, 1);
        assertEquals(256, s.length());
        assertEquals(0.0, s.sample(0), 1e-15);
        // Odd symmetry of a sum of sines: y(N − n) = −y(n).
        for (int n = 1; n < 256; n++) {
            assertEquals(-s.sample(n), s.sample(256 - n), 1e-12);
        }
    }

    @Test
    void sweepPassesOneKilohertzWhereTheExponentialLawSaysSo() {
        // f(t) = 20·1000^(t/10): 1 kHz at t = 10·log(50)/log(1000) = 5.663 s.
        Signal s = RungScript.load(FOLDER.resolve("bench-log-sweep.rung")).render(Double.NaN, 1);
        double t = 10 * Math.log(50) / Math.log(1000);
        int from = (int) ((t - 0.002) * s.sampleRateHz());
        int to = (int) ((t + 0.002) * s.sampleRateHz());
        double[] y = s.unsafeSamples();
        int crossings = 0;
        for (int i = from + 1; i <= to; i++) {
            if ((y[i - 1] < 0) != (y[i] < 0)) {
                crossings++;
            }
        }
        assertEquals(8, crossings, 1);   // 4 ms at 1 kHz: four cycles, eight zero crossings
    }
}
