package org.rungtone.script.ast;

import java.util.List;

/** An expression of a script: a closed family of immutable tree nodes, each knowing its position. */
public sealed interface Expr {
    /** Where the expression starts (for operators: where the operator is). */
    Pos pos();

    /** A plain number, already scaled by its unit suffix ({@code 2.5kHz} is 2500); {@code text} as written. */
    record Num(Pos pos, double value, String text) implements Expr {
    }

    /** A gain written in decibels ({@code -6dB}); its value is the linear factor 10^(dB/20). */
    record Decibels(Pos pos, double db) implements Expr {
        /** The linear amplitude factor. */
        public double factor() {
            return Literals.dbToFactor(db);
        }
    }

    /** A note name ({@code A4}, {@code C#5}, {@code Bb3}) standing for its equal-tempered frequency. */
    record Note(Pos pos, String name, double hz) implements Expr {
    }

    /** The word {@code rest}: a silent step in a note list. */
    record Rest(Pos pos) implements Expr {
    }

    /** A reference to a named value or built-in variable. */
    record Name(Pos pos, String id) implements Expr {
    }

    /** A function call; {@code pos} is where the function name is. */
    record Call(Pos pos, String function, List<Expr> args) implements Expr {
        /** Copies the argument list. */
        public Call {
            args = List.copyOf(args);
        }
    }

    /** A prefix operator. */
    record Unary(Pos pos, UnaryOp op, Expr operand) implements Expr {
    }

    /** An infix operator; {@code pos} is where the operator is. */
    record Binary(Pos pos, BinaryOp op, Expr left, Expr right) implements Expr {
    }

    /** {@code if test then a else b}. */
    record Conditional(Pos pos, Expr test, Expr then, Expr otherwise) implements Expr {
    }

    /** A pair {@code (a, b)}: a (time, level) point, a (signal, gain) mix input or a (note, length) step. */
    record Pair(Pos pos, Expr first, Expr second) implements Expr {
    }

    /** A timing operator: {@code part for D}, {@code part at T}, {@code part every P}, {@code part repeat N}. */
    record Timed(Pos pos, TimedOp op, Expr part, Expr amount) implements Expr {
    }

    /** Prefix operators. */
    enum UnaryOp {
        NEG("-", "neg"), NOT("not", "not");

        private final String symbol;
        private final String sexpr;

        UnaryOp(String symbol, String sexpr) {
            this.symbol = symbol;
            this.sexpr = sexpr;
        }

        /** The operator as written in a script. */
        public String symbol() {
            return symbol;
        }

        /** The operator's name in the s-expression form. */
        public String sexpr() {
            return sexpr;
        }
    }

    /** Infix operators, as written in scripts. */
    enum BinaryOp {
        ADD("+"), SUB("-"), MUL("*"), DIV("/"), POW("^"),
        LT("<"), LE("<="), GT(">"), GE(">="), EQ("=="), NE("!="),
        AND("and"), OR("or");

        private final String symbol;

        BinaryOp(String symbol) {
            this.symbol = symbol;
        }

        /** The operator as written in a script (also its s-expression name). */
        public String symbol() {
            return symbol;
        }

        /** The operator written as {@code symbol}. */
        public static BinaryOp of(String symbol) {
            for (BinaryOp op : values()) {
                if (op.symbol.equals(symbol)) {
                    return op;
                }
            }
            throw new IllegalArgumentException("not an operator: " + symbol);
        }
    }

    /** Timing operators. */
    enum TimedOp {
        FOR("for"), AT("at"), EVERY("every"), REPEAT("repeat");

        private final String word;

        TimedOp(String word) {
            this.word = word;
        }

        /** The keyword as written in a script. */
        public String word() {
            return word;
        }

        /** The operator written as {@code word}. */
        public static TimedOp of(String word) {
            for (TimedOp op : values()) {
                if (op.word.equals(word)) {
                    return op;
                }
            }
            throw new IllegalArgumentException("not a timing word: " + word);
        }
    }
}
