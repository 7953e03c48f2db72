package org.rungtone.script.eval;

import java.util.Arrays;
import java.util.List;
import org.rungtone.script.ast.Pos;

/** {@code part repeat N}: the part plays N times back to back; its length is N times the part's length. */
final class RepeatPart extends Eval {
    private final Eval child;
    private final Frame parent;
    private final Frame frame;
    private final double partLength;
    private final long count;
    private final double[] out = new double[Block.SIZE];
    private final boolean[] active = new boolean[Block.SIZE];

    /** {@code frame} is a child frame of {@code parent} with the part's length; the child was compiled in it. */
    RepeatPart(Pos pos, Eval child, Frame parent, Frame frame, double partLength, long count) {
        super(pos, "repeat");
        this.child = child;
        this.parent = parent;
        this.frame = frame;
        this.partLength = partLength;
        this.count = count;
        this.lengthSeconds = partLength * count;
    }

    @Override
    double[] compute(Block b) {
        double[] t = parent.t;
        double[] local = frame.t;
        int n = b.length;
        boolean any = false;
        for (int i = 0; i < n; i++) {
            double ti = t[i];
            double k = Math.floor(ti / partLength);
            if (ti < 0) {
                local[i] = ti;
                active[i] = false;
            } else if (k >= count) {
                local[i] = ti - (count - 1) * partLength;
                active[i] = false;
            } else {
                local[i] = Math.max(0.0, ti - k * partLength);
                active[i] = local[i] < partLength;
            }
            any |= active[i];
        }
        if (!any) {
            Arrays.fill(out, 0, n, 0.0);
            return out;
        }
        frame.checkMonotonic(parent.monotonic, n);
        double[] c = child.run(b);
        for (int i = 0; i < n; i++) {
            out[i] = active[i] ? c[i] : 0;
        }
        return out;
    }

    @Override
    List<Eval> inputs() {
        return List.of(child);
    }
}
