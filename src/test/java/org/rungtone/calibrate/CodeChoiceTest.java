package org.rungtone.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LevelTable;

/** The choice of codes: every code, the basis plus a count of checks, or the default for the bit depth. */
class CodeChoiceTest {
    private static final LevelTable EIGHT_BITS = LevelTable.ideal(8, 5.0);

    @Test
    void defaultAboveSixBitsIsTheBasisPlusTwoChecksPerBit() {
        MeasurementPlan p = new CodeChoice(false, OptionalInt.empty()).plan(EIGHT_BITS);
        // code 0, all ones, 8 single bits, then 2·8 checks
        assertEquals(2 + 8 + 16, p.codes().size());
        assertFalse(p.everyCode());
    }

    @Test
    void givenCountReplacesTheDefault() {
        assertEquals(2 + 8 + 3, new CodeChoice(false, OptionalInt.of(3)).plan(EIGHT_BITS).codes().size());
    }

    @Test
    void everyCodeMeasuresAllCodes() {
        MeasurementPlan p = new CodeChoice(true, OptionalInt.empty()).plan(EIGHT_BITS);
        assertEquals(256, p.codes().size());
        assertTrue(p.everyCode());
    }

    @Test
    void rejectsNegativeCount() {
        InputError e = assertThrows(InputError.class, () -> new CodeChoice(false, OptionalInt.of(-1)));
        assertEquals("--verify must be 0 or more: -1", e.getMessage());
    }

    @Test
    void rejectsEveryCodeWithACount() {
        InputError e = assertThrows(InputError.class, () -> new CodeChoice(true, OptionalInt.of(2)));
        assertEquals("plan.every_code and plan.verify exclude each other; give one", e.getMessage());
    }
}
