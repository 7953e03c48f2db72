package org.rungtone.internal;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** The optimal-string-alignment distance (Damerau, CACM 7(3), 1964: one edit per insertion, deletion, change, swap). */
class EditDistanceTest {
    @Test
    void countsInsertionsDeletionsChangesAndSwaps() {
        assertEquals(0, EditDistance.of("bits", "bits"));
        assertEquals(1, EditDistance.of("bitz", "bits"));
        assertEquals(1, EditDistance.of("bit", "bits"));
        assertEquals(1, EditDistance.of("bitss", "bits"));
        assertEquals(1, EditDistance.of("ditehr", "dither"));
        assertEquals(1, EditDistance.of("sien", "sine"));
        assertEquals(3, EditDistance.of("", "abc"));
        assertEquals(3, EditDistance.of("abc", ""));
    }

    @Test
    void aSwapIsOneEditOnlyBetweenNeighbours() {
        // "ca" → "abc": optimal string alignment gives 3 (a true Damerau–Levenshtein distance would give 2)
        assertEquals(3, EditDistance.of("ca", "abc"));
        assertEquals(2, EditDistance.of("abcd", "badc"));
    }
}
