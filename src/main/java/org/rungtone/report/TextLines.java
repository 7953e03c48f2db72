package org.rungtone.report;

import java.util.Locale;

/** Line helpers of the plain-text reports: formatted lines without trailing spaces, and wrapped paragraphs. */
final class TextLines {
    /** The column text is wrapped at. */
    static final int WIDTH = 100;

    private TextLines() {
    }

    /** Appends one formatted line ({@link Locale#ROOT}), trailing spaces dropped. */
    static void line(StringBuilder b, String format, Object... args) {
        b.append(String.format(Locale.ROOT, format, args).stripTrailing()).append('\n');
    }

    /** Appends {@code text} after {@code first}, wrapped at {@value #WIDTH} columns, continued under its first word. */
    static void wrap(StringBuilder b, String first, String text) {
        String indent = " ".repeat(first.length());
        StringBuilder l = new StringBuilder(first);
        for (String word : text.split(" ")) {
            if (l.length() + 1 + word.length() > WIDTH && l.length() > first.length()) {
                b.append(l.toString().stripTrailing()).append('\n');
                l = new StringBuilder(indent);
            }
            if (l.length() > indent.length()) {
                l.append(' ');
            }
            l.append(word);
        }
        b.append(l.toString().stripTrailing()).append('\n');
    }
}
