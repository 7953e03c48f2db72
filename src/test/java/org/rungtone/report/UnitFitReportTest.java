package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.calibrate.BoardSimulation;
import org.rungtone.calibrate.CodeChoice;
import org.rungtone.calibrate.SimulatedBoard;
import org.rungtone.calibrate.UnitFit;
import org.rungtone.ladder.LadderSpec;

/** A fit's text and JSON: the meter line, the residual table's cut and the files. */
class UnitFitReportTest {
    /** An ideal 3-bit board, 0.625 V per step, code 3 not read. */
    private static final String READINGS = "code,binary,measured\n0,000,0.001\n1,001,0.625\n2,010,1.250\n3,011,\n"
            + "4,100,2.5\n5,101,3.125\n6,110,3.75\n7,111,4.375\n";

    @TempDir
    Path dir;

    private UnitFit.Result fit(String csv, Optional<LadderSpec> ladder, OptionalDouble resolution)
            throws IOException {
        Path file = dir.resolve("r.csv");
        Files.writeString(file, csv);
        return UnitFit.run(new UnitFit.Request(file, 0, ladder, Optional.of("b"), LocalDate.of(2026, 5, 1),
                resolution));
    }

    private List<Path> files() {
        return List.of(dir.resolve("b.unit.toml"), dir.resolve("fit-residuals.csv"));
    }

    @Test
    void meterLineSaysWhetherTheStepWasGiven() throws IOException {
        String guessed = UnitFitReport.text(fit(READINGS, Optional.empty(), OptionalDouble.empty()), files());
        assertTrue(guessed.contains("\n  meter step 1.000 mV (from the readings' last digits); repeat spread none"
                + " (no code read twice)\n"), guessed);
        String given = UnitFitReport.text(fit(READINGS, Optional.empty(), OptionalDouble.of(1e-3)), files());
        assertTrue(given.contains("\n  meter step 1.000 mV (given);"), given);
    }

    @Test
    void textNamesTheFilesAndTheNextStep() throws IOException {
        String text = UnitFitReport.text(fit(READINGS, Optional.empty(), OptionalDouble.empty()), files());
        assertTrue(text.startsWith("Fit of " + dir.resolve("r.csv") + ": 7 readings of 7 codes, 3-bit board\n"),
                text);
        assertTrue(text.contains("\nProfile: board b, 2026-05-01; the superposition model at all 8 codes\n"), text);
        assertTrue(text.endsWith("\nWrote " + files().get(0) + ", " + files().get(1) + "\nNext: rungtone build"
                + " SOURCE --unit " + files().get(0) + "\n"), text);
    }

    @Test
    void aboveSixtyFourCodesOnlyTheLargestResidualsAreListed() throws IOException {
        LadderSpec ladder = LadderSpec.builder().bits(8).tolerance(0.02).build();
        BoardSimulation.Result board = BoardSimulation.run(new BoardSimulation.Request(ladder,
                new CodeChoice(true, OptionalInt.empty()), new SimulatedBoard.Meter(2e-4, 1e-4, 1), 9));
        String text = UnitFitReport.text(fit(board.readingsCsv(), Optional.of(ladder), OptionalDouble.empty()),
                files());
        assertTrue(text.contains("\nResiduals (the largest; every code is in fit-residuals.csv)\n"), text);
        String table = text.substring(text.indexOf("\nResiduals"), text.indexOf("\nProfile:"));
        long rows = table.lines().filter(l -> l.matches(" +\\d+ +[01]{8} .*")).count();
        assertTrue(rows >= 16 && rows <= 60, "16 largest, more when outliers, at most 60: " + rows);
    }

    @Test
    void jsonKeepsItsKeysInOrder() throws IOException {
        Map<String, Object> json = UnitFitReport.json(fit(READINGS, Optional.empty(), OptionalDouble.empty()),
                files(), files().get(0).toAbsolutePath().getParent(), "9.9");
        assertEquals(List.of("schema_version", "report", "tool", "version", "source", "ladder", "bits", "readings",
                "codes_measured", "unmeasured_codes", "meter_step_v", "meter_step_given", "repeat_spread_rms_v",
                "floor_rms_v", "models", "chosen", "reason", "parameter_sigmas", "residuals", "outlier_codes",
                "profile", "warnings", "files"), List.copyOf(json.keySet()));
        assertEquals(List.of(3), json.get("unmeasured_codes"));
        // paths are relative to the output folder
        assertEquals(List.of(files().get(0).getFileName().toString(), files().get(1).getFileName().toString()),
                json.get("files"));
    }
}
