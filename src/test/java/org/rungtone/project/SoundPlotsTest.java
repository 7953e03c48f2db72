package org.rungtone.project;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.calibrate.OutputSpan;
import org.rungtone.source.Signal;
import org.rungtone.source.WavWriter;

class SoundPlotsTest {
    @TempDir
    Path dir;

    /** A 1 kHz tone, 0.5 s at 44.1 kHz: both plots (error spectrum and tone spectrum). */
    private Path tone() {
        double rate = 44_100;
        double[] x = new double[(int) (0.5 * rate)];
        for (int i = 0; i < x.length; i++) {
            x[i] = 0.7 * Math.sin(2 * Math.PI * 1000.3 * i / rate);
        }
        Path wav = dir.resolve("tone.wav");
        WavWriter.write(wav, Signal.wrap(x, rate), WavWriter.Format.PCM16);
        return wav;
    }

    @Test
    void plotsDrawnWhileTheSoundRendersEqualPlotsDrawnAfterwards() throws Exception {
        BuildPlan plan = BuildPlan.builder(tone(), "tone", dir.resolve("out")).bits(6)
                .rateHz(OptionalDouble.of(16_000)).build();
        SoundPlots early = new SoundPlots();
        SoundRenderer.Rendered r = new SoundRenderer(OutputSpan.FULL, stage -> { }, early::draw).render(plan);
        List<Path> drawnEarly = early.write(r, Files.createDirectories(dir.resolve("early")));
        List<Path> drawnLate = new SoundPlots().write(r, Files.createDirectories(dir.resolve("late")));
        assertEquals(List.of(SoundPlots.ERROR_SPECTRUM, SoundPlots.SPECTRUM),
                drawnEarly.stream().map(p -> p.getFileName().toString()).toList());
        for (int i = 0; i < drawnEarly.size(); i++) {
            assertArrayEquals(Files.readAllBytes(drawnLate.get(i)), Files.readAllBytes(drawnEarly.get(i)));
        }
    }
}
