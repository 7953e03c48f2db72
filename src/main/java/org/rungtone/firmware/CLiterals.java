package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/** Number formatting for C source: fixed-width hex, decimal, and arrays wrapped a fixed count per line. */
public final class CLiterals {
    private static final byte[] HEX = "0123456789ABCDEF".getBytes(java.nio.charset.StandardCharsets.US_ASCII);

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
        java.io.ByteArrayOutputStream b = new java.io.ByteArrayOutputStream(values.length * (digits + 4)
                + values.length / perLine * 8 + 16);
        try {
            writeArrayBody(values, digits, perLine, indent, b);
        } catch (java.io.IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
        return b.toString(java.nio.charset.StandardCharsets.US_ASCII);
    }

    /**
     * Writes the text of {@link #arrayBody} as ASCII straight to {@code out}, a 64 KiB buffer at a time, so a
     * sample array of millions of values is never held as one string.
     */
    public static void writeArrayBody(int[] values, int digits, int perLine, String indent,
            java.io.OutputStream out) throws java.io.IOException {
        byte[] in = indent.getBytes(java.nio.charset.StandardCharsets.US_ASCII);
        // a line at most: newline, indent, and per value a space, "0x", up to 8 digits (or more when asked) and ","
        int lineBytes = 1 + in.length + perLine * (4 + Math.max(digits, 8));
        byte[] buf = new byte[Math.max(1 << 16, 2 * lineBytes)];
        int n = 0;
        int last = values.length - 1;
        for (int start = 0; start < values.length; start += perLine) {
            if (n > buf.length - lineBytes) {
                out.write(buf, 0, n);
                n = 0;
            }
            if (start > 0) {
                buf[n++] = '\n';
            }
            System.arraycopy(in, 0, buf, n, in.length);
            n += in.length;
            int end = Math.min(values.length, start + perLine);
            for (int i = start; i < end; i++) {
                if (i > start) {
                    buf[n++] = ' ';
                }
                n = putHex(values[i] & 0xFFFFFFFFL, digits, buf, n);
                if (i < last) {
                    buf[n++] = ',';
                }
            }
        }
        out.write(buf, 0, n);
    }

    /** Writes {@code 0x} and the value's hex digits, at least {@code digits}, at {@code n}; returns the end. */
    private static int putHex(long value, int digits, byte[] buf, int n) {
        buf[n] = '0';
        buf[n + 1] = 'x';
        int shown = digits >= 8 || value >>> (4 * digits) == 0 ? digits
                : (64 - Long.numberOfLeadingZeros(value) + 3) / 4;
        int at = n + 2 + shown;
        long v = value;
        for (int d = at - 1; d >= n + 2; d--) {
            buf[d] = HEX[(int) v & 0xF];
            v >>>= 4;
        }
        return at;
    }

    /** {@link #arrayBody} for bytes, two hex digits each, taken as unsigned. */
    public static String arrayBody(byte[] values, int perLine, String indent) {
        return arrayBody(unsigned(values), 2, perLine, indent);
    }

    /** {@link #writeArrayBody} for bytes, two hex digits each, taken as unsigned. */
    public static void writeArrayBody(byte[] values, int perLine, String indent, java.io.OutputStream out)
            throws java.io.IOException {
        writeArrayBody(unsigned(values), 2, perLine, indent, out);
    }

    private static int[] unsigned(byte[] values) {
        int[] v = new int[values.length];
        for (int i = 0; i < v.length; i++) {
            v[i] = values[i] & 0xFF;
        }
        return v;
    }
}
