package org.rungtone.script.ast;

/** A position in a script: 1-based line and column (a tab counts as one column). */
public record Pos(int line, int column) {
    @Override
    public String toString() {
        return line + ":" + column;
    }
}
