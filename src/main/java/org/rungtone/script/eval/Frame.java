package org.rungtone.script.eval;

import java.util.Arrays;

/**
 * The time frame a node is evaluated in: the clip itself, or a part placed by {@code for}, {@code at},
 * {@code every}, {@code repeat}, {@code sequence} or {@code notes}. Holds, for the current block, the local
 * time {@code t} (seconds since the part started), {@code dur} (the length of the part) and, inside a note
 * list's voice, {@code pitch}. The owner of a frame fills these arrays before evaluating the nodes in it.
 */
final class Frame {
    final double[] t;
    final double[] span;
    final double[] pitch;
    final Frame root;
    /** Root frame only: the global sample index and, in a wavetable, the phase 0..1. */
    final double[] index;
    final double[] phase;
    /** Root frame only: whether any node reads the sample index, so it must be filled. */
    boolean indexUsed;
    /** True when {@code t} never decreases within the current block (no part restarted inside it). */
    boolean monotonic = true;
    /** The part's length when it is the same for every sample and known while compiling, else NaN. */
    final double fixedSpan;

    private Frame(double[] t, double[] span, double[] pitch, Frame root, double[] index, double[] phase,
            double fixedSpan) {
        this.fixedSpan = fixedSpan;
        this.t = t;
        this.span = span;
        this.pitch = pitch;
        this.root = root == null ? this : root;
        this.index = index;
        this.phase = phase;
    }

    /** The frame of the whole clip or wavetable; {@code spanSeconds} is its length. */
    static Frame root(double spanSeconds, boolean wavetable) {
        double[] span = new double[Block.SIZE];
        Arrays.fill(span, spanSeconds);
        return new Frame(new double[Block.SIZE], span, null, null, new double[Block.SIZE],
                wavetable ? new double[Block.SIZE] : null, spanSeconds);
    }

    /** A part with its own clock and a fixed length. */
    static Frame child(Frame parent, double lengthSeconds) {
        double[] span = new double[Block.SIZE];
        Arrays.fill(span, lengthSeconds);
        return new Frame(new double[Block.SIZE], span, parent.pitch, parent.root, null, null, lengthSeconds);
    }

    /**
     * A part with its own clock starting {@code offset} seconds into the parent, its length filled by the
     * owner; with a NaN offset the length is not known while compiling.
     */
    static Frame shifted(Frame parent, double offset) {
        return new Frame(new double[Block.SIZE], new double[Block.SIZE], parent.pitch, parent.root, null, null,
                parent.fixedSpan - offset);
    }

    /** A part sharing the parent's clock but with its own fixed length. */
    static Frame sameClock(Frame parent, double lengthSeconds) {
        double[] span = new double[Block.SIZE];
        Arrays.fill(span, lengthSeconds);
        return new Frame(parent.t, span, parent.pitch, parent.root, null, null, lengthSeconds);
    }

    /** The voice frame of a note list: own clock, length and pitch, all filled by the owner. */
    static Frame voice(Frame parent) {
        return new Frame(new double[Block.SIZE], new double[Block.SIZE], new double[Block.SIZE], parent.root,
                null, null, Double.NaN);
    }

    /** Sets {@link #monotonic} from the first {@code n} local times, given the parent's flag. */
    void checkMonotonic(boolean parentMonotonic, int n) {
        boolean ok = parentMonotonic;
        for (int i = 1; i < n && ok; i++) {
            ok = t[i] >= t[i - 1];
        }
        monotonic = ok;
    }
}
