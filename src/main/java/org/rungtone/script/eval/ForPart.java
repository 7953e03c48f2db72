package org.rungtone.script.eval;

import java.util.Arrays;
import java.util.List;
import org.rungtone.script.ast.Pos;

/** {@code part for D}: the part plays from local time 0 for D seconds, silent outside; its length is D. */
final class ForPart extends Eval {
    private final Eval child;
    private final Frame parent;
    private final Frame frame;
    private final double length;
    private final double[] out = new double[Block.SIZE];

    /** {@code frame} shares the parent's clock; the child was compiled in it. */
    ForPart(Pos pos, Eval child, Frame parent, Frame frame, double length) {
        super(pos, "for");
        this.child = child;
        this.parent = parent;
        this.frame = frame;
        this.length = length;
        this.lengthSeconds = length;
    }

    @Override
    double[] compute(Block b) {
        double[] t = parent.t;
        int n = b.length;
        boolean any = false;
        for (int i = 0; i < n && !any; i++) {
            any = t[i] >= 0 && t[i] < length;
        }
        if (!any) {
            Arrays.fill(out, 0, n, 0.0);
            return out;
        }
        frame.monotonic = parent.monotonic;
        double[] c = child.run(b);
        for (int i = 0; i < n; i++) {
            out[i] = t[i] >= 0 && t[i] < length ? c[i] : 0;
        }
        return out;
    }

    @Override
    List<Eval> inputs() {
        return List.of(child);
    }
}
