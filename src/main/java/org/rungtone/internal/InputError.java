package org.rungtone.internal;

/**
 * A problem with the user's input that the user can fix: a bad file, a bad value, an impossible setting.
 * The command line prints its message as one line and exits with code 1. The message names the file and
 * position where there is one, says what is wrong and, where possible, how to fix it.
 */
public class InputError extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /** Creates an error with a complete one-line message. */
    public InputError(String message) {
        super(oneLine(message));
    }

    /** Creates an error with a complete one-line message and its cause (shown only with --verbose). */
    public InputError(String message, Throwable cause) {
        super(oneLine(message), cause);
    }

    /**
     * Keeps a message on one line when it quotes the user's text: line breaks and other control characters
     * (a carriage return escaped into a TOML name, a tab in a script token, the escape that starts a
     * terminal's control sequence) are written as backslash escapes such as {@code \n} and {@code \t}; the
     * rest, the C1 controls 0x80-0x9F included, as a backslash, the letter u and four hex digits.
     */
    public static String oneLine(String message) {
        if (message == null) {
            return null;
        }
        StringBuilder b = new StringBuilder(message.length());
        for (int i = 0; i < message.length(); i++) {
            char c = message.charAt(i);
            if (c == '\n') {
                b.append("\\n");
            } else if (c == '\r') {
                b.append("\\r");
            } else if (c == '\t') {
                b.append("\\t");
            } else if (c < 0x20 || (c >= 0x7F && c <= 0x9F) || c == 0x2028 || c == 0x2029) {
                b.append(String.format(java.util.Locale.ROOT, "\\u%04X", (int) c));
            } else {
                b.append(c);
            }
        }
        return b.toString();
    }

    /** Prefixes the message with a file name: {@code "chime.wav: " + message}. */
    public static InputError inFile(java.nio.file.Path file, String message) {
        return new InputError(file + ": " + message);
    }

    /** Prefixes the message with a file name: {@code "chime.wav: " + message}, keeping the cause. */
    public static InputError inFile(java.nio.file.Path file, String message, Throwable cause) {
        return new InputError(file + ": " + message, cause);
    }
}
