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
        StringBuilder b = new StringBuilder();
        for (int i = 0; i < values.length; i++) {
            if (i % perLine == 0) {
                b.setLength(0);
                b.append(indent);
            } else {
                b.append(' ');
            }
            b.append(hex(values[i] & 0xFFFFFFFFL, digits));
            if (i < values.length - 1) {
                b.append(',');
            }
            if (i % perLine == perLine - 1 || i == values.length - 1) {
                lines.add(b.toString());
            }
        }
        return lines;
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
