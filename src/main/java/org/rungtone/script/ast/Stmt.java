package org.rungtone.script.ast;

/** A statement of a script: a declaration, a named value or the output. */
public sealed interface Stmt {
    /** Where the statement's keyword is. */
    Pos pos();

    /** {@code duration D}: the script is a clip lasting D seconds. */
    record Duration(Pos pos, Expr seconds) implements Stmt {
    }

    /** {@code wavetable N samples}: the script is one cycle of N samples. */
    record Wavetable(Pos pos, Expr length) implements Stmt {
    }

    /** {@code rate R}: the preferred sample rate in hertz. */
    record Rate(Pos pos, Expr hertz) implements Stmt {
    }

    /** {@code let name = value}: a named expression, usable after this line. */
    record Let(Pos pos, String name, Pos namePos, Expr value) implements Stmt {
    }

    /** {@code out value}: the script's output signal. */
    record Out(Pos pos, Expr value) implements Stmt {
    }
}
