package org.rungtone.script.eval;

import java.util.List;
import org.rungtone.script.ast.Pos;

/** A built-in variable read from a frame: {@code t}, {@code n}, {@code phase}, {@code pitch} or {@code dur}. */
final class Var extends Eval {
    private final double[] source;

    Var(Pos pos, String name, double[] source) {
        super(pos, name);
        this.source = source;
    }

    @Override
    double[] compute(Block b) {
        return source;
    }

    @Override
    List<Eval> inputs() {
        return List.of();
    }
}
