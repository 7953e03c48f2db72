package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

class AssemblerTableTest {
    @Test
    void onlyTablesOverTheAvrObjectLimitNeedIt() {
        assertFalse(AssemblerTable.needed(32767));
        assertTrue(AssemblerTable.needed(32768));
    }

    @Test
    void writesOneContiguousObjectInStatementsUnderTheC99StringLimit() throws IOException {
        byte[] bytes = new byte[1000];
        for (int i = 0; i < bytes.length; i++) {
            bytes[i] = (byte) i;
        }
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        AssemblerTable.write("s_samples", bytes, out);
        String text = out.toString(StandardCharsets.US_ASCII);
        String[] statements = text.split("__asm__\\(\n");
        // 1000 bytes: 63 lines of 16, 32 lines per statement
        assertEquals(3, statements.length);
        for (int i = 1; i < statements.length; i++) {
            String push = "    \"\\t.pushsection .progmem.data.s_samples,\\\"a\\\",@progbits\\n\"";
            assertTrue(statements[i].startsWith(push), statements[i]);
            assertTrue(statements[i].endsWith("    \"\\t.popsection\\n\");\n"), statements[i]);
            assertTrue(statements[i].length() < 4095, "statement " + i + ": " + statements[i].length());
        }
        assertTrue(statements[1].contains("\"s_samples:\\n\"\n    \"\\t.byte 0x00,0x01,0x02,"), statements[1]);
        assertTrue(text.contains("\"\\t.byte 0xE0,0xE1,0xE2,0xE3,0xE4,0xE5,0xE6,0xE7\\n\"\n"
                + "    \"\\t.size s_samples, 1000\\n\"\n"), text);
    }

    @Test
    void widerCodesAreStoredLeastSignificantByteFirst() {
        assertArrayEquals(new byte[] {0x34, 0x12, (byte) 0xFF, 0x03}, AssemblerTable.bytes(new int[] {0x1234, 0x3FF},
                13, false));
        assertArrayEquals(new byte[] {5, 7}, AssemblerTable.bytes(new int[] {5, 7}, 8, false));
    }
}
