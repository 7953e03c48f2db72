package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class DdsTest {
    @Test
    void tuningWordFollowsMt085() {
        // Analog Devices MT-085: M = round(f * 2^n / fs). 440 * 2^32 / 8000 = 236,223,201.28
        assertEquals(236223201L, Dds.tuningWord(440, 8000, 32));
        // f_out = M * fs / 2^n: 439.99999948 Hz
        assertEquals(439.99999948, Dds.actualHz(236223201L, 8000, 32), 1e-8);
        // 24-bit accumulator: 1000 * 2^24 / 8000 = 2,097,152 exactly
        assertEquals(2097152L, Dds.tuningWord(1000, 8000, 24));
    }

    @Test
    void resolutionIsTheClockOver2ToTheN() {
        // MT-085 (from memory): a 32-bit accumulator at 125 MHz resolves 0.0291 Hz
        assertEquals(0.0291038, Dds.resolutionHz(125e6, 32), 1e-7);
        assertEquals(8000.0 / 65536, Dds.resolutionHz(8000, 16), 1e-15);
    }

    @Test
    void modelIndexesTheTableWithTheTopBits() {
        int[] table = {10, 11, 12, 13, 14, 15, 16, 17};
        Dds dds = new Dds(8, table);
        // M = 48: phases 0, 48, 96, 144, 192, 240, 32 (wrapped), 80; index = phase >> 5
        assertArrayEquals(new int[] {10, 11, 13, 14, 16, 17, 11, 12}, dds.run(48, 8));
    }

    @Test
    void outputFrequencyMatchesTheTuningWordOverALongRun() {
        int[] ramp = new int[256];
        for (int i = 0; i < ramp.length; i++) {
            ramp[i] = i;
        }
        Dds dds = new Dds(32, ramp);
        long m = Dds.tuningWord(1234.5, 16000, 32);
        int[] out = dds.run(m, 160000);
        int wraps = 0;
        for (int i = 1; i < out.length; i++) {
            if (out[i] < out[i - 1]) {
                wraps++;
            }
        }
        // 10 s at the actual frequency: 12,345 periods, give or take the one in progress
        assertEquals(Dds.actualHz(m, 16000, 32) * 10, wraps, 1.0);
    }

    @Test
    void sineTableSpansTheFullCodeRange() {
        int[] t = Dds.sineTable(4, 4);
        // round(7.5 + 7.5 sin(2 pi i / 16))
        assertArrayEquals(new int[] {8, 10, 13, 14, 15, 14, 13, 10, 8, 5, 2, 1, 0, 1, 2, 5}, t);
    }
}
