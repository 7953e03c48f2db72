package org.rungtone.script.eval;

import java.util.List;
import org.rungtone.script.ast.Pos;

/** A one-input function of samples: the maths functions, negation, {@code not} and {@code db}. */
final class MathCall extends Eval {
    /** The functions; {@code DB} turns decibels into a linear factor, 10^(x/20). */
    enum Fn {
        NEG, NOT, SIN, COS, TAN, ASIN, ACOS, ATAN, SINH, COSH, TANH, EXP, LOG, LOG2, LOG10, SQRT, ABS, SIGN,
        FLOOR, CEIL, ROUND, FRAC, DB;

        double apply(double x) {
            switch (this) {
                case NEG:
                    return -x;
                case NOT:
                    return x == 0 ? 1 : x != x ? Double.NaN : 0;
                case SIN:
                    return Math.sin(x);
                case COS:
                    return Math.cos(x);
                case TAN:
                    return Math.tan(x);
                case ASIN:
                    return Math.asin(x);
                case ACOS:
                    return Math.acos(x);
                case ATAN:
                    return Math.atan(x);
                case SINH:
                    return Math.sinh(x);
                case COSH:
                    return Math.cosh(x);
                case TANH:
                    return Math.tanh(x);
                case EXP:
                    return Math.exp(x);
                case LOG:
                    return Math.log(x);
                case LOG2:
                    return Math.log(x) / Math.log(2.0);
                case LOG10:
                    return Math.log10(x);
                case SQRT:
                    return Math.sqrt(x);
                case ABS:
                    return Math.abs(x);
                case SIGN:
                    return Math.signum(x);
                case FLOOR:
                    return Math.floor(x);
                case CEIL:
                    return Math.ceil(x);
                case ROUND:
                    return Math.floor(x + 0.5);
                case FRAC:
                    return x - Math.floor(x);
                default:
                    return org.rungtone.script.ast.Literals.dbToFactor(x);
            }
        }
    }

    private final Fn fn;
    private final Eval input;
    private final double[] out = new double[Block.SIZE];

    MathCall(Pos pos, String label, Fn fn, Eval input) {
        super(pos, label);
        this.fn = fn;
        this.input = input;
    }

    @Override
    double[] compute(Block b) {
        double[] x = input.run(b);
        int n = b.length;
        if (fn == Fn.NEG) {
            for (int i = 0; i < n; i++) {
                out[i] = -x[i];
            }
        } else {
            for (int i = 0; i < n; i++) {
                out[i] = fn.apply(x[i]);
            }
        }
        return out;
    }

    @Override
    List<Eval> inputs() {
        return List.of(input);
    }

    @Override
    boolean pure() {
        return true;
    }
}
