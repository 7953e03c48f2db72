package org.rungtone.script.eval;

import java.util.Arrays;
import java.util.List;
import org.rungtone.script.ast.Pos;

/**
 * {@code part at T}: the part starts T seconds into its parent (its local time is t − T), silent before.
 * Its length is T plus the part's own length, when it has one.
 */
final class AtPart extends Eval {
    private final Eval child;
    private final Frame parent;
    private final Frame frame;
    private final double start;
    private final double[] out = new double[Block.SIZE];

    /** {@code frame} is a shifted frame of {@code parent}; the child was compiled in it. */
    AtPart(Pos pos, Eval child, Frame parent, Frame frame, double start) {
        super(pos, "at");
        this.child = child;
        this.parent = parent;
        this.frame = frame;
        this.start = start;
        this.lengthSeconds = start + child.lengthSeconds;
    }

    @Override
    double[] compute(Block b) {
        double[] t = parent.t;
        double[] local = frame.t;
        int n = b.length;
        boolean any = false;
        for (int i = 0; i < n; i++) {
            local[i] = t[i] - start;
            any |= local[i] >= 0;
        }
        if (!any) {
            Arrays.fill(out, 0, n, 0.0);
            return out;
        }
        for (int i = 0; i < n; i++) {
            frame.span[i] = parent.span[i] - start;
        }
        frame.monotonic = parent.monotonic;
        double[] c = child.run(b);
        for (int i = 0; i < n; i++) {
            out[i] = local[i] >= 0 ? c[i] : 0;
        }
        return out;
    }

    @Override
    List<Eval> inputs() {
        return List.of(child);
    }
}
