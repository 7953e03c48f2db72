package org.rungtone.script.ast;

/**
 * A problem found in a script at a position, raised inside the script packages and turned into the public
 * {@code ScriptError} (with file name and source excerpt) by {@code RungScript}. Not API.
 */
public final class ScriptProblem extends RuntimeException {
    private static final long serialVersionUID = 1L;
    private final transient Pos pos;

    /** A problem at {@code pos}; {@code message} says what is wrong and what was expected, on one line. */
    public ScriptProblem(Pos pos, String message) {
        super(message);
        this.pos = pos;
    }

    /** Where the problem is. */
    public Pos pos() {
        return pos;
    }
}
