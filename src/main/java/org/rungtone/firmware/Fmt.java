package org.rungtone.firmware;

import java.util.Locale;

/** Number formatting for firmware reports and messages: hertz, bytes with thousands separators, ppm. */
final class Fmt {
    private Fmt() {
    }

    /** A frequency with up to {@code significant} significant digits: {@code 22.0386 kHz}, {@code 16 MHz}. */
    static String hz(double hz, int significant) {
        double a = Math.abs(hz);
        String unit;
        double v;
        if (a >= 1e6) {
            v = hz / 1e6;
            unit = " MHz";
        } else if (a >= 1e3) {
            v = hz / 1e3;
            unit = " kHz";
        } else if (a >= 1 || a == 0) {
            v = hz;
            unit = " Hz";
        } else if (a >= 1e-3) {
            v = hz * 1e3;
            unit = " mHz";
        } else {
            v = hz * 1e6;
            unit = " µHz";
        }
        return trim(String.format(Locale.ROOT, "%." + significant + "g", v)) + unit;
    }

    /** A frequency with six significant digits. */
    static String hz(double hz) {
        return hz(hz, 6);
    }

    /** A plain number with up to {@code decimals} decimals, trailing zeros removed: {@code 22038.567}. */
    static String plain(double v, int decimals) {
        return trim(String.format(Locale.ROOT, "%." + decimals + "f", v));
    }

    /** A byte count with thousands separators: {@code 12,345}. */
    static String bytes(long n) {
        return String.format(Locale.ROOT, "%,d", n);
    }

    /** Parts per million with one decimal and a sign: {@code -518.5}, {@code +0.0}. */
    static String ppm(double ppm) {
        return String.format(Locale.ROOT, "%+.1f", ppm);
    }

    private static String trim(String s) {
        if (s.contains("e") || s.contains("E") || !s.contains(".")) {
            return s;
        }
        return s.replaceAll("0+$", "").replaceAll("\\.$", "");
    }
}
