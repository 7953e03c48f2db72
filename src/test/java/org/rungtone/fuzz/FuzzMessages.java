package org.rungtone.fuzz;

import org.rungtone.internal.InputError;

/** The contract every fuzz target holds an input error to: one line that names the file and says more. */
final class FuzzMessages {
    private FuzzMessages() {
    }

    /** Fails unless {@code e}'s message starts with {@code name:}, says something after it and is one line. */
    static void checkMessage(InputError e, String name) {
        String msg = e.getMessage();
        if (msg == null || !msg.startsWith(name + ":") || msg.length() <= name.length() + 2
                || msg.contains("\n") || msg.contains("\r")) {
            throw new AssertionError("unclear error message: " + msg, e);
        }
    }
}
