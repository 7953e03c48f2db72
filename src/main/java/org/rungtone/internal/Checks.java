package org.rungtone.internal;

import java.util.Locale;

/** Argument checks whose messages state the rule and the offending value. */
public final class Checks {
    private Checks() {
    }

    /**
     * Throws {@link IllegalArgumentException} with a formatted message when {@code condition} is false.
     *
     * @throws IllegalArgumentException when the condition does not hold
     */
    public static void checkArgument(boolean condition, String format, Object... args) {
        if (!condition) {
            throw new IllegalArgumentException(String.format(Locale.ROOT, format, args));
        }
    }

    /**
     * Throws {@link InputError} (a user-fixable problem) when {@code condition} is false.
     *
     * @throws InputError when the condition does not hold
     */
    public static void checkInput(boolean condition, String format, Object... args) {
        if (!condition) {
            throw new InputError(String.format(Locale.ROOT, format, args));
        }
    }

    /** Checks that {@code value} is a bit depth of 1..16 and returns it. */
    public static int checkBits(int value) {
        checkInput(value >= 1 && value <= 16, "bit depth must be 1..16: %d", value);
        return value;
    }

    /** Checks that {@code value} is finite and positive and returns it. */
    public static double checkPositive(double value, String what) {
        checkInput(Double.isFinite(value) && value > 0, "%s must be a positive number: %s", what,
                Units.format(value, ""));
        return value;
    }
}
