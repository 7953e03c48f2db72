package org.rungtone.project;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.calibrate.OutputSpan;
import org.rungtone.report.SoundPlots;
import org.rungtone.source.Signal;
import org.rungtone.source.WavWriter;

class EarlyOutputsTest {
    private static final Build.Emitted NOTHING = new Build.Emitted(List.of(), List.of(), Optional.empty(), List.of(),
            0);

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
        EarlyOutputs early = new EarlyOutputs(Files.createDirectories(dir.resolve("early")), c -> NOTHING);
        SoundRenderer.Rendered r = new SoundRenderer(OutputSpan.FULL, BuildProgress.NONE, early).render(plan);
        List<Path> drawnEarly = early.plots();
        List<Path> drawnLate = SoundPlots.write(Files.createDirectories(dir.resolve("late")), Build.plotData(r),
                SoundPlots.Scales.none());
        assertEquals(List.of("error-spectrum.png", "spectrum.png"),
                drawnEarly.stream().map(p -> p.getFileName().toString()).toList());
        assertEquals(drawnLate.size(), drawnEarly.size());
        for (int i = 0; i < drawnEarly.size(); i++) {
            assertArrayEquals(Files.readAllBytes(drawnLate.get(i)), Files.readAllBytes(drawnEarly.get(i)));
        }
    }

    @Test
    void theCodesHandedOnEarlyAreTheRenderedSoundsCodes() {
        BuildPlan plan = BuildPlan.builder(tone(), "tone", dir.resolve("out")).bits(6)
                .rateHz(OptionalDouble.of(16_000)).build();
        List<SoundRenderer.Coded> handed = new ArrayList<>();
        EarlyOutputs early = new EarlyOutputs(dir, c -> {
            handed.add(c);
            return NOTHING;
        });
        SoundRenderer.Rendered r = new SoundRenderer(OutputSpan.FULL, BuildProgress.NONE, early).render(plan);
        assertEquals(NOTHING, early.firmware());
        assertEquals(List.of(r.coded()), handed);
    }

    @Test
    void noFiguresNoPlots() {
        EarlyOutputs early = new EarlyOutputs(dir, c -> NOTHING);
        assertEquals(List.of(), early.plots());
        assertThrows(IllegalStateException.class, early::firmware);
    }
}
