package org.rungtone.internal;

import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Reads and prints quantities the way schematics write them: {@code 4k7}, {@code 2.2k}, {@code 16kHz},
 * {@code 250ms}, {@code 3.3V}, {@code 5%}, {@code 100n}, {@code inf}. Values are SI units inside the code.
 */
public final class Units {
    private static final Pattern PLAIN = Pattern.compile(
            "([+-]?(?:\\d+\\.?\\d*|\\.\\d+)(?:[eE][+-]?\\d+)?)\\s*([pnuµmkKMG]?)\\s*([A-Za-zΩ%]*)");
    /** Resistor-code form: the prefix letter stands for the decimal point, e.g. 4k7, 2M2, 4R7. */
    private static final Pattern CODE = Pattern.compile("(\\d+)([pnuµmkKMGR])(\\d+)\\s*([A-Za-zΩ]*)");

    private Units() {
    }

    /**
     * Parses a quantity. {@code unit} is the expected unit symbol ("Hz", "s", "V", "ohm", "F", "%", or "" for
     * a plain number); writing the unit is optional, a different unit is an error.
     *
     * @param text the text as written by the user
     * @param unit expected unit
     * @return the value in SI units (a percentage is returned as a fraction: "5%" is 0.05)
     * @throws InputError when the text is not a number of that unit
     */
    public static double parse(String text, String unit) {
        String t = text == null ? "" : text.trim();
        if (t.equalsIgnoreCase("inf") || t.equalsIgnoreCase("infinity") || t.equals("∞")) {
            return Double.POSITIVE_INFINITY;
        }
        Matcher code = CODE.matcher(t);
        if (code.matches() && unitMatches(code.group(4), unit)) {
            double mult = code.group(2).equals("R") ? 1 : prefix(code.group(2));
            return Double.parseDouble(code.group(1) + "." + code.group(3)) * mult;
        }
        Matcher m = PLAIN.matcher(t);
        if (m.matches()) {
            String pre = m.group(2);
            String u = m.group(3);
            if (unit.equals("%") && u.equals("%") && pre.isEmpty()) {
                return Double.parseDouble(m.group(1)) / 100.0;
            }
            // "5m" for metres is not ours; but "5M" ohm and "5m" seconds are. "ms" = milli-seconds.
            if (!pre.isEmpty() && u.isEmpty() && unit.isEmpty()) {
                return Double.parseDouble(m.group(1)) * prefix(pre);
            }
            if (unitMatches(u, unit)) {
                return Double.parseDouble(m.group(1)) * prefix(pre);
            }
            // "250ms" parses as prefix "" and unit "ms" because the unit group is greedy.
            if (pre.isEmpty() && u.length() > 1 && "pnuµmkKMG".indexOf(u.charAt(0)) >= 0
                    && unitMatches(u.substring(1), unit)) {
                return Double.parseDouble(m.group(1)) * prefix(u.substring(0, 1));
            }
        }
        throw new InputError("'" + text + "' is not " + describe(unit));
    }

    /**
     * Parses a level in decibels: {@code -1}, {@code -6dB}, {@code -3dBFS}.
     *
     * @throws InputError with an example when the text is not a finite number of dB
     */
    public static double parseDecibels(String text) {
        String t = text == null ? "" : text.trim().replaceFirst("(?i)dbfs$|(?i)db$", "");
        try {
            double d = Double.parseDouble(t);
            if (Double.isFinite(d)) {
                return d;
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        throw new InputError("'" + text + "' is not a level in dB (e.g. -1 or -6dB)");
    }

    /** Parses a plain integer count, accepting a k suffix ("4k" is 4000). */
    public static long parseCount(String text) {
        double v = parse(text, "");
        if (v != Math.rint(v) || Math.abs(v) > 9.0e15) {
            throw new InputError("'" + text + "' is not a whole number");
        }
        return (long) v;
    }

    private static boolean unitMatches(String written, String unit) {
        if (written.isEmpty()) {
            return true;
        }
        switch (unit) {
            case "ohm":
                return written.equalsIgnoreCase("ohm") || written.equalsIgnoreCase("ohms")
                        || written.equals("Ω") || written.equals("R");
            case "Hz":
                return written.equalsIgnoreCase("hz");
            case "s":
                return written.equals("s") || written.equals("sec");
            case "V":
                return written.equals("V") || written.equals("v");
            case "A":
                return written.equals("A");
            case "F":
                return written.equals("F");
            default:
                return written.equals(unit);
        }
    }

    private static double prefix(String p) {
        switch (p) {
            case "":
                return 1;
            case "p":
                return 1e-12;
            case "n":
                return 1e-9;
            case "u":
            case "µ":
                return 1e-6;
            case "m":
                return 1e-3;
            case "k":
            case "K":
                return 1e3;
            case "M":
                return 1e6;
            case "G":
                return 1e9;
            default:
                throw new IllegalArgumentException("unknown prefix " + p);
        }
    }

    private static String describe(String unit) {
        switch (unit) {
            case "ohm":
                return "a resistance (e.g. 4k7, 2.2k, 100, 1M)";
            case "Hz":
                return "a frequency (e.g. 16kHz, 8000, 22.05k)";
            case "s":
                return "a time (e.g. 250ms, 1.5s)";
            case "V":
                return "a voltage (e.g. 5V, 3.3, 600mV)";
            case "A":
                return "a current (e.g. 20mA)";
            case "F":
                return "a capacitance (e.g. 10n, 4.7nF)";
            case "%":
                return "a percentage (e.g. 5%, 0.1%)";
            default:
                return "a number";
        }
    }

    /**
     * Formats a value in engineering notation with up to four significant digits: {@code 4.7k}, {@code 250m},
     * {@code 16k}. Appends {@code unit} when not empty: {@code 16kHz}, {@code 2.61V}.
     */
    public static String format(double value, String unit) {
        if (Double.isNaN(value)) {
            return "NaN";
        }
        if (Double.isInfinite(value)) {
            return (value > 0 ? "inf" : "-inf") + unit;
        }
        if (value == 0) {
            return "0" + unit;
        }
        String[] prefixes = {"p", "n", "µ", "m", "", "k", "M", "G"};
        int exp3 = (int) Math.floor(Math.log10(Math.abs(value)) / 3);
        exp3 = Math.max(-4, Math.min(3, exp3));
        double scaled = value / Math.pow(10, exp3 * 3);
        String num = String.format(Locale.ROOT, "%.4g", scaled);
        if (num.contains("e") || num.contains("E")) {
            num = String.format(Locale.ROOT, "%.3f", scaled);
        }
        if (num.contains(".")) {
            num = num.replaceAll("0+$", "").replaceAll("\\.$", "");
        }
        return num + prefixes[exp3 + 4] + unit;
    }
}
