package org.rungtone.script.ast;

import java.util.stream.Collectors;

/**
 * Prints a script tree as an s-expression, for tests and debugging: {@code (out (* 0.5 (sine 440)))}.
 * Numbers appear in SI units after their suffix was applied; decibels and notes keep their written form.
 */
public final class SExpression {
    private SExpression() {
    }

    /** The whole script: {@code (script STATEMENT...)}. */
    public static String of(Script script) {
        StringBuilder sb = new StringBuilder("(script");
        for (Stmt s : script.statements()) {
            sb.append(' ').append(of(s));
        }
        return sb.append(')').toString();
    }

    /** One statement. */
    public static String of(Stmt s) {
        if (s instanceof Stmt.Duration d) {
            return "(duration " + of(d.seconds()) + ")";
        } else if (s instanceof Stmt.Wavetable w) {
            return "(wavetable " + of(w.length()) + ")";
        } else if (s instanceof Stmt.Rate r) {
            return "(rate " + of(r.hertz()) + ")";
        } else if (s instanceof Stmt.Let l) {
            return "(let " + l.name() + " " + of(l.value()) + ")";
        } else {
            return "(out " + of(((Stmt.Out) s).value()) + ")";
        }
    }

    /** One expression. */
    public static String of(Expr e) {
        if (e instanceof Expr.Num n) {
            return number(n.value());
        } else if (e instanceof Expr.Decibels d) {
            return "(dB " + number(d.db()) + ")";
        } else if (e instanceof Expr.Note n) {
            return "(note " + n.name() + ")";
        } else if (e instanceof Expr.Rest) {
            return "(rest)";
        } else if (e instanceof Expr.Name n) {
            return n.id();
        } else if (e instanceof Expr.Call c) {
            String args = c.args().stream().map(a -> " " + of(a)).collect(Collectors.joining());
            return "(" + c.function() + args + ")";
        } else if (e instanceof Expr.Unary u) {
            return "(" + u.op().sexpr() + " " + of(u.operand()) + ")";
        } else if (e instanceof Expr.Binary b) {
            return "(" + b.op().symbol() + " " + of(b.left()) + " " + of(b.right()) + ")";
        } else if (e instanceof Expr.Conditional c) {
            return "(if " + of(c.test()) + " " + of(c.then()) + " " + of(c.otherwise()) + ")";
        } else if (e instanceof Expr.Pair p) {
            return "(pair " + of(p.first()) + " " + of(p.second()) + ")";
        } else {
            Expr.Timed t = (Expr.Timed) e;
            return "(" + t.op().word() + " " + of(t.part()) + " " + of(t.amount()) + ")";
        }
    }

    /** A number in its shortest form: whole numbers without a decimal point, others as Java prints them. */
    public static String number(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e15) {
            return Long.toString((long) v);
        }
        return Double.toString(v);
    }
}
