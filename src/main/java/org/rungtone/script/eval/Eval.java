package org.rungtone.script.eval;

import java.util.List;
import org.rungtone.script.ast.Pos;

/**
 * A compiled node: computes one block of samples at a time into its own buffer. Each node runs at most once
 * per block (its result is kept for every parent that reads it), so a named value used twice costs once.
 */
abstract class Eval {
    final Pos pos;
    final String label;
    /** The part length this node carries, in seconds; NaN when it has none. */
    double lengthSeconds = Double.NaN;
    private int stamp = Integer.MIN_VALUE;
    private double[] result;

    Eval(Pos pos, String label) {
        this.pos = pos;
        this.label = label;
    }

    /** The samples of block {@code b}, computed on the first request in that block. */
    final double[] run(Block b) {
        if (stamp != b.id) {
            result = compute(b);
            stamp = b.id;
        }
        return result;
    }

    /** Whether this node was evaluated in block {@code b}. */
    final boolean ranIn(Block b) {
        return stamp == b.id;
    }

    /** The result of the latest block this node ran in. */
    final double[] lastResult() {
        return result;
    }

    /** Computes block {@code b}; returns its own buffer or one it may hand over without copying. */
    abstract double[] compute(Block b);

    /** The nodes this one reads. */
    abstract List<Eval> inputs();

    /** The inputs that can explain a non-finite result at sample {@code i} of the latest block. */
    List<Eval> culprits(int i) {
        return inputs();
    }

    /** True for a node whose every sample is a function of its inputs' samples at the same index alone. */
    boolean pure() {
        return false;
    }

    /** True for a constant. */
    boolean isConstant() {
        return false;
    }
}
