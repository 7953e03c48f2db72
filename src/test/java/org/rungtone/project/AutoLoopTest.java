package org.rungtone.project;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalLong;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.analysis.SeamlessLoop;
import org.rungtone.calibrate.OutputSpan;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.firmware.PlaybackEngine;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Warning;
import org.rungtone.quantize.Codes;
import org.rungtone.source.Signal;
import org.rungtone.source.WavReader;
import org.rungtone.source.WavWriter;
import org.rungtone.testing.SustainedSounds;

class AutoLoopTest {
    private static final double RATE = 16_000;

    @TempDir
    Path dir;

    /** A 2 s organ tone at 440 Hz, 16 kHz, as a 16-bit WAV. */
    private Path organ() {
        Path wav = dir.resolve("organ.wav");
        WavWriter.write(wav, Signal.wrap(SustainedSounds.organ(440, RATE, 2, -70, 1), RATE), WavWriter.Format.PCM16);
        return wav;
    }

    private BuildPlan.Builder plan(Path source) {
        return BuildPlan.builder(source, "organ", dir.resolve("out")).bits(6).rateHz(OptionalDouble.of(RATE))
                .loop(Optional.of(LoopSpan.parse("auto")));
    }

    @Test
    void autoIsParsedAndHasNoPointsOfItsOwn() {
        assertTrue(LoopSpan.parse(" auto ").auto());
        assertEquals(LoopSpan.AUTO, LoopSpan.parse("auto"));
        assertThrows(IllegalStateException.class, () -> LoopSpan.AUTO.samples(RATE, 100));
        assertEquals("sound.loop 'automatic' must be START:END in samples (1200:9600) or times (0.25s:end), or"
                + " auto", assertThrows(InputError.class, () -> LoopSpan.parse("automatic")).getMessage());
    }

    @Test
    void unrolledCodesPlayTheLoopTheGivenTimesThenTheTail() {
        int[] c = {0, 1, 2, 3, 4, 5, 6, 7, 8, 9};
        SeamlessLoop loop = new SeamlessLoop(3, 7, 2, -60, 2);
        int[] got = AutoLoop.unrolled(Codes.of(4, 8000, c), loop, 3).codes();
        assertArrayEquals(new int[] {0, 1, 2, 3, 4, 5, 6, 3, 4, 5, 6, 3, 4, 5, 6, 7, 8, 9}, got);
    }

    @Test
    void aSustainedSoundGetsItsLoopBakedIntoTheCodesAndAFourfoldPreview() {
        SoundRenderer.Rendered r = new SoundRenderer(OutputSpan.FULL, BuildProgress.NONE).render(plan(organ()).build());
        SeamlessLoop l = r.autoLoop().orElseThrow();
        assertEquals(32_000, r.emitted().length(), "no budget: the whole sound is kept");
        assertTrue(l.seamLevelDb() < -40, l::toString);
        // the preview holds the attack, the loop four times and the tail: 3 more passes than the sound
        double previewSeconds = (r.emitted().length() + 3.0 * l.lengthSamples()) / RATE;
        assertEquals(previewSeconds, r.preview().signal().durationSeconds(), 1e-3);
        // the firmware clip carries the found points
        assertEquals(l.start(), Build.clip("organ", r).loopStart());
        assertEquals(l.end(), Build.clip("organ", r).loopEnd());
    }

    @Test
    void aFlashBudgetCutsTheSoundToItsAttackAndOneLoopAndSaysSo() {
        BuildPlan plan = plan(organ()).flashBudgetBytes(OptionalLong.of(12_000)).build();
        Signal organ = Signal.wrap(SustainedSounds.organ(440, RATE, 2, -70, 1), RATE);
        AutoLoop.Placed placed = AutoLoop.place(plan, organ).orElseThrow();
        SeamlessLoop l = placed.loop();
        assertEquals(l.end(), placed.signal().length(), "attack plus one loop");
        assertTrue(l.end() <= 12_000, l::toString);
        Warning w = placed.shortened().orElseThrow();
        assertTrue(w.is(Warning.Kind.SOUND_SHORTENED));
        assertEquals(String.format(java.util.Locale.ROOT, "the sound was shortened to its attack and one loop"
                + " (%s of 2s) to fit the flash budget; what followed the loop is left out",
                org.rungtone.internal.Units.format(l.end() / RATE, "s")), w.text());
    }

    @Test
    void aPlayersOwnTablesCountAgainstTheBudget() {
        FirmwareRequest player = FirmwareRequest.builder().family("generic").pins("PB0-PB5").portWidth(8)
                .engine(PlaybackEngine.LOOP).build();
        BuildPlan plan = plan(organ()).player(Optional.of(player)).flashBudgetBytes(OptionalLong.of(12_000)).build();
        SoundRenderer.Rendered r = new SoundRenderer(OutputSpan.FULL, BuildProgress.NONE).render(plan);
        // samples plus the loop engine's sound table (4 indices, 16 bytes at most) stay within the budget
        assertTrue(r.emitted().length() + 16 <= 12_000, () -> r.emitted().length() + " samples");
        assertTrue(r.warnings().stream().anyMatch(w -> w.contains("attack and one loop")), r.warnings()::toString);
    }

    @Test
    void aWholeBuildReportsTheLoopInTextAndJson() throws IOException {
        BuildPlan plan = plan(organ()).build();
        new Build("test").run(plan);
        String text = Files.readString(dir.resolve("out/report.txt"));
        assertTrue(text.contains("loop (found)      samples "), text);
        JsonObject loop = JsonParser.parseString(Files.readString(dir.resolve("out/report.json"))).getAsJsonObject()
                .getAsJsonObject("auto_loop");
        double period = loop.get("period_samples").getAsDouble();
        assertEquals(RATE / 440, period, 0.001 * RATE / 440);
        assertEquals(loop.get("end_sample").getAsInt() - loop.get("start_sample").getAsInt(),
                loop.get("length_samples").getAsInt());
        assertTrue(loop.get("seam_db").getAsDouble() < -40);
        assertEquals(4, loop.get("preview_passes").getAsInt());
        assertTrue(Files.readString(dir.resolve("out/report.html")).contains("loop (found)"));
        Signal preview = WavReader.read(dir.resolve("out/preview.wav")).signal();
        int length = loop.get("length_samples").getAsInt();
        assertEquals((32_000 + 3.0 * length) / RATE, preview.durationSeconds(), 1e-3);
    }

    @Test
    void noiseIsRefusedNamingTheFile() {
        Path wav = dir.resolve("fan-noise.wav");
        WavWriter.write(wav, Signal.wrap(SustainedSounds.noise(0.5, RATE, 1, 3), RATE), WavWriter.Format.PCM16);
        InputError e = assertThrows(InputError.class, () -> new SoundRenderer(OutputSpan.FULL, BuildProgress.NONE)
                .render(plan(wav).build()));
        assertEquals(wav + ": no repeating section found; give sound.loop START:END", e.getMessage());
    }
}
