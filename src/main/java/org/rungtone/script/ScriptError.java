package org.rungtone.script;

import java.util.List;
import org.rungtone.internal.InputError;

/**
 * A problem in a {@code .rung} script: its one-line message reads
 * {@code FILE:LINE:COL: what is wrong; what was expected} (or {@code did you mean 'x'?}), and
 * {@link #excerpt()} gives the source line with a caret under the column.
 */
public final class ScriptError extends InputError {
    private static final long serialVersionUID = 1L;

    /** The most characters of the source line an excerpt shows. */
    static final int EXCERPT_WIDTH = 120;

    private final String fileName;
    private final int line;
    private final int column;
    private final String sourceLine;

    /**
     * An error at {@code line}:{@code column} (1-based) of {@code fileName}.
     *
     * @param problem what is wrong and what was expected, one line, without the position prefix
     * @param sourceLine the text of that line, for the excerpt
     */
    public ScriptError(String fileName, int line, int column, String problem, String sourceLine) {
        super(fileName + ":" + line + ":" + column + ": " + problem);
        this.fileName = fileName;
        this.line = line;
        this.column = column;
        this.sourceLine = sourceLine;
    }

    /** The script's file name as given. */
    public String fileName() {
        return fileName;
    }

    /** 1-based line. */
    public int line() {
        return line;
    }

    /** 1-based column; a tab counts as one column. */
    public int column() {
        return column;
    }

    /**
     * Two lines: the source line, and a line with a caret under the column. Control characters in the line
     * are shown escaped as in the message ({@link InputError#oneLine}), so that a terminal prints them rather
     * than obeying them, and the caret moves along by the width of each escape; tabs are kept so the caret
     * lines up in a terminal. A line longer than {@value #EXCERPT_WIDTH} characters is cut to that many
     * around the column.
     */
    public List<String> excerpt() {
        StringBuilder shown = new StringBuilder();
        StringBuilder caret = new StringBuilder();
        for (int i = 0; i < Math.max(sourceLine.length(), column - 1); i++) {
            char c = i < sourceLine.length() ? sourceLine.charAt(i) : ' ';
            String s = c == '\t' ? "\t" : InputError.oneLine(String.valueOf(c));
            if (i < sourceLine.length()) {
                shown.append(s);
            }
            if (i < column - 1) {
                caret.append(c == '\t' ? "\t" : " ".repeat(s.length()));
            }
        }
        if (shown.length() <= EXCERPT_WIDTH) {
            return List.of(shown.toString(), caret.append('^').toString());
        }
        // a long line (a generated script) is cut to a window around the column, marked with "..."
        int at = caret.length();
        int from = Math.max(0, Math.min(at - EXCERPT_WIDTH / 2, shown.length() - EXCERPT_WIDTH));
        int to = Math.min(shown.length(), from + EXCERPT_WIDTH);
        String lead = from > 0 ? "..." : "";
        return List.of(lead + shown.substring(from, to) + (to < shown.length() ? "..." : ""),
                " ".repeat(lead.length()) + caret.substring(Math.min(from, at)) + "^");
    }
}
