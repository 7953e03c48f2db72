package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** Number formatting for C source: fixed-width hex, decimal, and arrays wrapped a fixed count per line. */
public final class CLiterals {
    private static final char[] HEX = "0123456789ABCDEF".toCharArray();

    private CLiterals() {
    }

    /** {@code 0x3F} style with {@code digits} hex digits. */
    public static String hex(long value, int digits) {
        return String.format(Locale.ROOT, "0x%0" + digits + "X", value);
    }

    /** Hex digits needed for values of {@code bits} bits (at least 2). */
    public static int hexDigits(int bits) {
        return Math.max(2, (bits + 3) / 4);
    }

    /**
     * Formats values as array-initialiser lines, {@code perLine} values a line, each line ending with a
     * comma except the last, with the given indent.
     */
    public static List<String> arrayLines(int[] values, int digits, int perLine, String indent) {
        String body = arrayBody(values, digits, perLine, indent);
        List<String> lines = new ArrayList<>((values.length + perLine - 1) / perLine);
        if (!body.isEmpty()) {
            lines.addAll(List.of(body.split("\n", -1)));
        }
        return lines;
    }

    /**
     * The array-initialiser lines of {@link #arrayLines} joined with {@code \n} (no final newline), built
     * without per-value formatting so that millions of values take milliseconds. Values are taken as
     * unsigned 32-bit.
     */
    public static String arrayBody(int[] values, int digits, int perLine, String indent) {
        StringBuilder b = new StringBuilder(values.length * (digits + 4) + values.length / perLine * 8 + 16);
        for (int i = 0; i < values.length; i++) {
            if (i % perLine == 0) {
                if (i > 0) {
                    b.append('\n');
                }
                b.append(indent);
            } else {
                b.append(' ');
            }
            appendHex(b, values[i] & 0xFFFFFFFFL, digits);
            if (i < values.length - 1) {
                b.append(',');
            }
        }
        return b.toString();
    }

    /** {@link #arrayBody} for bytes, two hex digits each, taken as unsigned. */
    public static String arrayBody(byte[] values, int perLine, String indent) {
        int[] v = new int[values.length];
        for (int i = 0; i < v.length; i++) {
            v[i] = values[i] & 0xFF;
        }
        return arrayBody(v, 2, perLine, indent);
    }

    private static void appendHex(StringBuilder b, long value, int digits) {
        b.append('0').append('x');
        int shown = Math.max(digits, (64 - Long.numberOfLeadingZeros(value) + 3) / 4);
        for (int d = shown - 1; d >= 0; d--) {
            b.append(HEX[(int) (value >>> (4 * d)) & 0xF]);
        }
    }

    /** A C double literal with enough digits, e.g. {@code 16000.0}. */
    public static String real(double v) {
        String s = String.format(Locale.ROOT, "%.9g", v);
        if (s.contains(".")) {
            s = s.replaceAll("0+(?=$|e)", "").replaceAll("\\.(?=$|e)", ".0");
        }
        return s;
    }
}
