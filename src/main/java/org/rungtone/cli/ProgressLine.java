package org.rungtone.cli;

import java.io.PrintWriter;
import java.util.Locale;

/**
 * One status line on a terminal's stderr, redrawn with a carriage return: a percentage for counted work, or a
 * short text for stages. Silent when off (not a terminal, or --quiet), so piped output stays clean.
 */
final class ProgressLine {
    private final PrintWriter err;
    private final boolean on;
    private int width;
    private int shownPercent = -1;

    ProgressLine(PrintWriter err, boolean on) {
        this.err = err;
        this.on = on;
    }

    /** A line for a command: on only when the console is a terminal and the user did not ask for quiet. */
    static ProgressLine forTerminal(PrintWriter err, CommonOptions common) {
        return new ProgressLine(err, System.console() != null && !common.quiet);
    }

    /** This line, but silent unless {@code condition} holds too (for example: only for long runs). */
    ProgressLine onlyIf(boolean condition) {
        return new ProgressLine(err, on && condition);
    }

    /**
     * Shows "what: 42% of 2000 items", redrawn only when the whole percent changes, so workers may report every
     * item without flooding the terminal; clears the line when all are done.
     */
    synchronized void showPercent(String what, int done, int total, String items) {
        if (!on) {
            return;
        }
        int percent = (int) (100L * done / total);
        if (percent == shownPercent) {
            return;
        }
        shownPercent = percent;
        if (done == total) {
            clear();
        } else {
            show(String.format(Locale.ROOT, "%s: %3d%% of %d %s", what, percent, total, items));
        }
    }

    synchronized void show(String what, int done, int total) {
        show(String.format(Locale.ROOT, "%s: %d/%d (%d%%)", what, done, total,
                total == 0 ? 100 : 100 * done / total));
    }

    synchronized void show(String line) {
        if (on) {
            String padded = line.length() < width ? line + " ".repeat(width - line.length()) : line;
            width = Math.max(width, line.length());
            err.print("\r" + padded);
            err.flush();
        }
    }

    synchronized void clear() {
        if (on && width > 0) {
            err.print("\r" + " ".repeat(width) + "\r");
            err.flush();
            width = 0;
        }
    }
}
