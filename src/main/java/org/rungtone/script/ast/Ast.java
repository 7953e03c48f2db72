package org.rungtone.script.ast;

import java.util.List;

/** Builds tree nodes from {@link Lexeme}s; the generated parser's actions call these and nothing else. */
public final class Ast {
    private Ast() {
    }

    /** The whole script; {@code end} is the end-of-file token. */
    public static Script script(List<Stmt> body, Lexeme end) {
        return new Script(body, end.pos());
    }

    /** {@code duration D}. */
    public static Stmt duration(Lexeme keyword, Expr seconds) {
        return new Stmt.Duration(keyword.pos(), seconds);
    }

    /** {@code wavetable N samples}. */
    public static Stmt wavetable(Lexeme keyword, Expr length) {
        return new Stmt.Wavetable(keyword.pos(), length);
    }

    /** {@code rate R}. */
    public static Stmt rate(Lexeme keyword, Expr hertz) {
        return new Stmt.Rate(keyword.pos(), hertz);
    }

    /** {@code let name = value}. */
    public static Stmt let(Lexeme keyword, Lexeme name, Expr value) {
        return new Stmt.Let(keyword.pos(), name.text(), name.pos(), value);
    }

    /** {@code out value}. */
    public static Stmt out(Lexeme keyword, Expr value) {
        return new Stmt.Out(keyword.pos(), value);
    }

    /** {@code if test then a else b}. */
    public static Expr conditional(Lexeme keyword, Expr test, Expr then, Expr otherwise) {
        return new Expr.Conditional(keyword.pos(), test, then, otherwise);
    }

    /** An infix operation; the operator token gives both the operator and the position. */
    public static Expr binary(Lexeme op, Expr left, Expr right) {
        return new Expr.Binary(op.pos(), Expr.BinaryOp.of(op.text()), left, right);
    }

    /** A prefix operation: {@code -x} or {@code not x}. */
    public static Expr unary(Lexeme op, Expr operand) {
        Expr.UnaryOp kind = op.text().equals("not") ? Expr.UnaryOp.NOT : Expr.UnaryOp.NEG;
        return new Expr.Unary(op.pos(), kind, operand);
    }

    /** A timing operation: {@code part for D}, {@code at T}, {@code every P}, {@code repeat N}. */
    public static Expr timed(Lexeme op, Expr part, Expr amount) {
        return new Expr.Timed(op.pos(), Expr.TimedOp.of(op.text()), part, amount);
    }

    /** A number with an optional unit suffix. */
    public static Expr number(Lexeme t) {
        return new Expr.Num(t.pos(), Literals.number(t.text(), t.pos()), t.text());
    }

    /** A decibel literal, its sign included. */
    public static Expr decibels(Lexeme t) {
        return new Expr.Decibels(t.pos(), Literals.decibels(t.text(), t.pos()));
    }

    /** A note name. */
    public static Expr note(Lexeme t) {
        return new Expr.Note(t.pos(), t.text(), Literals.noteHz(t.text()));
    }

    /** The word {@code rest}. */
    public static Expr rest(Lexeme t) {
        return new Expr.Rest(t.pos());
    }

    /** A name on its own. */
    public static Expr name(Lexeme t) {
        return new Expr.Name(t.pos(), t.text());
    }

    /** A function call. */
    public static Expr call(Lexeme name, List<Expr> args) {
        return new Expr.Call(name.pos(), name.text(), args);
    }

    /** Parentheses: {@code (e)} is {@code e} itself, {@code (e, second)} is a pair. */
    public static Expr group(Lexeme open, Expr e, Expr second) {
        return second == null ? e : new Expr.Pair(open.pos(), e, second);
    }
}
