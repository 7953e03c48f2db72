package org.rungtone.internal;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

class UnitsTest {
    @Test
    void readsSchematicNotation() {
        assertEquals(4700, Units.parse("4k7", "ohm"), 1e-9);
        assertEquals(2200, Units.parse("2.2k", "ohm"), 1e-9);
        assertEquals(4.7, Units.parse("4R7", "ohm"), 1e-12);
        assertEquals(1e6, Units.parse("1M", "ohm"), 1e-6);
        assertEquals(16_000, Units.parse("16kHz", "Hz"), 1e-9);
        assertEquals(22_050, Units.parse("22.05k", "Hz"), 1e-9);
        assertEquals(0.25, Units.parse("250ms", "s"), 1e-12);
        assertEquals(3.3, Units.parse("3.3V", "V"), 1e-12);
        assertEquals(0.6, Units.parse("600mV", "V"), 1e-12);
        assertEquals(0.05, Units.parse("5%", "%"), 1e-12);
        assertEquals(1e-7, Units.parse("100n", "F"), 1e-19);
        assertEquals(Double.POSITIVE_INFINITY, Units.parse("inf", "ohm"));
        assertEquals(25, Units.parse("25", "ohm"), 0);
    }

    @Test
    void rejectsWrongUnits() {
        assertEquals("'5V' is not a frequency (e.g. 16kHz, 8000, 22.05k)",
                assertThrows(InputError.class, () -> Units.parse("5V", "Hz")).getMessage());
        assertEquals("'abc' is not a resistance (e.g. 4k7, 2.2k, 100, 1M)",
                assertThrows(InputError.class, () -> Units.parse("abc", "ohm")).getMessage());
    }

    @Test
    void printsEngineeringNotation() {
        assertEquals("4.7kohm", Units.format(4700, "ohm"));
        assertEquals("16kHz", Units.format(16_000, "Hz"));
        assertEquals("250ms", Units.format(0.25, "s"));
        assertEquals("2.61V", Units.format(2.61, "V"));
        assertEquals("0V", Units.format(0, "V"));
    }

    @Test
    void readsDecibels() {
        assertEquals(-6.0, Units.parseDecibels("-6dB"), 0);
        assertEquals(-1.5, Units.parseDecibels(" -1.5 dBFS"), 0);
        assertEquals(3.0, Units.parseDecibels("+3"), 0);
        assertEquals("'loud' is not a level in dB (e.g. -1 or -6dB)",
                assertThrows(InputError.class, () -> Units.parseDecibels("loud")).getMessage());
        assertThrows(InputError.class, () -> Units.parseDecibels("NaN"));
    }
}
