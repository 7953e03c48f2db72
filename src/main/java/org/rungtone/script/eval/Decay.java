package org.rungtone.script.eval;

import java.util.List;
import org.rungtone.script.ast.Pos;

/** Exponential decay from 1 with time constant τ, as an RC discharge: e^(−t/τ) for t ≥ 0, 0 before. */
final class Decay extends Eval {
    private final Eval tau;
    private final Frame frame;
    private final double[] out = new double[Block.SIZE];

    Decay(Pos pos, Eval tau, Frame frame) {
        super(pos, "decay");
        this.tau = tau;
        this.frame = frame;
    }

    @Override
    double[] compute(Block b) {
        double[] k = tau.run(b);
        double[] t = frame.t;
        for (int i = 0; i < b.length; i++) {
            out[i] = t[i] < 0 ? 0 : Math.exp(-t[i] / k[i]);
        }
        return out;
    }

    @Override
    List<Eval> inputs() {
        return List.of(tau);
    }
}
