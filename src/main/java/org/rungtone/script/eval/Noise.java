package org.rungtone.script.eval;

import java.util.List;
import org.rungtone.script.ast.Pos;

/**
 * Seeded noise: white uniform on [−a, a] (variance a²/3), white Gaussian with standard deviation σ (Box–Muller:
 * G. E. P. Box, M. E. Muller, Ann. Math. Statist. 29(2), 1958) and pink noise ({@link PinkFilter} applied to
 * unit Gaussian noise, then scaled to the requested rms). Each noise node draws from its own stream of the
 * render seed, so the same script and seed give identical samples.
 */
final class Noise extends Eval {
    /** Noise colours. */
    enum Kind { WHITE, GAUSS, PINK }

    private final Kind kind;
    private final Eval level;
    private final SplitMix64 random;
    private final PinkFilter pink;
    private final double[] out = new double[Block.SIZE];
    private boolean haveSpare;
    private double spare;

    Noise(Pos pos, String label, Kind kind, Eval level, SplitMix64 random, double rateHz) {
        super(pos, label);
        this.kind = kind;
        this.level = level;
        this.random = random;
        this.pink = kind == Kind.PINK ? PinkFilter.design(rateHz) : null;
    }

    @Override
    double[] compute(Block b) {
        double[] a = level.run(b);
        int n = b.length;
        switch (kind) {
            case WHITE:
                for (int i = 0; i < n; i++) {
                    out[i] = a[i] * (2 * random.nextDouble() - 1);
                }
                break;
            case GAUSS:
                for (int i = 0; i < n; i++) {
                    out[i] = a[i] * gaussian();
                }
                break;
            default:
                for (int i = 0; i < n; i++) {
                    out[i] = a[i] * pink.next(gaussian());
                }
        }
        return out;
    }

    private double gaussian() {
        if (haveSpare) {
            haveSpare = false;
            return spare;
        }
        double u = 1 - random.nextDouble();
        double v = random.nextDouble();
        double r = Math.sqrt(-2 * Math.log(u));
        spare = r * Math.sin(2 * Math.PI * v);
        haveSpare = true;
        return r * Math.cos(2 * Math.PI * v);
    }

    @Override
    List<Eval> inputs() {
        return List.of(level);
    }
}
