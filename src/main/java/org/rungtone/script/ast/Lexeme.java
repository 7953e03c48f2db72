package org.rungtone.script.ast;

/**
 * A token as the tree builder sees it: its text and where it starts.
 *
 * <p>The generated parser hands its tokens over in this form, so that the tree depends on nothing generated
 * (the parser depends on the tree, never the other way round).
 */
public record Lexeme(String text, Pos pos) {
    /** The lexeme of text starting at a 1-based line and column. */
    public static Lexeme of(String text, int line, int column) {
        return new Lexeme(text, new Pos(line, column));
    }
}
