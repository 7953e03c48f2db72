package org.rungtone.project;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.calibrate.OutputSpan;
import org.rungtone.source.SampleSource;
import org.rungtone.source.Signal;
import org.rungtone.testing.WavFixtures;

/** A build tells how far it has got: stage by stage, and while it reads the source. */
class BuildProgressTest {
    @TempDir
    Path dir;

    private record Report(String step, double fraction) {
    }

    @Test
    void theStagesShareTheWholeBuild() {
        double sum = 0;
        for (BuildStage s : BuildStage.values()) {
            assertEquals(sum, s.doneBefore(), 1e-12, s.label());
            sum += s.share();
        }
        assertEquals(1, sum, 1e-12);
        assertEquals(1, BuildStage.PLOTS.doneAfter(), 1e-12);
        assertEquals(BuildStage.LISTENER.doneAfter(), BuildStage.rendered(), 0);
    }

    @Test
    void aBuildReportsEveryStageAndTheSourceReadInOrderUpToTheWhole() throws IOException {
        Path wav = dir.resolve("hum.wav");
        Files.write(wav, WavFixtures.sine16(44_100, 3, 220, 0.5));
        List<Report> seen = Collections.synchronizedList(new ArrayList<>());
        new Build("test", OutputSpan.FULL, (step, fraction) -> seen.add(new Report(step, fraction)))
                .run(BuildPlan.builder(wav, "hum", dir.resolve("out")).bits(8).rateHz(OptionalDouble.of(16_000))
                        .build());
        List<String> stages = seen.stream().map(Report::step).filter(s -> s.endsWith(" done")).toList();
        assertEquals(List.of("open done", "condition done", "quantize done", "analyze done", "preview done",
                "listener done", "emit done", "plots done"), stages);
        List<Report> reading = seen.stream().filter(r -> r.step().equals("reading")).toList();
        assertTrue(!reading.isEmpty(), seen.toString());
        // while reading, the share moves through the condition stage's part of the build
        assertEquals(BuildStage.CONDITION.doneAfter(), reading.get(reading.size() - 1).fraction(), 1e-9);
        for (Report r : reading) {
            assertTrue(r.fraction() > BuildStage.OPEN.doneAfter() - 1e-9
                    && r.fraction() <= BuildStage.CONDITION.doneAfter() + 1e-9, r.toString());
        }
        assertEquals(1, seen.get(seen.size() - 1).fraction(), 1e-9);
    }

    @Test
    void aSourceTellsTheShareReadCappedAtTheWhole() {
        List<Double> shares = new ArrayList<>();
        SampleSource source = new ReadShare(SampleSource.of(Signal.wrap(new double[100], 8000)), shares::add);
        double[] block = new double[60];
        source.read(0, block, 0, 40);
        source.read(30, block, 0, 60);
        source.read(40, block, 0, 60);
        assertEquals(List.of(0.4, 1.0, 1.0), shares);
        assertEquals(8000, source.sampleRateHz(), 0);
        assertEquals(100, source.length());
    }

    @Test
    void aProjectSharesItsProgressAmongItsSoundsAlike() throws IOException {
        Path project = dir.resolve("greenhouse");
        Files.createDirectories(project);
        try (var files = Files.list(Path.of("examples", "greenhouse"))) {
            for (Path p : files.toList()) {
                Files.copy(p, project.resolve(p.getFileName()));
            }
        }
        List<Report> seen = Collections.synchronizedList(new ArrayList<>());
        new ProjectBuild("test", OutputSpan.FULL, (step, fraction) -> seen.add(new Report(step, fraction)))
                .run(ProjectFile.load(project.resolve("greenhouse.toml")), ProjectBuild.Overrides.none());
        double half = BuildStage.rendered() / 2;
        List<Report> first = seen.stream().filter(r -> r.step().startsWith("sound 1/2 door_chime: ")).toList();
        List<Report> second = seen.stream().filter(r -> r.step().startsWith("sound 2/2 frost_alarm: ")).toList();
        assertTrue(first.stream().allMatch(r -> r.fraction() <= half + 1e-9), first.toString());
        assertEquals(half, first.get(first.size() - 1).fraction(), 1e-9);
        assertTrue(second.stream().allMatch(r -> r.fraction() >= half - 1e-9), second.toString());
        assertEquals(new Report("writing firmware, previews and reports", BuildStage.rendered()),
                seen.get(seen.size() - 1));
        assertEquals(first.size() + second.size() + 1, seen.size());
    }
}
