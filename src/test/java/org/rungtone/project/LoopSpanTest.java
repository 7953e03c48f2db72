package org.rungtone.project;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.rungtone.internal.InputError;

class LoopSpanTest {
    /** 1.6 s at 16 kHz. */
    private static final int LENGTH = 25_600;

    @Test
    void timesBecomeSamplesAndEndMeansTheLength() {
        assertArrayEquals(new int[] {4000, LENGTH}, LoopSpan.parse("250ms:end").samples(16_000, LENGTH));
        assertArrayEquals(new int[] {1200, 9600}, LoopSpan.parse("1200:9600").samples(16_000, LENGTH));
    }

    @Test
    void aStartPastTheSoundSaysSoRatherThanBlamingTheEnd() {
        assertEquals("sound.loop start 5s is at or past the sound's end (1.6s, 25600 samples); the loop must start"
                + " inside the sound", assertThrows(InputError.class,
                        () -> LoopSpan.parse("5s:end").samples(16_000, LENGTH)).getMessage());
        assertEquals("sound.loop start 25600 is at or past the sound's end (1.6s, 25600 samples); the loop must"
                + " start inside the sound", assertThrows(InputError.class,
                        () -> LoopSpan.parse("25600:30000").samples(16_000, LENGTH)).getMessage());
        assertEquals("sound.loop end 2s is past the sound's end (25600 samples)", assertThrows(InputError.class,
                () -> LoopSpan.parse("1s:2s").samples(16_000, LENGTH)).getMessage());
    }
}
