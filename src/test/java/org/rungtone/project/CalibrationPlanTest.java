package org.rungtone.project;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.calibrate.CodeChoice;
import org.rungtone.calibrate.MeterAdvice;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;
import org.rungtone.report.CalibrationReport;

/** The calibration plan: codes, meter advice, and the sweep program only when target settings are given. */
class CalibrationPlanTest {
    private static final LadderSpec SIX_BITS = LadderSpec.builder().bits(6).build();

    @TempDir
    Path dir;

    private CalibrationReport.Plan plan(Optional<FirmwareRequest> firmware) {
        return CalibrationPlan.run(new CalibrationPlan.Request(SIX_BITS, new CodeChoice(false, OptionalInt.empty()),
                firmware, "sweep", "0.0-test", 2.0, Optional.empty(), dir));
    }

    private List<String> written() throws IOException {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        }
    }

    @Test
    void withoutTargetSettingsThereIsNoSweepAndNothingIsWritten() throws IOException {
        CalibrationReport.Plan p = plan(Optional.empty());
        assertTrue(p.sweep().isEmpty());
        assertEquals(List.of(), written());
        assertEquals(64, p.plan().codes().size(), "six bits: every code");
        assertEquals(MeterAdvice.COUNTS.length, p.meters().size());
        LevelTable model = SIX_BITS.levels();
        assertEquals((model.maxVolts() - model.minVolts()) / 63, p.lsbVolts(), 1e-15, "average step of 63");
    }

    @Test
    void targetSettingsWriteTheSweepProgramOfThePlannedCodes() throws IOException {
        CalibrationReport.Plan p = plan(Optional.of(FirmwareRequest.builder().family("generic").pins("PB0-PB5")
                .build()));
        assertTrue(p.sweep().isPresent());
        assertEquals(List.of("sweep.c", "sweep.h", "sweep_data.c"), written());
        assertEquals(p.sweep().get().files().size(), written().size());
        assertFalse(p.sweep().get().report().isEmpty());
        String data = Files.readString(dir.resolve("sweep_data.c"));
        assertTrue(data.contains("0.0-test"), "the tool version is written into the files");
    }
}
