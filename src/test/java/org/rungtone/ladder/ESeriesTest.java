package org.rungtone.ladder;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.rungtone.internal.InputError;

class ESeriesTest {
    @Test
    void e12AndE24EqualIec60063() {
        // IEC 60063:2015, E12 and E24 tables.
        assertArrayEquals(new double[] {1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2},
                ESeries.E12.decade(), 0);
        assertArrayEquals(new double[] {1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6,
            3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1}, ESeries.E24.decade(), 0);
    }

    @Test
    void e96SpotValuesEqualIec60063() {
        // IEC 60063:2015 E96 table, spot checks (values recalled from the table, from memory).
        double[] d = ESeries.E96.decade();
        assertEquals(96, d.length);
        assertEquals(1.00, d[0]);
        assertEquals(1.02, d[1]);
        assertEquals(1.47, d[16]);
        assertEquals(2.49, d[38]);
        assertEquals(3.01, d[46]);
        assertEquals(4.99, d[67]);
        assertEquals(6.98, d[81]);
        assertEquals(9.76, d[95]);
        // IEC 60063: E192 lists 9.20 where plain rounding gives 9.19.
        assertTrue(ESeries.E192.contains(9.20e3));
        assertFalse(ESeries.E192.contains(9.19e3));
    }

    @Test
    void nearestUsesTheLogarithmicDistanceAcrossDecades() {
        assertEquals(39e3, ESeries.E12.nearest(40e3));
        assertEquals(10e3, ESeries.E12.nearest(9.6e3));
        assertEquals(9.1, ESeries.E24.nearest(9.4));
        assertEquals(20e3, ESeries.E24.nearest(20e3));
        assertArrayEquals(new double[] {8.2e3, 10e3, 12e3}, ESeries.E12.valuesBetween(8e3, 12e3), 0);
    }

    @Test
    void parseNamesTheKnownSeries() {
        assertEquals(ESeries.E48, ESeries.parse(" e48 "));
        assertEquals("unknown preferred-value series 'E25'; use one of E6, E12, E24, E48, E96, E192",
                assertThrows(InputError.class, () -> ESeries.parse("E25")).getMessage());
    }
}
