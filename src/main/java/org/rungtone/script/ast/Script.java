package org.rungtone.script.ast;

import java.util.List;

/** A parsed script: its statements in order and the position just after the last token. */
public record Script(List<Stmt> statements, Pos end) {
    /** Copies the statement list. */
    public Script {
        statements = List.copyOf(statements);
    }
}
