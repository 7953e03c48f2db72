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
        super(message);
    }

    /** Creates an error with a complete one-line message and its cause (shown only with --verbose). */
    public InputError(String message, Throwable cause) {
        super(message, cause);
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
