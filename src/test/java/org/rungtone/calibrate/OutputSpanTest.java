package org.rungtone.calibrate;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LevelTable;

/** The span that full scale maps onto: the board's own, or the ideal one cut to the board's. */
class OutputSpanTest {
    private static LevelTable board(double low, double high) {
        double[] v = new double[16];
        for (int k = 0; k < 16; k++) {
            v[k] = low + (high - low) * k / 15;
        }
        return LevelTable.of(4, v, "board");
    }

    @Test
    void fullIsTheBoardsLowestToHighestLevel() {
        assertArrayEquals(new double[] {0.02, 5.1}, OutputSpan.FULL.volts(board(0.02, 5.1), LevelTable.ideal(4, 5)));
    }

    @Test
    void nominalIsTheIdealSpanCutToTheBoard() {
        LevelTable ideal = LevelTable.ideal(4, 5); // 0 .. 4.6875 V: Vref·(2^N − 1)/2^N
        assertArrayEquals(new double[] {0.02, 4.6875}, OutputSpan.NOMINAL.volts(board(0.02, 5.1), ideal));
        assertArrayEquals(new double[] {0, 4.5}, OutputSpan.NOMINAL.volts(board(-0.1, 4.5), ideal));
    }

    @Test
    void nominalNeedsAnOverlap() {
        InputError e = assertThrows(InputError.class,
                () -> OutputSpan.NOMINAL.volts(board(6, 7), LevelTable.ideal(4, 5)));
        assertEquals("--span nominal: the board's levels (6V .. 7V) do not overlap the ideal span (0V .. 4.688V);"
                + " use --span full", e.getMessage());
        assertEquals("quantize.span must be full or nominal: wide", assertThrows(InputError.class,
                () -> OutputSpan.parse("wide")).getMessage());
    }
}
