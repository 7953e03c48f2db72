package org.rungtone.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Optional;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LadderSpec;

/** Readings to a unit profile: the board's name, the bits and the ladder the profile records. */
class UnitFitTest {
    /** An ideal 3-bit board, 0.625 V per step, with code 0 read 1 mV high. */
    private static final String READINGS = "code,binary,measured\n0,000,0.001\n1,001,0.625\n2,010,1.250\n"
            + "3,011,1.875\n4,100,2.5\n5,101,3.125\n6,110,3.75\n7,111,4.375\n";
    private static final LocalDate DAY = LocalDate.of(2026, 5, 1);

    @TempDir
    Path dir;

    private Path readings(String name) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, READINGS);
        return p;
    }

    private static UnitFit.Request request(Path file, Optional<LadderSpec> ladder, Optional<String> board) {
        return new UnitFit.Request(file, 0, ladder, board, DAY, OptionalDouble.empty());
    }

    @Test
    void boardIsNamedAfterTheReadingsFileUnlessGiven() throws IOException {
        Path file = readings("bench-4.csv");
        assertEquals("bench-4", UnitFit.run(request(file, Optional.empty(), Optional.empty())).profile().board());
        assertEquals("unit 9", UnitFit.run(request(file, Optional.empty(), Optional.of(" unit 9 "))).profile()
                .board());
    }

    @Test
    void refusesReadingsThatGiveAFlatOrFallingProfile() throws IOException {
        Path flat = dir.resolve("flat.csv");
        Files.writeString(flat, "code,binary,measured\n0,00,2.5\n1,01,2.5\n2,10,2.5\n3,11,2.5\n");
        assertEquals(flat + ": the readings give no usable profile: every code has the same level, 2.5V, so there"
                + " is nothing to quantize onto; check that the readings were taken at the ladder's output",
                assertThrows(InputError.class, () -> UnitFit.run(request(flat, Optional.empty(), Optional.empty())))
                        .getMessage());
        Path swapped = dir.resolve("swapped.csv");
        Files.writeString(swapped, "code,binary,measured\n0,00,0\n1,01,-1.25\n2,10,-2.5\n3,11,-3.75\n");
        assertEquals(swapped + ": the readings give no usable profile: code 3 is 3.75V below code 0 (0V), but the"
                + " levels must rise from code 0 to code 3; were the meter's leads swapped, or the pins listed with"
                + " the top bit first?", assertThrows(InputError.class,
                        () -> UnitFit.run(request(swapped, Optional.empty(), Optional.empty()))).getMessage());
    }

    @Test
    void rejectsABlankBoardName() throws IOException {
        Path file = readings("r.csv");
        InputError e = assertThrows(InputError.class,
                () -> UnitFit.run(request(file, Optional.empty(), Optional.of("  "))));
        assertEquals("--board: the name is empty", e.getMessage());
    }

    @Test
    void profileRecordsTheLadderAndEveryReadCode() throws IOException {
        LadderSpec ladder = LadderSpec.builder().bits(3).build();
        UnitFit.Result r = UnitFit.run(request(readings("r.csv"), Optional.of(ladder), Optional.empty()));
        assertEquals(ladder.describe(), r.profile().ladder());
        assertEquals(DAY, r.profile().date());
        assertEquals(UnitProfile.TableSource.MEASURED, r.profile().tableSource());
        assertEquals(0.001, r.profile().levels().volts(0), 1e-12, "every code read: the table is the readings");
    }

    @Test
    void stemDropsOnlyTheLastExtension() {
        assertEquals("board.v2", org.rungtone.internal.FileNames.stem(Path.of("cal", "board.v2.csv"), "board"));
        assertEquals(".csv", org.rungtone.internal.FileNames.stem(Path.of(".csv"), "board"));
        assertEquals("readings", org.rungtone.internal.FileNames.stem(Path.of("readings"), "board"));
    }
}
