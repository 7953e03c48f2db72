package org.rungtone.script.ast;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The literal rules of the language: unit suffixes, decibels and note names.
 *
 * <p>Units scale to SI: {@code 2.5kHz} = 2500 (hertz), {@code 250ms} = 0.25 (seconds), {@code 25%} = 0.25.
 * Decibels are amplitude ratios: factor = 10^(dB/20), so -6.0206 dB = 0.5. Notes use twelve-tone equal
 * temperament with A4 = 440 Hz (ISO 16:1975): f = 440 · 2^((m − 69)/12) with m = 12·(octave + 1) + semitone
 * (C = 0, D = 2, E = 4, F = 5, G = 7, A = 9, B = 11; '#' raises and 'b' lowers by one), so C4 ≈ 261.626 Hz.
 */
public final class Literals {
    /** Unit suffixes and their factors, in the order the reference lists them. */
    private static final Map<String, Double> UNITS = new LinkedHashMap<>();
    private static final Pattern MANTISSA = Pattern.compile("(?:\\d+\\.?\\d*|\\.\\d+)(?:[eE][+-]?\\d+)?");
    private static final Pattern NOTE = Pattern.compile("([A-G])([#b]?)([0-9])");

    static {
        UNITS.put("Hz", 1.0);
        UNITS.put("kHz", 1e3);
        UNITS.put("MHz", 1e6);
        UNITS.put("s", 1.0);
        UNITS.put("ms", 1e-3);
        UNITS.put("us", 1e-6);
        UNITS.put("\u00b5s", 1e-6);
        UNITS.put("\u03bcs", 1e-6);
        UNITS.put("%", 0.01);
        UNITS.put("k", 1e3);
    }

    private Literals() {
    }

    /** The unit suffixes a number may carry (besides {@code dB}). */
    public static List<String> units() {
        return new ArrayList<>(UNITS.keySet());
    }

    /**
     * The value of a number as written, scaled by its unit suffix.
     *
     * @throws ScriptProblem for an unknown unit (with a suggestion) or a number too large for a double
     */
    public static double number(String text, Pos pos) {
        Matcher m = MANTISSA.matcher(text);
        if (!m.lookingAt()) {
            throw new ScriptProblem(pos, "'" + text + "' is not a number");
        }
        String suffix = text.substring(m.end());
        double value = Double.parseDouble(m.group());
        if (!Double.isFinite(value)) {
            throw new ScriptProblem(pos, "number '" + text + "' is too large; expected at most about 1e308");
        }
        if (suffix.isEmpty()) {
            return value;
        }
        Double factor = UNITS.get(suffix);
        if (factor == null) {
            Pos at = new Pos(pos.line(), pos.column() + m.end());
            String hint = Suggestions.nearestUnit(suffix, List.of("Hz", "kHz", "MHz", "s", "ms", "us", "%", "k",
                    "dB"));
            throw new ScriptProblem(at, "unknown unit '" + suffix + "' in '" + text + "'; "
                    + (hint != null ? "did you mean '" + hint + "'?"
                            : "expected one of Hz, kHz, MHz, s, ms, us, %, k or dB"));
        }
        return value * factor;
    }

    /**
     * The decibel number of a {@code dB} literal such as {@code -6dB} or {@code +3.5dB}.
     *
     * @throws ScriptProblem for a number too large for a double
     */
    public static double decibels(String text, Pos pos) {
        double db = Double.parseDouble(text.substring(0, text.length() - 2));
        if (!Double.isFinite(db)) {
            throw new ScriptProblem(pos, "number '" + text + "' is too large; expected at most about 1e308");
        }
        return db;
    }

    /** The linear amplitude factor of a level in decibels: 10^(dB/20). */
    public static double dbToFactor(double db) {
        return Math.pow(10.0, db / 20.0);
    }

    /**
     * The equal-tempered frequency of a note name such as {@code A4}, {@code C#5} or {@code Bb3}.
     *
     * @throws IllegalArgumentException when {@code name} is not a note name
     */
    public static double noteHz(String name) {
        Matcher m = NOTE.matcher(name);
        if (!m.matches()) {
            throw new IllegalArgumentException("not a note name: " + name);
        }
        int semitone = "C D EF G A B".indexOf(m.group(1).charAt(0));
        if (m.group(2).equals("#")) {
            semitone++;
        } else if (m.group(2).equals("b")) {
            semitone--;
        }
        int octave = m.group(3).charAt(0) - '0';
        return midiHz(12 * (octave + 1) + semitone);
    }

    /** The equal-tempered frequency of MIDI note number {@code m} (69 = A4 = 440 Hz). */
    public static double midiHz(double m) {
        return 440.0 * Math.pow(2.0, (m - 69.0) / 12.0);
    }
}
