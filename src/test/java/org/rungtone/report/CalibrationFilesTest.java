package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.calibrate.BoardSimulation;
import org.rungtone.calibrate.CodeChoice;
import org.rungtone.calibrate.SimulatedBoard;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;

/** The calibrate commands' files: names, CSV layout and the simulated board's header line. */
class CalibrationFilesTest {
    @TempDir
    Path dir;

    @Test
    void profileIsNamedAfterTheBoardWithUnsafeCharactersReplaced() {
        assertEquals("greenhouse-1.unit.toml", CalibrationFiles.profileFileName("greenhouse-1"));
        assertEquals("bench-2.unit.toml", CalibrationFiles.profileFileName("bench 2"));
        assertEquals("a-b-c.unit.toml", CalibrationFiles.profileFileName("a/b c"));
        assertEquals("board.hidden.unit.toml", CalibrationFiles.profileFileName(".hidden"),
                "never a hidden file");
    }

    @Test
    void levelsCsvHasOneRowPerCodeInVoltsToTheNanovolt() {
        LevelTable t = LevelTable.ideal(2, 5.0);
        assertEquals("code,volts\n0,0.000000000\n1,1.250000000\n2,2.500000000\n3,3.750000000\n",
                CalibrationFiles.levelsCsv(t));
    }

    @Test
    void simulationWritesTheReadingsUnderAHeaderAndTheTrueLevels() throws IOException {
        LadderSpec ladder = LadderSpec.builder().bits(4).tolerance(0.05).build();
        BoardSimulation.Result r = BoardSimulation.run(new BoardSimulation.Request(ladder,
                new CodeChoice(false, OptionalInt.empty()), new SimulatedBoard.Meter(0, 1e-3, 2), 5));
        List<Path> files = CalibrationFiles.writeSimulation(r, dir);
        assertEquals(List.of(dir.resolve("readings.csv"), dir.resolve("true-levels.csv")), files);
        String readings = Files.readString(files.get(0));
        assertEquals("# Simulated board: " + ladder.describe() + " drawn with seed 5; meter noise 0V rms, step"
                + " 1mV, 2 readings per code.\n" + r.readingsCsv(), readings);
        assertEquals(CalibrationFiles.levelsCsv(r.board().levels()), Files.readString(files.get(1)));
        assertTrue(Files.readString(files.get(1)).startsWith("code,volts\n0,"));
    }
}
