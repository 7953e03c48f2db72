package org.rungtone.script.eval;

import java.util.List;
import org.rungtone.script.ast.Pos;

/**
 * Linear fade in from the start of the part and fade out to its end: gain = min(1, t/in, (dur − t)/out),
 * never below 0. A fade time of 0 means no fade on that side.
 */
final class Fade extends Eval {
    private final Eval input;
    private final Eval fadeIn;
    private final Eval fadeOut;
    private final Frame frame;
    private final double[] out = new double[Block.SIZE];

    Fade(Pos pos, Eval input, Eval fadeIn, Eval fadeOut, Frame frame) {
        super(pos, "fade");
        this.input = input;
        this.fadeIn = fadeIn;
        this.fadeOut = fadeOut;
        this.frame = frame;
    }

    @Override
    double[] compute(Block b) {
        double[] x = input.run(b);
        double[] fi = fadeIn.run(b);
        double[] fo = fadeOut.run(b);
        double[] t = frame.t;
        double[] span = frame.span;
        for (int i = 0; i < b.length; i++) {
            double g = 1;
            if (fi[i] > 0) {
                g = Math.min(g, t[i] / fi[i]);
            }
            if (fo[i] > 0) {
                g = Math.min(g, (span[i] - t[i]) / fo[i]);
            }
            out[i] = x[i] * Math.max(0, g);
        }
        return out;
    }

    @Override
    List<Eval> inputs() {
        return List.of(input, fadeIn, fadeOut);
    }
}
