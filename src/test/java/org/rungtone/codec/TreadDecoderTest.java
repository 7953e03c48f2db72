package org.rungtone.codec;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

class TreadDecoderTest {
    /** The worked example of docs/tread.md: tread3 to 6-bit codes. */
    @Test
    void decodesTheWorkedExampleOfTheDocs() {
        TreadDecoder d = new TreadDecoder(TreadFormat.TREAD3, 6);
        assertEquals(16, d.maxIndex());
        int[] codes = {3, 2, 6, 4, 0, 5, 1};
        assertArrayEquals(new int[] {42, 63, 47, 27, 10, 0, 7}, d.decode(new TreadState(30, 28, 6), codes));
        assertEquals(new TreadState(7, 0, 8), d.stateAt(new TreadState(30, 28, 6), codes, 7));
        assertEquals(new TreadState(63, 42, 11), d.stateAt(new TreadState(30, 28, 6), codes, 2));
    }

    @Test
    void stepsOneCodeAtATime() {
        TreadDecoder d = new TreadDecoder(TreadFormat.TREAD2, 8);
        // code 1: sign 0, magnitude 1; d = (STEP[4] * 3) >> 4 = 16 * 3 >> 4 = 3; q = 2 * 100 - 90 = 110
        assertEquals(new TreadState(113, 100, 6), d.next(new TreadState(100, 90, 4), 1));
        // code 2: sign 1, magnitude 0; d = 16 >> 4 = 1; ADAPT[0] = -1
        assertEquals(new TreadState(109, 100, 3), d.next(new TreadState(100, 90, 4), 2));
    }

    @Test
    void clampsThePredictionAndTheOutputToTheLadder() {
        TreadDecoder d = new TreadDecoder(TreadFormat.TREAD4, 8);
        // q = 2 * 250 - 200 = 300 is clamped to 255 before the difference is taken
        assertEquals(255 - TreadFormat.difference(10, 2), d.next(new TreadState(250, 200, 10), 8 | 2).last());
        assertEquals(255, d.next(new TreadState(250, 200, 10), 2).last());
        assertEquals(0, d.next(new TreadState(5, 40, 10), 8 | 7).last());
        assertEquals(TreadFormat.difference(10, 7), d.next(new TreadState(5, 40, 10), 7).last());
    }

    @Test
    void stepIndexStaysWithinItsRange() {
        TreadDecoder d = new TreadDecoder(TreadFormat.TREAD4, 6);
        assertEquals(d.maxIndex(), d.next(new TreadState(30, 30, d.maxIndex()), 7).index());
        assertEquals(0, d.next(new TreadState(30, 30, 0), 0).index());
    }

    @Test
    void refusesStatesAndCodesOutOfRange() {
        TreadDecoder d = new TreadDecoder(TreadFormat.TREAD3, 6);
        assertEquals("Tread code 8 at 1 is outside 0..7", assertThrows(IllegalArgumentException.class,
                () -> d.decode(new TreadState(0, 0, 0), new int[] {1, 8})).getMessage());
        assertEquals("codes 64, 0 of the state are outside 0..63", assertThrows(IllegalArgumentException.class,
                () -> d.decode(new TreadState(64, 0, 0), new int[0])).getMessage());
        assertEquals("step index 17 is outside 0..16", assertThrows(IllegalArgumentException.class,
                () -> d.decode(new TreadState(0, 0, 17), new int[0])).getMessage());
    }
}
