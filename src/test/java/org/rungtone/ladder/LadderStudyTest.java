package org.rungtone.ladder;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;

class LadderStudyTest {
    private static final LadderSpec R2R4 = LadderSpec.builder().topology(Topology.R2R).bits(4).build();

    @Test
    void analysesOnlyWhenNothingElseIsAsked() {
        LadderStudy s = new LadderStudy.Request(R2R4, List.of(), Double.POSITIVE_INFINITY, Optional.empty(),
                Optional.empty(), false).run(n -> { });
        assertEquals(List.of("pin0", "pin1", "pin2", "pin3"), s.pinNames());
        assertEquals(Optional.empty(), s.monteCarlo());
        assertEquals(Optional.empty(), s.design());
        assertEquals(R2R4, s.analysis().spec());
    }

    @Test
    void runsMonteCarloDesignAndMeasuredLevelsWhenAsked() {
        List<Integer> progress = new ArrayList<>();
        LevelTable measured = LevelTable.of(4, new double[] {0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15},
                "unit bench-1 (2026-01-02)");
        LadderStudy s = new LadderStudy.Request(R2R4, List.of("PB0", "PB1", "PB2", "PB3"), 0.02,
                Optional.of(measured), Optional.of(new MonteCarlo(10, 3, Spread.uniform())), true)
                .run(n -> {
                    synchronized (progress) {
                        progress.add(n);
                    }
                });
        assertEquals(List.of("PB0", "PB1", "PB2", "PB3"), s.pinNames());
        assertEquals(measured, s.analysis().levels());
        assertEquals(10, s.monteCarlo().orElseThrow().boards());
        assertTrue(progress.contains(10), progress.toString());
        assertEquals(ESeries.E24, s.design().orElseThrow().proposal().series());
        assertEquals(0.02, s.design().orElseThrow().analysis().pinLimitAmps());
    }

    @Test
    void rejectsPinNamesThatDoNotMatchTheBits() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> new LadderStudy.Request(
                R2R4, List.of("PB0"), 1, Optional.empty(), Optional.empty(), false));
        assertEquals("1 pin names for 4 bits", e.getMessage());
    }

    private static LadderStudy.Request request(LadderSpec spec, int boards) {
        return new LadderStudy.Request(spec, List.of(), 1, Optional.empty(),
                Optional.of(new MonteCarlo(boards, 1, Spread.uniform())), false);
    }
}
