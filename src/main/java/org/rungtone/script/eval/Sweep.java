package org.rungtone.script.eval;

import java.util.List;
import org.rungtone.script.ast.Pos;

/**
 * A frequency that moves from {@code from} to {@code to} over {@code time} seconds of local time and holds
 * there: linear, f(t) = f₀ + (f₁ − f₀)·t/T, or exponential ("logarithmic sweep"),
 * f(t) = f₀·(f₁/f₀)^(t/T), which spends equal time in every octave. Feed it to an oscillator, which
 * integrates it into a phase.
 */
final class Sweep extends Eval {
    private final boolean exponential;
    private final Eval from;
    private final Eval to;
    private final Eval time;
    private final Frame frame;
    private final double[] out = new double[Block.SIZE];

    Sweep(Pos pos, String label, boolean exponential, Eval from, Eval to, Eval time, Frame frame) {
        super(pos, label);
        this.exponential = exponential;
        this.from = from;
        this.to = to;
        this.time = time;
        this.frame = frame;
    }

    @Override
    double[] compute(Block b) {
        double[] f0 = from.run(b);
        double[] f1 = to.run(b);
        double[] T = time.run(b);
        double[] t = frame.t;
        for (int i = 0; i < b.length; i++) {
            double x = T[i] > 0 ? Math.min(1.0, Math.max(0.0, t[i] / T[i])) : (t[i] >= 0 ? 1 : 0);
            out[i] = exponential ? f0[i] * Math.pow(f1[i] / f0[i], x) : f0[i] + (f1[i] - f0[i]) * x;
        }
        return out;
    }

    @Override
    List<Eval> inputs() {
        return List.of(from, to, time);
    }
}
