package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LadderStudy;
import org.rungtone.ladder.MonteCarlo;
import org.rungtone.ladder.Spread;
import org.rungtone.ladder.Topology;

class LadderFilesTest {
    @TempDir
    Path dir;

    @Test
    void writesTheLevelsAndEachChartUnderItsKindsName() throws IOException {
        // ideal R-2R, 2 bits, 5 V: levels 5 V · k/4 (Horowitz & Hill)
        LadderSpec r2r = LadderSpec.builder().topology(Topology.R2R).bits(2).pinROhms(0).build();
        LadderStudy study = new LadderStudy.Request(r2r, List.of(), Double.POSITIVE_INFINITY, Optional.empty(),
                Optional.of(new MonteCarlo(5, 1, Spread.uniform())), false).run(n -> { });
        Path out = dir.resolve("ladder");
        List<String> files = LadderFiles.write(out, study);
        assertEquals(List.of("levels.csv", "transfer.png", "dnl.png", "inl.png", "monte-carlo.png").stream()
                .map(f -> out.resolve(f).toString()).toList(), files);
        List<String> csv = Files.readAllLines(out.resolve("levels.csv"));
        assertEquals("code,bits,volts,ideal_volts,dnl_lsb,inl_lsb,inl_best_fit_lsb", csv.get(0));
        assertEquals("2,10,2.500000000,2.500000000,0.000000,0.000000,0.000000", csv.get(3));
        for (String f : files) {
            assertTrue(Files.size(Path.of(f)) > 0, f);
        }
    }
}
