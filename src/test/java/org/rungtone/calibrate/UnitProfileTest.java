package org.rungtone.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.Ladder;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.Topology;

/** Unit profiles survive writing and reading; bad files name the line at fault. */
class UnitProfileTest {
    private static final Path FILE = Path.of("board.unit.toml");
    private static final LocalDate DATE = LocalDate.of(2026, 5, 1);

    private static UnitProfile fitted(Ladder board) {
        MeasurementPlan plan = MeasurementPlan.of(board.spec().levels());
        Measurements m = SimulatedBoard.of(board).measure(plan, SimulatedBoard.Meter.exact(), 1);
        return UnitProfile.of(BoardFit.fit(m, BoardFit.Settings.defaults()), "greenhouse \"1\"", DATE,
                board.spec().describe());
    }

    @Test
    void superpositionProfileRoundTrips() {
        UnitProfile p = fitted(BoardFitTest.weightedBoard(20, 20));
        UnitProfile back = UnitProfile.parse(p.toToml(), FILE);
        assertEquals("greenhouse \"1\"", back.board());
        assertEquals(DATE, back.date());
        assertEquals(10, back.bits());
        assertEquals(UnitProfile.TableSource.FITTED, back.tableSource());
        assertEquals("unit greenhouse \"1\" (2026-05-01)", back.levels().origin());
        for (int k = 0; k < 1024; k++) {
            // written with nine decimals: within 0.5 nV
            assertEquals(p.levels().volts(k), back.levels().volts(k), 5.1e-10);
        }
        assertEquals("superposition", back.model().orElseThrow().key());
        assertEquals(p.model().orElseThrow().stepVolts(9), back.model().orElseThrow().stepVolts(9), 5.1e-10);
        assertEquals(back.toToml(), UnitProfile.parse(back.toToml(), FILE).toToml(), "stable text");
    }

    @Test
    void measuredSwitchedLoadProfileRoundTrips() {
        LadderSpec spec = LadderSpec.builder().topology(Topology.WEIGHTED).bits(6).baseROhms(1e3)
                .pinROhmsHigh(60).pinROhmsLow(15).build();
        UnitProfile p = fitted(Ladder.nominal(spec));
        assertEquals(UnitProfile.TableSource.MEASURED, p.tableSource());
        UnitProfile back = UnitProfile.parse(p.toToml(), FILE);
        assertEquals(UnitProfile.TableSource.MEASURED, back.tableSource());
        BoardModel m = back.model().orElseThrow();
        assertEquals("switched-load", m.key());
        for (int k = 0; k < 64; k++) {
            assertEquals(p.model().orElseThrow().volts(k), m.volts(k), 1e-8);
        }
    }

    @Test
    void aHandMadeProfileNeedsOnlyUnitAndLevels() {
        UnitProfile p = UnitProfile.parse("[unit]\nboard = \"bench\"\ndate = 2026-04-30\nbits = 2\n"
                + "[levels]\nvolts = [0, 1.2, 2.5, 3.7]\n", FILE);
        assertEquals(3.7, p.levels().volts(3));
        assertTrue(p.model().isEmpty());
        assertEquals(List.of(), p.outlierCodes());
    }

    @Test
    void badFilesNameTheLine() {
        String head = "[unit]\nboard = \"b\"\ndate = \"2026-05-01\"\nbits = 2\n";
        assertEquals("board.unit.toml:6: levels.volts: expected 4 numbers (one level per code, code 0 first),"
                + " got 3", message(head + "[levels]\nvolts = [0, 1, 2]\n"));
        assertEquals("board.unit.toml:9: levels.volts: entry 2 is not a finite number",
                message(head + "[levels]\nvolts = [\n 0,\n 1,\n \"2\",\n 3]\n"));
        assertEquals("board.unit.toml:4: unit.bits: must be 1..16, got 20",
                message("[unit]\nboard = \"b\"\ndate = \"2026-05-01\"\nbits = 20\n"));
        assertEquals("board.unit.toml:3: unit.date: expected a date like \"2026-05-01\", got \"May 1\"",
                message("[unit]\nboard = \"b\"\ndate = \"May 1\"\nbits = 2\n"));
        assertEquals("board.unit.toml:5: unit.colour: unknown key; known keys are board, date, bits, ladder,"
                + " readings, table", message(head + "colour = \"red\"\n"));
        // a quoted key that is not a bare key still gets its line, not a crash
        assertEquals("board.unit.toml:5: unit.bad key: unknown key; known keys are board, date, bits, ladder,"
                + " readings, table", message(head + "\"bad key\" = 1\n"));
        assertEquals("board.unit.toml:1: odd table: unknown table or key; a unit profile has [unit], [model]"
                + " and [levels]", message("\"odd table\" = 1\n" + head));
        assertEquals("board.unit.toml: no [levels] table with the volts of every code", message(head));
        assertEquals("board.unit.toml: no [unit] table; is this a unit profile from 'rungtone calibrate fit'?",
                message("[levels]\nvolts = [1]\n"));
        assertTrue(message("[unit\n").startsWith("board.unit.toml:1: not valid TOML: "));
        assertEquals("board.unit.toml:6: model.kind: must be \"superposition\" or \"switched-load\", got \"cubic\"",
                message(head + "[model]\nkind = \"cubic\"\n[levels]\nvolts = [0, 1, 2, 3]\n"));
    }

    @Test
    void refusesFlatFallingAndImplausibleLevelsAtTheirLine() {
        String head = "[unit]\nboard = \"b\"\ndate = \"2026-05-01\"\nbits = 2\n[levels]\nvolts = [\n";
        assertEquals("board.unit.toml:10: levels.volts: every code has the same level, 2.5V, so there is nothing"
                + " to quantize onto; check that the readings were taken at the ladder's output",
                message(head + " 2.5,\n 2.5,\n 2.5,\n 2.5]\n"));
        // a profile of a board read with the leads swapped: negated levels
        assertEquals("board.unit.toml:10: levels.volts: code 3 is 3.75V below code 0 (0V), but the levels must"
                + " rise from code 0 to code 3; were the meter's leads swapped, or the pins listed with the top bit"
                + " first?", message(head + " 0,\n -1.25,\n -2.5,\n -3.75]\n"));
        assertEquals("board.unit.toml:8: levels.volts: the level of code 1, -1.00e+308 V, is not a plausible board"
                + " level (a finite voltage within 1000 V)", message(head + " 0,\n -1e308,\n 1e308,\n 3]\n"));
    }

    private static String message(String text) {
        return assertThrows(InputError.class, () -> UnitProfile.parse(text, FILE)).getMessage();
    }
}
