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

    /** The macro prefix for a symbol: upper case. */
    public static String macro(String symbol) {
        return symbol.toUpperCase(Locale.ROOT);
    }
}
