package org.rungtone.codec;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.rungtone.internal.SettingError;

class TreadFormatTest {
    @Test
    void stepTableIsEighthsOfACodeFourStepsPerOctave() {
        // docs/tread.md: STEP[k] = round(8 * 2^(k/4)); the IMA/DVI table grows by about 1.1 a step, the same
        // geometric idea at a finer pitch (Interactive Multimedia Association, 1992)
        assertEquals(46, TreadFormat.stepCount());
        for (int k = 0; k < TreadFormat.stepCount(); k++) {
            assertEquals(Math.round(8 * Math.pow(2, k / 4.0)), TreadFormat.step(k), "STEP[" + k + "]");
        }
        assertEquals(8, TreadFormat.step(0), "one ladder code");
        assertEquals(19484, TreadFormat.step(45));
    }

    @ParameterizedTest
    @EnumSource(TreadFormat.class)
    void largestDifferenceStaysBelowTheLadderRangeAndEveryProductFitsSixteenBits(TreadFormat f) {
        for (int bits = f.minLadderBits(); bits <= TreadFormat.MAX_LADDER_BITS; bits++) {
            int kmax = f.maxIndex(bits);
            long product = (long) TreadFormat.step(kmax) * (2L * f.magnitudes() - 1);
            assertTrue(product < 65536, f + " at " + bits + " bits: " + product);
            assertTrue(TreadFormat.difference(kmax, f.magnitudes() - 1) < 1 << bits, f + " " + bits);
            if (kmax + 1 < TreadFormat.stepCount()) {
                assertTrue(TreadFormat.difference(kmax + 1, f.magnitudes() - 1) >= 1 << bits, f + " " + bits);
            }
        }
    }

    @Test
    void maxIndexFollowsTheTableOfTheDocs() {
        // docs/tread.md: kmax = 4N - 3 (tread2), 4N - 8 (tread3), 4N - 12 (tread4)
        for (int bits = 5; bits <= 12; bits++) {
            assertEquals(4 * bits - 3, TreadFormat.TREAD2.maxIndex(bits));
            assertEquals(4 * bits - 8, TreadFormat.TREAD3.maxIndex(bits));
            assertEquals(4 * bits - 12, TreadFormat.TREAD4.maxIndex(bits));
        }
    }

    @Test
    void differenceIsHalfOddMultiplesOfTheStep() {
        // (STEP[k] * (2m + 1)) >> 4: at k = 0 (one code) magnitudes 0..7 give 0, 1, 2, ... 7 codes
        for (int m = 0; m < 8; m++) {
            assertEquals(m, TreadFormat.difference(0, m));
        }
        assertEquals(10, TreadFormat.difference(6, 3), "23 * 7 >> 4");
    }

    @Test
    void sizes() {
        assertEquals(3, TreadFormat.TREAD3.streamBytes(8), "a block: eight codes in b bytes");
        assertEquals(4, TreadFormat.TREAD3.streamBytes(9));
        assertEquals(250, TreadFormat.TREAD2.streamBytes(1000));
        // steps 0..kmax, two bytes each, and one adaptation byte per magnitude
        assertEquals(2 * (4 * 8 - 8 + 1) + 4, TreadFormat.TREAD3.tableBytes(8));
        assertEquals(5, TreadFormat.stateBytes());
    }

    @Test
    void refusesLaddersBeyondItsLimits() {
        SettingError above = assertThrows(SettingError.class, () -> TreadFormat.TREAD3.checkLadderBits(14));
        assertEquals("{quantize.bits} 14 is above the 12-bit limit of tread3 storage; use at most 12 bits, or"
                + " {target.storage} packed", above.render(s -> "{" + s.key() + "}"));
        SettingError below = assertThrows(SettingError.class, () -> TreadFormat.TREAD4.checkLadderBits(4));
        assertEquals("quantize.bits 4 is too few for tread4 storage, which stores 4 bits per sample itself; use at"
                + " least 5 bits, or target.storage packed", below.getMessage());
        TreadFormat.TREAD2.checkLadderBits(3);
        TreadFormat.TREAD4.checkLadderBits(12);
    }

    @Test
    void parsesItsOptionNames() {
        assertEquals(TreadFormat.TREAD2, TreadFormat.parse("tread2"));
        assertEquals(TreadFormat.TREAD4, TreadFormat.parse(" TREAD4 "));
        assertThrows(IllegalArgumentException.class, () -> TreadFormat.parse("tread5"));
    }
}
