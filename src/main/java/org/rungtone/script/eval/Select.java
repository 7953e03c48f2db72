package org.rungtone.script.eval;

import java.util.List;
import org.rungtone.script.ast.Pos;

/**
 * {@code if test then a else b}, sample by sample; both branches keep running so oscillators stay in phase.
 * A NaN test gives NaN.
 */
final class Select extends Eval {
    private final Eval test;
    private final Eval then;
    private final Eval otherwise;
    private final double[] out = new double[Block.SIZE];

    Select(Pos pos, Eval test, Eval then, Eval otherwise) {
        super(pos, "if");
        this.test = test;
        this.then = then;
        this.otherwise = otherwise;
    }

    @Override
    double[] compute(Block b) {
        double[] c = test.run(b);
        double[] x = then.run(b);
        double[] y = otherwise.run(b);
        for (int i = 0; i < b.length; i++) {
            out[i] = c[i] != c[i] ? c[i] : c[i] != 0 ? x[i] : y[i];
        }
        return out;
    }

    @Override
    List<Eval> inputs() {
        return List.of(test, then, otherwise);
    }

    /** Only the test (when it is NaN) or the branch it picked can explain a non-finite output. */
    @Override
    List<Eval> culprits(int i) {
        double c = test.lastResult()[i];
        return List.of(c != c ? test : c != 0 ? then : otherwise);
    }

    @Override
    boolean pure() {
        return true;
    }
}
