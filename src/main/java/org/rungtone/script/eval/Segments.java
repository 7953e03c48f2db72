package org.rungtone.script.eval;

import java.util.List;
import org.rungtone.script.ast.Pos;

/**
 * A level that runs in straight lines through (time, level) points on the part's local time: the first level
 * before the first point, the last level after the last one. Equal times make a step.
 */
final class Segments extends Eval {
    private final double[] times;
    private final double[] levels;
    private final Frame frame;
    private final double[] out = new double[Block.SIZE];
    private int cursor;

    Segments(Pos pos, double[] times, double[] levels, Frame frame) {
        super(pos, "segments");
        this.times = times.clone();
        this.levels = levels.clone();
        this.frame = frame;
    }

    @Override
    double[] compute(Block b) {
        double[] t = frame.t;
        int last = times.length - 1;
        for (int i = 0; i < b.length; i++) {
            double ti = t[i];
            if (cursor > 0 && ti < times[cursor]) {
                cursor = 0;
            }
            while (cursor < last && ti >= times[cursor + 1]) {
                cursor++;
            }
            if (ti < times[0]) {
                out[i] = levels[0];
            } else if (cursor == last) {
                out[i] = levels[last];
            } else {
                double span = times[cursor + 1] - times[cursor];
                double x = span > 0 ? (ti - times[cursor]) / span : 1;
                out[i] = levels[cursor] + (levels[cursor + 1] - levels[cursor]) * x;
            }
        }
        return out;
    }

    @Override
    List<Eval> inputs() {
        return List.of();
    }
}
