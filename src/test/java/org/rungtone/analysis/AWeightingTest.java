package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class AWeightingTest {
    @ParameterizedTest
    @CsvSource({
        "-15, -39.4", "-12, -26.2", "-9, -16.1", "-6, -8.6", "-3, -3.2",
        "0, 0.0", "3, 1.2", "6, 1.0", "9, -1.1", "12, -6.6"})
    void reproducesTheStandardsTable(int n, double expectedDb) {
        // IEC 61672-1:2013 table of A-weighting at the exact base-ten frequencies 1000·10^(n/10) Hz
        // (nominal 31.5 Hz is 31.62 Hz), within 0.1 dB.
        double hz = 1000 * Math.pow(10, n / 10.0);
        assertEquals(expectedDb, AWeighting.gainDb(hz), 0.1, hz + " Hz");
    }
}
