package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import org.rungtone.calibrate.BoardSimulation;
import org.rungtone.calibrate.CodeChoice;
import org.rungtone.calibrate.MeasurementPlan;
import org.rungtone.calibrate.MeterAdvice;
import org.rungtone.calibrate.SimulatedBoard;
import org.rungtone.ladder.LadderSpec;

/** The plan's checklist text and JSON, and the simulated board's summary. */
class CalibrationReportTest {
    private static final LadderSpec EIGHT_BITS = LadderSpec.builder().bits(8).build();
    private static final List<Path> FILES = List.of(Path.of("cal", "plan.csv"));

    /** The default 8-bit plan (26 codes) without a sweep program. */
    private static CalibrationReport.Plan plan(double holdSeconds, Optional<String> button) {
        MeasurementPlan p = MeasurementPlan.of(EIGHT_BITS.levels());
        double lsb = 5.0 / 255;
        return new CalibrationReport.Plan(EIGHT_BITS, p, lsb, MeterAdvice.forLevels(5.0, lsb), Optional.empty(),
                holdSeconds, button);
    }

    @Test
    void sweepLineGivesTheHoldAndTheTotalOrTheButton() {
        assertTrue(CalibrationReport.planText(plan(2, Optional.empty()), FILES)
                .contains(" The sweep: each code held 2s, 52s in all.\n"));
        assertTrue(CalibrationReport.planText(plan(200, Optional.empty()), FILES)
                .contains(" The sweep: each code held 3.3 min, 86.7 min in all.\n"), "120 s and over in minutes");
        assertTrue(CalibrationReport.planText(plan(2, Optional.of("PD2")), FILES)
                .contains(" The sweep: one code per press of the button on PD2.\n"));
    }

    @Test
    void textOpensWithTheLadderAndEndsWithTheNextStep() {
        String text = CalibrationReport.planText(plan(2, Optional.empty()), FILES);
        assertTrue(text.startsWith("Calibration plan: " + EIGHT_BITS.describe() + ", 26 codes to measure\n"), text);
        assertTrue(text.contains("\nNo sweep program: give --pins (and --target, --cpu-clock) to have one written,"
                + " or set the codes by hand.\n"), text);
        String plan = Path.of("cal", "plan.csv").toString();
        assertTrue(text.endsWith("\nWrote " + plan + "\nNext: fill in the measured column, then run\n"
                + "  rungtone calibrate fit " + plan + " --board NAME (with the same ladder options)\n"), text);
    }

    @Test
    void jsonListsTheCodesMetersAndFilesUnderStableKeys() {
        Map<String, Object> json = CalibrationReport.planJson(plan(2, Optional.empty()), FILES, Path.of("cal"), "9.9");
        assertEquals(List.of("schema_version", "report", "tool", "version", "ladder", "bits", "every_code", "lsb_v",
                "min_v", "max_v", "codes", "meters", "hold_s", "button_pin", "sweep", "warnings", "meter", "recording",
                "files"), List.copyOf(json.keySet()));
        // a plan read with a meter of unknown count: neither applies
        assertEquals(null, json.get("meter"));
        assertEquals(null, json.get("recording"));
        assertEquals("calibrate-plan", json.get("report"));
        assertEquals(8, json.get("bits"));
        assertEquals(26, ((List<?>) json.get("codes")).size());
        assertEquals(2.0, json.get("hold_s"));
        assertEquals(8, ((Map<?, ?>) json.get("ladder")).get("bits"));
        // paths are relative to the output folder
        assertEquals(List.of("plan.csv"), json.get("files"));
        assertEquals(null, CalibrationReport.planJson(plan(2, Optional.of("PD2")), FILES, Path.of("cal"), "9.9")
                .get("hold_s"), "a button steps the sweep: no hold time");
    }

    @Test
    void simulationListsEachDrawnPartAgainstItsNominalValue() {
        LadderSpec ladder = LadderSpec.builder().bits(4).tolerance(0.05).build();
        BoardSimulation.Result r = BoardSimulation.run(new BoardSimulation.Request(ladder,
                new CodeChoice(false, OptionalInt.empty()), new SimulatedBoard.Meter(2e-4, 1e-3, 1), 7));
        List<Path> files = List.of(Path.of("readings.csv"), Path.of("true-levels.csv"));
        String[] lines = CalibrationReport.simulationText(r, files).split("\n");
        assertEquals("Simulated board: " + ladder.describe() + ", seed 7", lines[0]);
        assertEquals(1 + ladder.parts().size() + 3, lines.length);
        assertEquals("  read at 16 codes, 1 time each; meter noise 200µV rms, step 1mV", lines[lines.length - 3]);
        assertEquals("Wrote readings.csv, true-levels.csv", lines[lines.length - 2]);
        assertEquals("Next: rungtone calibrate fit readings.csv (with the same ladder options)",
                lines[lines.length - 1]);
        com.google.gson.JsonObject json = com.google.gson.JsonParser.parseString(CalibrationReport.simulationJson(r,
                files, Path.of("."), "9.9")).getAsJsonObject();
        com.google.gson.JsonObject leg = json.getAsJsonArray("parts").get(0).getAsJsonObject();
        assertEquals(leg.get("drawn_ohm").getAsDouble() / leg.get("nominal_ohm").getAsDouble() - 1,
                leg.get("deviation_fraction").getAsDouble(), 1e-12);
        assertEquals(ladder.parts().size(), json.getAsJsonArray("parts").size());
        assertEquals(16, json.getAsJsonArray("true_levels_v").size());
        assertEquals(16, json.get("codes_read").getAsInt());
    }
}
