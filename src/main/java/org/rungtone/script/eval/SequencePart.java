package org.rungtone.script.eval;

import java.util.Arrays;
import java.util.List;
import org.rungtone.script.ast.Pos;

/** {@code sequence(a, b, ...)}: parts one after another, each for its own length; the length is their sum. */
final class SequencePart extends Eval {
    private final List<Eval> parts;
    private final List<Frame> frames;
    private final double[] starts;
    private final double[] lengths;
    private final Frame parent;
    private final double[] out = new double[Block.SIZE];
    private Block lastBlock;

    /** Part k was compiled in {@code frames.get(k)}, a child frame of {@code parent} with its length. */
    SequencePart(Pos pos, List<Eval> parts, List<Frame> frames, double[] lengths, Frame parent) {
        super(pos, "sequence");
        this.parts = List.copyOf(parts);
        this.frames = List.copyOf(frames);
        this.lengths = lengths.clone();
        this.starts = new double[lengths.length];
        double total = 0;
        for (int k = 0; k < lengths.length; k++) {
            starts[k] = total;
            total += lengths[k];
        }
        this.parent = parent;
        this.lengthSeconds = total;
    }

    @Override
    double[] compute(Block b) {
        lastBlock = b;
        double[] t = parent.t;
        int n = b.length;
        Arrays.fill(out, 0, n, 0.0);
        for (int k = 0; k < parts.size(); k++) {
            Frame f = frames.get(k);
            boolean any = false;
            for (int i = 0; i < n; i++) {
                f.t[i] = t[i] - starts[k];
                any |= f.t[i] >= 0 && f.t[i] < lengths[k];
            }
            if (any) {
                f.monotonic = parent.monotonic;
                double[] c = parts.get(k).run(b);
                for (int i = 0; i < n; i++) {
                    if (f.t[i] >= 0 && f.t[i] < lengths[k]) {
                        out[i] += c[i];
                    }
                }
            }
        }
        return out;
    }

    /** Only the part playing at sample {@code i} can explain a non-finite output there. */
    @Override
    List<Eval> culprits(int i) {
        for (int k = 0; k < parts.size(); k++) {
            double local = frames.get(k).t[i];
            if (parts.get(k).ranIn(lastBlock) && local >= 0 && local < lengths[k]) {
                return List.of(parts.get(k));
            }
        }
        return List.of();
    }

    @Override
    List<Eval> inputs() {
        return parts;
    }
}
