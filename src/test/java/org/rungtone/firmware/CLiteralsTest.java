package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;

class CLiteralsTest {
    @Test
    void formatsFixedWidthHex() {
        assertEquals("0x3F", CLiterals.hex(63, 2));
        assertEquals("0x003F", CLiterals.hex(63, 4));
        assertEquals(3, CLiterals.hexDigits(10));
        assertEquals(2, CLiterals.hexDigits(4));
    }

    @Test
    void wrapsArraysAFixedCountPerLine() {
        int[] v = {0, 1, 2, 255, 256};
        assertEquals("  0x000, 0x001,\n  0x002, 0x0FF,\n  0x100", CLiterals.arrayBody(v, 3, 2, "  "));
        assertEquals(List.of("  0x000, 0x001,", "  0x002, 0x0FF,", "  0x100"), CLiterals.arrayLines(v, 3, 2, "  "));
        assertEquals("", CLiterals.arrayBody(new int[0], 2, 16, "    "));
        assertEquals("    0xFF, 0x80", CLiterals.arrayBody(new byte[] {(byte) 0xFF, (byte) 0x80}, 16, "    "));
    }

    @Test
    void widensValuesThatNeedMoreDigits() {
        assertEquals("0x1234", CLiterals.arrayBody(new int[] {0x1234}, 2, 16, ""));
        assertEquals("0xFFFFFFFF", CLiterals.arrayBody(new int[] {-1}, 2, 16, ""));
    }
}
