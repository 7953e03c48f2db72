package org.rungtone.script.eval;

import java.util.Arrays;
import java.util.List;
import org.rungtone.script.ast.Pos;

/** A constant: a literal or a folded constant expression. */
final class Const extends Eval {
    final double value;
    private final double[] out = new double[Block.SIZE];

    Const(Pos pos, String label, double value) {
        super(pos, label);
        this.value = value;
        Arrays.fill(out, value);
    }

    @Override
    double[] compute(Block b) {
        return out;
    }

    @Override
    List<Eval> inputs() {
        return List.of();
    }

    @Override
    boolean isConstant() {
        return true;
    }
}
