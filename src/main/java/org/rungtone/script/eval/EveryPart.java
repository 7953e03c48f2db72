package org.rungtone.script.eval;

import java.util.List;
import org.rungtone.script.ast.Pos;

/** {@code part every P}: the part starts again every P seconds (local time t mod P); it has no length. */
final class EveryPart extends Eval {
    private final Eval child;
    private final Frame parent;
    private final Frame frame;
    private final double period;

    /** {@code frame} is a child frame of {@code parent} with length P; the child was compiled in it. */
    EveryPart(Pos pos, Eval child, Frame parent, Frame frame, double period) {
        super(pos, "every");
        this.child = child;
        this.parent = parent;
        this.frame = frame;
        this.period = period;
    }

    @Override
    double[] compute(Block b) {
        double[] t = parent.t;
        double[] local = frame.t;
        int n = b.length;
        for (int i = 0; i < n; i++) {
            double ti = t[i];
            if (ti < 0) {
                local[i] = ti;
            } else {
                double x = ti - period * Math.floor(ti / period);
                local[i] = x >= period ? x - period : Math.max(0.0, x);
            }
        }
        frame.checkMonotonic(parent.monotonic, n);
        return child.run(b);
    }

    @Override
    List<Eval> inputs() {
        return List.of(child);
    }
}
