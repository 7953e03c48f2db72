package org.rungtone.firmware;

import java.util.Locale;
import java.util.Set;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;

/**
 * C identifier rules in one place: turns the user's name setting ({@link Setting#NAME}) into a symbol prefix
 * that is a valid C99 identifier, avoids keywords and reserved names, and derives macro names from it.
 */
public final class CNames {
    private static final Set<String> KEYWORDS = Set.of("auto", "break", "case", "char", "const", "continue",
            "default", "do", "double", "else", "enum", "extern", "float", "for", "goto", "if", "inline", "int",
            "long", "register", "restrict", "return", "short", "signed", "sizeof", "static", "struct", "switch",
            "typedef", "union", "unsigned", "void", "volatile", "while", "_Bool", "_Complex", "_Imaginary",
            "bool", "true", "false", "main");

    private CNames() {
    }

    /**
     * The symbol prefix for a name: lower case, runs of other characters turned into one underscore, no
     * leading or trailing underscore; a leading digit gets the prefix {@code snd_}.
     *
     * @throws InputError when nothing usable is left or the result is a C keyword
     */
    public static String symbol(String name) {
        String raw = name == null ? "" : name.trim();
        StringBuilder b = new StringBuilder();
        boolean underscore = false;
        for (int i = 0; i < raw.length(); i++) {
            char c = raw.charAt(i);
            boolean ok = (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9');
            if (ok) {
                b.append(Character.toLowerCase(c));
                underscore = false;
            } else if (!underscore && b.length() > 0) {
                b.append('_');
                underscore = true;
            }
        }
        while (b.length() > 0 && b.charAt(b.length() - 1) == '_') {
            b.setLength(b.length() - 1);
        }
        String s = b.toString();
        if (s.isEmpty()) {
            throw Setting.NAME.error("'%s' has no letters or digits to make a C symbol from; use e.g. %s"
                    + " door_chime", raw, Setting.NAME.ref());
        }
        if (Character.isDigit(s.charAt(0))) {
            s = "snd_" + s;
        }
        if (KEYWORDS.contains(s)) {
            throw Setting.NAME.error("'%s' would make the C keyword '%s'; choose another name, e.g. %s_sound",
                    raw, s, s);
        }
        if (s.length() > 40) {
            throw Setting.NAME.error("'%s' is too long for a C symbol prefix (%d characters, at most 40)", raw,
                    s.length());
        }
        return s;
    }

    /**
     * What became of a name on its way to a symbol prefix, and why, in words; empty when the name is the
     * symbol but for case and separators ({@code Door-Chime} gives {@code door_chime} without a note). E.g.
     * {@code the name '9x' became the C symbol prefix 'snd_9x': a C identifier cannot start with a digit}.
     *
     * @throws InputError as {@link #symbol} does
     */
    public static java.util.Optional<String> rewritten(String name) {
        String symbol = symbol(name);
        String raw = name == null ? "" : name.trim();
        // lower case and '-', '.' or spaces as '_' is what anyone expects (door-chime -> door_chime): no note
        if (symbol.equals(raw.toLowerCase(Locale.ROOT).replaceAll("[-. ]+", "_"))) {
            return java.util.Optional.empty();
        }
        java.util.List<String> why = new java.util.ArrayList<>();
        if (!raw.equals(raw.toLowerCase(Locale.ROOT))) {
            why.add("symbols are lower case");
        }
        if (!raw.matches("[A-Za-z0-9_]*") || raw.contains("__") || raw.startsWith("_") || raw.endsWith("_")) {
            why.add("anything but ASCII letters and digits becomes one '_' (none at either end)");
        }
        if (symbol.startsWith("snd_") && !raw.toLowerCase(Locale.ROOT).startsWith("snd")) {
            why.add("a C identifier cannot start with a digit, so 'snd_' goes first");
        }
        return java.util.Optional.of(String.format(Locale.ROOT, "the name '%s' became the C symbol prefix '%s': %s;"
                + " to choose it yourself, give a name that already is one", raw, symbol,
                String.join("; ", why)));
    }

    /** The macro prefix for a symbol: upper case. */
    public static String macro(String symbol) {
        return symbol.toUpperCase(Locale.ROOT);
    }
}
