package org.rungtone.script.ast;

import java.util.List;
import org.rungtone.script.parser.Token;

/** Builds tree nodes from tokens; the generated parser's actions call these and nothing else. */
public final class Ast {
    private Ast() {
    }

    /** The position of a token. */
    public static Pos pos(Token t) {
        return new Pos(t.beginLine, t.beginColumn);
    }

    /** The whole script; {@code end} is the end-of-file token. */
    public static Script script(List<Stmt> body, Token end) {
        return new Script(body, pos(end));
    }

    /** {@code duration D}. */
    public static Stmt duration(Token keyword, Expr seconds) {
        return new Stmt.Duration(pos(keyword), seconds);
    }

    /** {@code wavetable N samples}. */
    public static Stmt wavetable(Token keyword, Expr length) {
        return new Stmt.Wavetable(pos(keyword), length);
    }

    /** {@code rate R}. */
    public static Stmt rate(Token keyword, Expr hertz) {
        return new Stmt.Rate(pos(keyword), hertz);
    }

    /** {@code let name = value}. */
    public static Stmt let(Token keyword, Token name, Expr value) {
        return new Stmt.Let(pos(keyword), name.image, pos(name), value);
    }

    /** {@code out value}. */
    public static Stmt out(Token keyword, Expr value) {
        return new Stmt.Out(pos(keyword), value);
    }

    /** {@code if test then a else b}. */
    public static Expr conditional(Token keyword, Expr test, Expr then, Expr otherwise) {
        return new Expr.Conditional(pos(keyword), test, then, otherwise);
    }

    /** An infix operation; the operator token gives both the operator and the position. */
    public static Expr binary(Token op, Expr left, Expr right) {
        return new Expr.Binary(pos(op), Expr.BinaryOp.of(op.image), left, right);
    }

    /** A prefix operation: {@code -x} or {@code not x}. */
    public static Expr unary(Token op, Expr operand) {
        Expr.UnaryOp kind = op.image.equals("not") ? Expr.UnaryOp.NOT : Expr.UnaryOp.NEG;
        return new Expr.Unary(pos(op), kind, operand);
    }

    /** A timing operation: {@code part for D}, {@code at T}, {@code every P}, {@code repeat N}. */
    public static Expr timed(Token op, Expr part, Expr amount) {
        return new Expr.Timed(pos(op), Expr.TimedOp.of(op.image), part, amount);
    }

    /** A number with an optional unit suffix. */
    public static Expr number(Token t) {
        return new Expr.Num(pos(t), Literals.number(t.image, pos(t)), t.image);
    }

    /** A decibel literal, its sign included. */
    public static Expr decibels(Token t) {
        return new Expr.Decibels(pos(t), Literals.decibels(t.image, pos(t)));
    }

    /** A note name. */
    public static Expr note(Token t) {
        return new Expr.Note(pos(t), t.image, Literals.noteHz(t.image));
    }

    /** The word {@code rest}. */
    public static Expr rest(Token t) {
        return new Expr.Rest(pos(t));
    }

    /** A name on its own. */
    public static Expr name(Token t) {
        return new Expr.Name(pos(t), t.image);
    }

    /** A function call. */
    public static Expr call(Token name, List<Expr> args) {
        return new Expr.Call(pos(name), name.image, args);
    }

    /** Parentheses: {@code (e)} is {@code e} itself, {@code (e, second)} is a pair. */
    public static Expr group(Token open, Expr e, Expr second) {
        return second == null ? e : new Expr.Pair(pos(open), e, second);
    }
}
