package org.rungtone.firmware;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;

/**
 * A flash table written as top-level {@code __asm__} statements for avr-gcc, which refuses any C object of
 * more than {@value #MAX_C_OBJECT_BYTES} bytes (its {@code ptrdiff_t} is 16 bits). The assembler defines one
 * contiguous object of any size in a {@code .progmem.data} section, so the player reads it with the same
 * pointers and LPM instructions as a C array. Each statement holds at most {@value #LINES_PER_STATEMENT} lines
 * of {@value #BYTES_PER_LINE} bytes, so its string stays under the 4095 characters that C99 compilers must
 * accept (GCC's {@code -Woverlength-strings}), and pushes and pops the section itself, so the statements may
 * sit anywhere among the compiler's own output.
 */
final class AssemblerTable {
    /** The largest object avr-gcc compiles: PTRDIFF_MAX of the 16-bit AVR ABI. */
    static final long MAX_C_OBJECT_BYTES = 32767;

    private static final int BYTES_PER_LINE = 16;
    private static final int LINES_PER_STATEMENT = 32;
    private static final char[] HEX = "0123456789ABCDEF".toCharArray();

    private AssemblerTable() {
    }

    /** True when a table of {@code bytes} must be defined in assembler for avr-gcc. */
    static boolean needed(long bytes) {
        return bytes > MAX_C_OBJECT_BYTES;
    }

    /**
     * Writes the statements that define {@code symbol} as {@code bytes}, as ASCII, straight to {@code out}.
     *
     * @throws IOException when {@code out} fails
     */
    static void write(String symbol, byte[] bytes, OutputStream out) throws IOException {
        String section = "    \"\\t.pushsection .progmem.data." + symbol + ",\\\"a\\\",@progbits\\n\"\n";
        StringBuilder b = new StringBuilder();
        int lines = (bytes.length + BYTES_PER_LINE - 1) / BYTES_PER_LINE;
        for (int line = 0; line < lines; line++) {
            if (line % LINES_PER_STATEMENT == 0) {
                b.append("__asm__(\n").append(section);
                if (line == 0) {
                    b.append("    \"\\t.global ").append(symbol).append("\\n\"\n")
                            .append("    \"\\t.type ").append(symbol).append(", @object\\n\"\n")
                            .append("    \"").append(symbol).append(":\\n\"\n");
                }
            }
            b.append("    \"\\t.byte ");
            int from = line * BYTES_PER_LINE;
            int to = Math.min(bytes.length, from + BYTES_PER_LINE);
            for (int i = from; i < to; i++) {
                int v = bytes[i] & 0xFF;
                b.append(i == from ? "" : ",").append("0x").append(HEX[v >> 4]).append(HEX[v & 15]);
            }
            b.append("\\n\"\n");
            boolean last = line == lines - 1;
            if (last) {
                b.append("    \"\\t.size ").append(symbol).append(", ").append(bytes.length).append("\\n\"\n");
            }
            if (last || line % LINES_PER_STATEMENT == LINES_PER_STATEMENT - 1) {
                b.append("    \"\\t.popsection\\n\");\n");
                out.write(b.toString().getBytes(StandardCharsets.US_ASCII));
                b.setLength(0);
            }
        }
    }

    /** The table's bytes: packed as they are, codes of up to 8 bits one byte each, wider ones LSB first. */
    static byte[] bytes(int[] codes, int bits, boolean packed) {
        if (packed) {
            return SamplePacking.pack(codes, bits);
        }
        int size = bits <= 8 ? 1 : 2;
        byte[] out = new byte[codes.length * size];
        for (int i = 0; i < codes.length; i++) {
            out[i * size] = (byte) codes[i];
            if (size == 2) {
                out[i * size + 1] = (byte) (codes[i] >> 8);
            }
        }
        return out;
    }
}
