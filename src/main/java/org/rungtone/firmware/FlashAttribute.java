package org.rungtone.firmware;

import org.rungtone.internal.Setting;
import org.rungtone.internal.SettingError;

/**
 * The text a user places on a bare sample array to keep it in flash ({@code PROGMEM},
 * {@code __attribute__((section(".rodata")))}), checked before it is pasted into C. Accepted: C identifiers,
 * each optionally followed by a parenthesised group that holds identifiers, numbers, commas, plain string
 * literals and further balanced groups. Anything else (a semicolon, a brace, a comment, a line break) could end
 * the declaration and add code of its own, so it is refused.
 */
public final class FlashAttribute {
    /** The longest attribute text accepted. */
    public static final int MAX_LENGTH = 200;

    private final String text;
    private int at;

    private FlashAttribute(String text) {
        this.text = text;
    }

    /**
     * The attribute, trimmed; empty for none.
     *
     * @throws SettingError about {@link Setting#FLASH_ATTR} naming what is not allowed and where
     */
    public static String check(String text) {
        String t = text == null ? "" : text.strip();
        if (t.length() > MAX_LENGTH) {
            throw refuse(t, "it is " + t.length() + " characters long, at most " + MAX_LENGTH);
        }
        new FlashAttribute(t).items();
        return t;
    }

    /** Identifiers, each with an optional group, separated by blanks. */
    private void items() {
        while (true) {
            blanks();
            if (at == text.length()) {
                return;
            }
            identifier();
            blanks();
            if (at < text.length() && text.charAt(at) == '(') {
                group();
            }
        }
    }

    /** A balanced group: {@code (} identifiers, numbers, commas, strings or groups {@code )}. */
    private void group() {
        int open = at++;
        while (true) {
            blanks();
            if (at == text.length()) {
                throw refuse(text, "the '(' at column " + (open + 1) + " is never closed");
            }
            char c = text.charAt(at);
            if (c == ')') {
                at++;
                return;
            } else if (c == '(') {
                group();
            } else if (c == ',') {
                at++;
            } else if (c == '"') {
                string();
            } else if (Character.isDigit(c)) {
                while (at < text.length() && (isWord(text.charAt(at)) || text.charAt(at) == '.')) {
                    at++;
                }
            } else {
                identifier();
            }
        }
    }

    /** A string literal of printable characters, without escapes or comment marks. */
    private void string() {
        int open = at++;
        while (at < text.length() && text.charAt(at) != '"') {
            char c = text.charAt(at);
            if (c < 0x20 || c > 0x7e || c == '\\' || text.startsWith("*/", at) || text.startsWith("/*", at)) {
                throw unexpected();
            }
            at++;
        }
        if (at == text.length()) {
            throw refuse(text, "the string at column " + (open + 1) + " is never closed");
        }
        at++;
    }

    private void identifier() {
        if (at >= text.length() || !isWord(text.charAt(at)) || Character.isDigit(text.charAt(at))) {
            throw unexpected();
        }
        while (at < text.length() && isWord(text.charAt(at))) {
            at++;
        }
    }

    private void blanks() {
        while (at < text.length() && (text.charAt(at) == ' ' || text.charAt(at) == '\t')) {
            at++;
        }
    }

    private static boolean isWord(char c) {
        return c < 0x80 && (Character.isLetterOrDigit(c) || c == '_');
    }

    private SettingError unexpected() {
        // a control character is shown escaped when the message is made one line
        String shown = new String(Character.toChars(text.codePointAt(at)));
        return refuse(text, "'" + shown + "' at column " + (at + 1) + " is not allowed");
    }

    private static SettingError refuse(String text, String why) {
        return Setting.FLASH_ATTR.error("'%s' is not a C attribute: %s; write identifiers and __attribute__((...)),"
                + " e.g. PROGMEM or __attribute__((section(\".rodata\")))", text, why);
    }
}
