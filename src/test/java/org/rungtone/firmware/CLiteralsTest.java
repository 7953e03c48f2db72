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

    /** The array body as it was built value by value with String.format. */
    private static String formatted(int[] values, int digits, int perLine, String indent) {
        StringBuilder b = new StringBuilder();
        for (int i = 0; i < values.length; i++) {
            b.append(i % perLine == 0 ? (i > 0 ? "\n" : "") + indent : " ");
            long v = values[i] & 0xFFFFFFFFL;
            b.append(String.format(java.util.Locale.ROOT, "0x%0" + digits + "X", v));
            b.append(i < values.length - 1 ? "," : "");
        }
        return b.toString();
    }

    @Test
    void writesWhatFormattingEachValueWrote() {
        java.util.Random random = new java.util.Random(11);
        int[] v = new int[20_000];
        for (int i = 0; i < v.length; i++) {
            v[i] = i % 97 == 0 ? random.nextInt() : random.nextInt(1 << (1 + i % 16));
        }
        for (int digits : new int[] {1, 2, 3, 4, 8, 9}) {
            for (int perLine : new int[] {1, 7, 16, 5000}) {
                assertEquals(formatted(v, digits, perLine, "    "), CLiterals.arrayBody(v, digits, perLine, "    "));
            }
        }
        assertEquals(formatted(new int[] {5}, 2, 16, "\t"), CLiterals.arrayBody(new int[] {5}, 2, 16, "\t"));
        assertEquals("", CLiterals.arrayBody(new int[0], 2, 16, "  "));
    }
}
