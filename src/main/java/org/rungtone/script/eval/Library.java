package org.rungtone.script.eval;

import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/** The built-in functions with their argument counts and signatures, and the built-in variable names. */
final class Library {
    /** A function's name, its smallest and largest argument count (−1: no limit) and its signature. */
    record Signature(String name, int min, int max, String usage) {
        /** "1 argument", "1 or 2 arguments", "at least 3 arguments", ... */
        String counted() {
            if (max < 0) {
                return "at least " + min + (min == 1 ? " argument" : " arguments");
            } else if (min == max) {
                return min + (min == 1 ? " argument" : " arguments");
            } else if (max == min + 1) {
                return min + " or " + max + " arguments";
            }
            return min + " to " + max + " arguments";
        }
    }

    /** What an argument may be besides a plain value. */
    enum Role { VALUE, MIX_INPUT, POINT, STEP }

    /** Built-in variables, in the order the reference lists them. */
    static final List<String> VARIABLES = List.of("t", "n", "fs", "phase", "pitch", "dur", "pi");

    private static final Map<String, Signature> FUNCTIONS = new LinkedHashMap<>();

    static {
        for (String f : List.of("sin", "cos", "tan", "asin", "acos", "atan", "sinh", "cosh", "tanh", "exp",
                "log", "log2", "log10", "sqrt", "abs", "sign", "floor", "ceil", "round", "frac")) {
            add(f, 1, 1, f + "(x)");
        }
        add("atan2", 2, 2, "atan2(y, x)");
        add("hypot", 2, 2, "hypot(x, y)");
        add("mod", 2, 2, "mod(x, m)");
        add("min", 2, -1, "min(a, b, ...)");
        add("max", 2, -1, "max(a, b, ...)");
        add("clamp", 3, 3, "clamp(x, low, high)");
        add("db", 1, 1, "db(level_db)");
        add("sine", 1, 2, "sine(frequency [, start_phase])");
        add("triangle", 1, 2, "triangle(frequency [, start_phase])");
        add("square", 1, 2, "square(frequency [, duty])");
        add("sawup", 1, 1, "sawup(frequency)");
        add("sawdown", 1, 1, "sawdown(frequency)");
        add("pulse", 2, 2, "pulse(frequency, width)");
        add("linsweep", 3, 3, "linsweep(from, to, time)");
        add("logsweep", 3, 3, "logsweep(from, to, time)");
        add("adsr", 4, 5, "adsr(attack, decay, sustain, release [, off])");
        add("decay", 1, 1, "decay(time_constant)");
        add("segments", 1, -1, "segments((time, level), ...)");
        add("white", 0, 1, "white([level])");
        add("gauss", 1, 1, "gauss(sigma)");
        add("pink", 1, 1, "pink(rms)");
        add("clip", 1, 2, "clip(x [, limit])");
        add("saturate", 1, 2, "saturate(x [, drive])");
        add("mix", 1, -1, "mix(input, ...)");
        add("fade", 3, 3, "fade(x, fade_in, fade_out)");
        add("sequence", 1, -1, "sequence(part, ...)");
        add("notes", 3, -1, "notes(voice, length, step, ...)");
    }

    private Library() {
    }

    private static void add(String name, int min, int max, String usage) {
        FUNCTIONS.put(name, new Signature(name, min, max, usage));
    }

    /** The signature of function {@code name}, or null. */
    static Signature function(String name) {
        return FUNCTIONS.get(name);
    }

    /** All function names, in reference order. */
    static Collection<String> functionNames() {
        return FUNCTIONS.keySet();
    }

    /** What argument {@code index} of function {@code name} may be. */
    static Role role(String name, int index) {
        switch (name) {
            case "mix":
                return Role.MIX_INPUT;
            case "segments":
                return Role.POINT;
            case "notes":
                return index >= 2 ? Role.STEP : Role.VALUE;
            default:
                return Role.VALUE;
        }
    }
}
