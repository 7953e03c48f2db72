package org.rungtone.script.eval;

import java.util.List;
import org.rungtone.script.ast.Pos;

/**
 * A two-input operation on samples: arithmetic, comparisons and logic (true is 1, false is 0; NaN stays
 * NaN), and the two-argument maths functions. The four arithmetic operators have tight loops of their own,
 * with a constant
 * operand read once per block.
 */
final class Arith extends Eval {
    /** The operations. */
    enum Op {
        ADD, SUB, MUL, DIV, POW, LT, LE, GT, GE, EQ, NE, AND, OR, MIN, MAX, ATAN2, MOD, HYPOT;

        double apply(double a, double b) {
            if (ordinal() >= LT.ordinal() && ordinal() <= OR.ordinal() && (a != a || b != b)) {
                return Double.NaN;   // a comparison must not hide a NaN behind a 0 or 1
            }
            switch (this) {
                case ADD:
                    return a + b;
                case SUB:
                    return a - b;
                case MUL:
                    return a * b;
                case DIV:
                    return a / b;
                case POW:
                    return Math.pow(a, b);
                case LT:
                    return a < b ? 1 : 0;
                case LE:
                    return a <= b ? 1 : 0;
                case GT:
                    return a > b ? 1 : 0;
                case GE:
                    return a >= b ? 1 : 0;
                case EQ:
                    return a == b ? 1 : 0;
                case NE:
                    return a != b ? 1 : 0;
                case AND:
                    return a != 0 && b != 0 ? 1 : 0;
                case OR:
                    return a != 0 || b != 0 ? 1 : 0;
                case MIN:
                    return Math.min(a, b);
                case MAX:
                    return Math.max(a, b);
                case ATAN2:
                    return Math.atan2(a, b);
                case MOD:
                    return a - b * Math.floor(a / b);
                default:
                    return Math.hypot(a, b);
            }
        }
    }

    private final Op op;
    private final Eval left;
    private final Eval right;
    private final double[] out = new double[Block.SIZE];

    Arith(Pos pos, String label, Op op, Eval left, Eval right) {
        super(pos, label);
        this.op = op;
        this.left = left;
        this.right = right;
    }

    @Override
    double[] compute(Block b) {
        double[] x = left.run(b);
        double[] y = right.run(b);
        int n = b.length;
        boolean kx = left.isConstant();
        boolean ky = right.isConstant();
        switch (op) {
            case ADD:
                if (ky) {
                    add(x, y[0], n);
                } else if (kx) {
                    add(y, x[0], n);
                } else {
                    for (int i = 0; i < n; i++) {
                        out[i] = x[i] + y[i];
                    }
                }
                break;
            case MUL:
                if (ky) {
                    scale(x, y[0], n);
                } else if (kx) {
                    scale(y, x[0], n);
                } else {
                    for (int i = 0; i < n; i++) {
                        out[i] = x[i] * y[i];
                    }
                }
                break;
            case SUB:
                for (int i = 0; i < n; i++) {
                    out[i] = x[i] - y[i];
                }
                break;
            case DIV:
                for (int i = 0; i < n; i++) {
                    out[i] = x[i] / y[i];
                }
                break;
            default:
                for (int i = 0; i < n; i++) {
                    out[i] = op.apply(x[i], y[i]);
                }
        }
        return out;
    }

    private void add(double[] x, double k, int n) {
        for (int i = 0; i < n; i++) {
            out[i] = x[i] + k;
        }
    }

    private void scale(double[] x, double k, int n) {
        for (int i = 0; i < n; i++) {
            out[i] = x[i] * k;
        }
    }

    @Override
    List<Eval> inputs() {
        return List.of(left, right);
    }

    @Override
    boolean pure() {
        return true;
    }
}
