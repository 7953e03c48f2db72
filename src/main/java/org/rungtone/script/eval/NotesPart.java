package org.rungtone.script.eval;

import java.util.Arrays;
import java.util.List;
import org.rungtone.script.ast.Pos;

/**
 * {@code notes(voice, length, step, ...)}: plays the voice once per step, one after another. In the voice,
 * {@code t} restarts at every step, {@code pitch} is the step's frequency and {@code dur} its length. Rests
 * are silent. The length is the sum of the steps.
 */
final class NotesPart extends Eval {
    private final Eval voice;
    private final Frame parent;
    private final Frame frame;
    private final double[] starts;
    private final double[] lengths;
    private final double[] pitches;
    private final boolean[] rests;
    private final double[] out = new double[Block.SIZE];
    private final boolean[] active = new boolean[Block.SIZE];
    private int cursor;

    /**
     * {@code frame} is a voice frame of {@code parent}, in which the voice was compiled; a rest's pitch is
     * {@code NaN} in {@code pitches}.
     */
    NotesPart(Pos pos, Eval voice, Frame parent, Frame frame, double[] lengths, double[] pitches) {
        super(pos, "notes");
        this.voice = voice;
        this.parent = parent;
        this.frame = frame;
        this.lengths = lengths.clone();
        this.starts = new double[lengths.length];
        this.rests = new boolean[lengths.length];
        this.pitches = new double[lengths.length];
        double total = 0;
        for (int k = 0; k < lengths.length; k++) {
            starts[k] = total;
            total += lengths[k];
            rests[k] = Double.isNaN(pitches[k]);
            this.pitches[k] = rests[k] ? nearestPitch(pitches, k) : pitches[k];
        }
        this.lengthSeconds = total;
    }

    /** A rest keeps the pitch of the note before it (or after it, at the start) so the voice stays finite. */
    private static double nearestPitch(double[] pitches, int k) {
        for (int j = k - 1; j >= 0; j--) {
            if (!Double.isNaN(pitches[j])) {
                return pitches[j];
            }
        }
        for (int j = k + 1; j < pitches.length; j++) {
            if (!Double.isNaN(pitches[j])) {
                return pitches[j];
            }
        }
        return 0;
    }

    @Override
    double[] compute(Block b) {
        double[] t = parent.t;
        int n = b.length;
        int last = starts.length - 1;
        boolean any = false;
        for (int i = 0; i < n; i++) {
            double ti = t[i];
            if (cursor > 0 && ti < starts[cursor]) {
                cursor = 0;
            }
            while (cursor < last && ti >= starts[cursor + 1]) {
                cursor++;
            }
            double local = ti - starts[cursor];
            frame.t[i] = local;
            frame.pitch[i] = pitches[cursor];
            frame.span[i] = lengths[cursor];
            active[i] = local >= 0 && local < lengths[cursor] && !rests[cursor];
            any |= active[i];
        }
        if (!any) {
            Arrays.fill(out, 0, n, 0.0);
            return out;
        }
        frame.checkMonotonic(parent.monotonic, n);
        double[] v = voice.run(b);
        for (int i = 0; i < n; i++) {
            out[i] = active[i] ? v[i] : 0;
        }
        return out;
    }

    @Override
    List<Eval> inputs() {
        return List.of(voice);
    }
}
