package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** Number formatting for C source: fixed-width hex, decimal, and arrays wrapped a fixed count per line. */
public final class CLiterals {
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
        List<String> lines = new ArrayList<>((values.length + perLine - 1) / perLine);
        String all = arrayBody(values, digits, perLine, indent);
        if (!all.isEmpty()) {
            lines.addAll(List.of(all.split("\n")));
        }
        return lines;
    }

    /**
     * The same as {@link #arrayLines} joined with {@code \n} (no final newline), built in one buffer: this is
     * the hot path for large sample arrays.
     */
    public static String arrayBody(int[] values, int digits, int perLine, String indent) {
        StringBuilder b = new StringBuilder(values.length * (digits + 4) + values.length / perLine * 8);
        for (int i = 0; i < values.length; i++) {
            if (i % perLine == 0) {
                if (i > 0) {
                    b.append('\n');
                }
                b.append(indent);
            } else {
                b.append(' ');
            }
            b.append('0').append('x');
            long v = values[i] & 0xFFFFFFFFL;
            for (int d = digits - 1; d >= 0; d--) {
                b.append(HEX[(int) ((v >>> (4 * d)) & 0xF)]);
            }
            if (i < values.length - 1) {
                b.append(',');
            }
        }
        return b.toString();
    }

    private static final char[] HEX = "0123456789ABCDEF".toCharArray();

    /** A C double literal with enough digits, e.g. {@code 16000.0}. */
    public static String real(double v) {
        String s = String.format(Locale.ROOT, "%.9g", v);
        if (s.contains(".")) {
            s = s.replaceAll("0+(?=$|e)", "").replaceAll("\\.(?=$|e)", ".0");
        }
        return s;
    }
}
