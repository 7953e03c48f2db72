package org.rungtone.ladder;

import org.rungtone.internal.InputError;

/**
 * A ladder description that cannot be built, tied to the key at fault ({@code "resistors"},
 * {@code "buffer.out_max"}) so that the caller can point at the file line or the command-line option that
 * set it. Its message reads {@code "ladder.KEY: DETAIL"}.
 */
public final class LadderSpecError extends InputError {
    private static final long serialVersionUID = 1L;

    private final String key;
    private final String detail;

    /** Creates an error about {@code key} (ladder-file spelling, dotted for the buffer table). */
    public LadderSpecError(String key, String detail) {
        super("ladder." + key + ": " + detail);
        this.key = key;
        this.detail = detail;
    }

    /** The ladder-file key at fault, e.g. {@code "resistors"} or {@code "buffer.gain"}. */
    public String key() {
        return key;
    }

    /** What is wrong, without the key. */
    public String detail() {
        return detail;
    }
}
