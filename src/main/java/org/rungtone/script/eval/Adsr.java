package org.rungtone.script.eval;

import java.util.Arrays;
import java.util.List;
import org.rungtone.script.ast.Pos;

/**
 * Attack–decay–sustain–release envelope on the part's local time, with straight-line segments: 0 → 1 over
 * the attack, 1 → sustain over the decay, sustain until the note-off time, then from the level reached at
 * note-off down to 0 over the release. A note-off before the end of the decay releases from where it is.
 */
final class Adsr extends Eval {
    private final Eval attack;
    private final Eval decay;
    private final Eval sustain;
    private final Eval release;
    private final Eval off;
    private final Frame frame;
    private final double[] out = new double[Block.SIZE];

    Adsr(Pos pos, Eval attack, Eval decay, Eval sustain, Eval release, Eval off, Frame frame) {
        super(pos, "adsr");
        this.attack = attack;
        this.decay = decay;
        this.sustain = sustain;
        this.release = release;
        this.off = off;
        this.frame = frame;
    }

    @Override
    double[] compute(Block b) {
        double[] a = attack.run(b);
        double[] d = decay.run(b);
        double[] s = sustain.run(b);
        double[] r = release.run(b);
        double[] o = off.run(b);
        double[] t = frame.t;
        if (attack.isConstant() && decay.isConstant() && sustain.isConstant() && release.isConstant()
                && off.isConstant()) {
            steady(t, b.length, a[0], d[0], s[0], r[0], o[0]);
            return out;
        }
        for (int i = 0; i < b.length; i++) {
            double ti = t[i];
            if (ti < o[i]) {
                out[i] = held(ti, a[i], d[i], s[i]);
            } else {
                double x = r[i] > 0 ? 1 - (ti - o[i]) / r[i] : 0;
                out[i] = x > 0 ? x * held(o[i], a[i], d[i], s[i]) : 0;
            }
        }
        return out;
    }

    private void steady(double[] t, int n, double a, double d, double s, double r, double o) {
        double atOff = held(o, a, d, s);
        if (frame.monotonic && t[0] >= a + d && t[n - 1] < o) {
            Arrays.fill(out, 0, n, s);      // the whole block sustains
            return;
        }
        if (frame.monotonic && t[0] >= o + Math.max(r, 0)) {
            Arrays.fill(out, 0, n, 0.0);    // the whole block is after the release
            return;
        }
        for (int i = 0; i < n; i++) {
            double ti = t[i];
            if (ti < o) {
                out[i] = held(ti, a, d, s);
            } else {
                double x = r > 0 ? 1 - (ti - o) / r : 0;
                out[i] = x > 0 ? x * atOff : 0;
            }
        }
    }

    /** The level at time {@code t} while the note is held. */
    static double held(double t, double attack, double decay, double sustain) {
        if (t < 0) {
            return 0;
        } else if (t < attack) {
            return t / attack;
        } else if (t < attack + decay) {
            return 1 - (1 - sustain) * (t - attack) / decay;
        }
        return sustain;
    }

    @Override
    List<Eval> inputs() {
        return List.of(attack, decay, sustain, release, off);
    }
}
