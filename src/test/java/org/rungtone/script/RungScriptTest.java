package org.rungtone.script;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.internal.InputError;
import org.rungtone.source.Signal;

/** The facade: declarations, rates, wavetables and loading files. */
class RungScriptTest {
    @TempDir
    Path dir;

    @Test
    void clipReportsItsDeclarations() {
        RungScript s = RungScript.parse("duration 1.5s\nrate 8kHz\nout 0", "c.rung");
        assertEquals(RungScript.Kind.CLIP, s.kind());
        assertEquals(1.5, s.durationSeconds());
        assertEquals(0, s.tableLength());
        assertEquals(OptionalDouble.of(8000), s.declaredRateHz());
    }

    @Test
    void declarationsMayUseConstantNamedValuesAndArithmetic() {
        RungScript s = RungScript.parse("let beat = 250ms\nduration 6 * beat\nrate 2 * 8kHz\nout sine(A4) for beat",
                "c.rung");
        assertEquals(1.5, s.durationSeconds());
        assertEquals(OptionalDouble.of(16000), s.declaredRateHz());
        RungScript table = RungScript.parse("let bits = 8\nwavetable 2 ^ bits\nout phase", "w.rung");
        assertEquals(256, table.tableLength());
    }

    @Test
    void clipRendersAtTheGivenTheDeclaredOrTheDefaultRate() {
        RungScript declared = RungScript.parse("duration 1.5s\nrate 8kHz\nout 0.25", "c.rung");
        Signal atDeclared = declared.render(Double.NaN, 0);
        assertEquals(8000, atDeclared.sampleRateHz());
        assertEquals(12000, atDeclared.length());
        assertEquals(0.25, atDeclared.sample(11999));
        Signal overridden = declared.render(22050, 0);
        assertEquals(22050, overridden.sampleRateHz());
        assertEquals(33075, overridden.length());
        Signal byDefault = RungScript.parse("duration 0.5s\nout 0", "c.rung").render(Double.NaN, 0);
        assertEquals(16000, byDefault.sampleRateHz());
        assertEquals(8000, byDefault.length());
    }

    @Test
    void fsIsTheRenderRate() {
        RungScript s = RungScript.parse("duration 10ms\nout fs / 100000", "c.rung");
        assertEquals(0.48, s.render(48000, 0).sample(0), 1e-15);
        assertEquals(0.16, s.render(Double.NaN, 0).sample(0), 1e-15);
    }

    @Test
    void sampleIndexAndTimeCountFromTheStart() {
        double[] y = Scripts.clip("n - t * fs", 0.1, 1000);
        for (double v : y) {
            assertEquals(0, v, 1e-12);
        }
        assertEquals(1234, Scripts.clip("n", 2, 1000)[1234]);
    }

    @Test
    void wavetableRendersOneCycleOverPhaseZeroToOne() {
        RungScript s = RungScript.parse("wavetable 256 samples\nout 0.5 * sine(1Hz) + 0.25 * sin(2 * pi * 3 * phase)",
                "w.rung");
        assertEquals(RungScript.Kind.WAVETABLE, s.kind());
        assertEquals(256, s.tableLength());
        assertTrue(Double.isNaN(s.durationSeconds()));
        Signal cycle = s.render(Double.NaN, 0);
        assertEquals(256, cycle.length());
        assertEquals(256, cycle.sampleRateHz());
        for (int n = 0; n < 256; n++) {
            double expected = 0.5 * Math.sin(2 * Math.PI * n / 256) + 0.25 * Math.sin(2 * Math.PI * 3 * n / 256);
            assertEquals(expected, cycle.sample(n), 1e-12);
        }
        Signal labelled = s.render(44100, 0);
        assertEquals(44100, labelled.sampleRateHz());
        assertEquals(cycle.samples()[17], labelled.samples()[17]);
    }

    @Test
    void wavetableUsesItsDeclaredRateAsLabel() {
        Signal s = RungScript.parse("wavetable 32\nrate 8kHz\nout phase", "w.rung").render(Double.NaN, 0);
        assertEquals(8000, s.sampleRateHz());
        assertEquals(31 / 32.0, s.sample(31));
    }

    @Test
    void refusesANonPositiveRate() {
        RungScript s = RungScript.parse("duration 1s\nout 0", "c.rung");
        InputError e = assertThrows(InputError.class, () -> s.render(0, 0));
        assertEquals("c.rung: the sample rate must be a positive number of hertz: 0.0", e.getMessage());
    }

    @Test
    void loadsAUtf8File() throws IOException {
        Path file = dir.resolve("chime.rung");
        Files.writeString(file, "# µ-law? no: plain\nduration 250ms\nout sine(A4)\n", StandardCharsets.UTF_8);
        RungScript s = RungScript.load(file);
        assertEquals(0.25, s.durationSeconds());
    }

    @Test
    void loadNamesTheFileInErrors() throws IOException {
        Path file = dir.resolve("bad.rung");
        Files.writeString(file, "duration 1s\nlet level = 0.5\nout sine(440Hz) * levle\n", StandardCharsets.UTF_8);
        ScriptError e = assertThrows(ScriptError.class, () -> RungScript.load(file));
        assertEquals(file + ":3:19: unknown name 'levle'; did you mean 'level'?", e.getMessage());
    }

    @Test
    void loadReportsMissingUnreadableAndNonTextFiles() throws IOException {
        Path missing = dir.resolve("missing.rung");
        assertEquals(missing + ": no such file; expected a .rung script",
                assertThrows(InputError.class, () -> RungScript.load(missing)).getMessage());
        assertEquals(dir + ": is a folder; expected a .rung script",
                assertThrows(InputError.class, () -> RungScript.load(dir)).getMessage());
        Path binary = dir.resolve("binary.rung");
        Files.write(binary, new byte[] {'o', 'u', 't', ' ', (byte) 0xC3, (byte) 0x28});
        assertEquals(binary + ": is not UTF-8 text; expected a .rung script saved as UTF-8",
                assertThrows(InputError.class, () -> RungScript.load(binary)).getMessage());
    }

    @Test
    void namedValueUsedTwiceIsComputedOnce() {
        // Both uses of 'n1' see the same noise samples, so the difference is exactly zero.
        double[] y = Scripts.clip("let n1 = white()", "n1 - n1", 0.5, 8000, 9);
        for (double v : y) {
            assertEquals(0, v);
        }
    }

    @Test
    void renderingIsIndependentOfEarlierRenders() {
        RungScript s = RungScript.parse("duration 0.2s\nout sine(440Hz) * decay(50ms) + pink(0.01)", "c.rung");
        assertEquals(s.render(16000, 3), s.render(16000, 3));
    }
}
