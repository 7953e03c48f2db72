package org.rungtone.calibrate;

/**
 * Where the sweep's ticks fall in a recording: tick T of the board is at sample
 * {@code startSample + samplesPerTick·T}. The two patterns give a first estimate; then every pattern edge is
 * timed to a fraction of a sample (where the recording crosses the midpoint of the levels on either side,
 * each a straight line fitted over about a millisecond next to the edge) and a straight line through all of
 * them (least squares) gives the start and the ratio of the two clocks.
 *
 * @param startSample the sample where the first step begins
 * @param samplesPerTick the recording's samples per board tick
 * @param nominalSamplesPerTick what that would be with both clocks exact (rate / 1000)
 * @param edgeRmsSamples the rms distance of the timed edges from the line, samples
 * @param edgesTimed how many edges were timed
 */
public record SweepClock(double startSample, double samplesPerTick, double nominalSamplesPerTick,
        double edgeRmsSamples, int edgesTimed) {
    /** How far from where the patterns were found the first pass looks for each edge. */
    static final double FIRST_REACH_SECONDS = 0.0012;

    /** The clocks' mismatch in parts per million: positive when a board tick spans more recorded samples. */
    public double mismatchPpm() {
        return (samplesPerTick / nominalSamplesPerTick - 1) * 1e6;
    }

    /** The sample at board tick {@code tick}. */
    public double sampleAt(double tick) {
        return startSample + samplesPerTick * tick;
    }

    /**
     * Times the edges of both patterns around a first estimate, twice: first within
     * {@value #FIRST_REACH_SECONDS} s of where the patterns were found (a find is only as sharp as the jump
     * windows of {@link PatternSearch}, whose plateau spans {@link PatternSearch#GAP_SECONDS} either side of an
     * edge, and the clocks drift across a pattern), then within 0.6 ms of the line through those times.
     *
     * @param y the recording
     * @param rateHz its rate
     * @param sweep the sweep recorded
     * @param startSample the start pattern's first sample, as found
     * @param endPatternSample the end pattern's first sample, as found
     */
    static SweepClock measure(double[] y, double rateHz, RecordingSweep sweep, double startSample,
            double endPatternSample) {
        long[] ticks = sweep.stepStartTicks();
        double perTick = (endPatternSample - startSample) / ticks[sweep.endPatternStart()];
        int near = Math.max(2, (int) Math.round(0.0003 * rateHz));
        int wide = Math.max(2 * near, (int) Math.round(FIRST_REACH_SECONDS * rateHz));
        SweepClock first = line(y, rateHz, sweep, startSample, perTick, wide);
        return first.edgesTimed() < 4 ? first : line(y, rateHz, sweep, first.startSample(),
                first.samplesPerTick(), 2 * near);
    }

    /** The line through the pattern edges found within {@code reach} samples of {@code start + perTick·T}. */
    private static SweepClock line(double[] y, double rateHz, RecordingSweep sweep, double start, double perTick,
            int reach) {
        long[] ticks = sweep.stepStartTicks();
        int endStart = sweep.endPatternStart();
        double nominal = rateHz / 1000;
        int span = Math.max(4, (int) Math.round(0.001 * rateHz));
        double sx = 0;
        double sy = 0;
        double sxx = 0;
        double sxy = 0;
        int n = 0;
        double[] xs = new double[2 * sweep.patternSteps()];
        double[] ts = new double[xs.length];
        for (int pass = 0; pass < 2; pass++) {
            int[] edges = RecordingSweep.edgeTemplate(pass == 0);
            int first = pass == 0 ? 0 : endStart;
            for (int j = 1; j < edges.length; j++) {
                if (edges[j] == 0) {
                    continue;
                }
                double t = ticks[first + j];
                double x = crossing(y, start + perTick * t, reach, span);
                if (!Double.isNaN(x)) {
                    xs[n] = x;
                    ts[n] = t;
                    sx += t;
                    sy += x;
                    sxx += t * t;
                    sxy += t * x;
                    n++;
                }
            }
        }
        if (n < 4) {
            return new SweepClock(start, perTick, nominal, Double.NaN, n);
        }
        double slope = (n * sxy - sx * sy) / (n * sxx - sx * sx);
        double intercept = (sy - slope * sx) / n;
        double ss = 0;
        for (int i = 0; i < n; i++) {
            double e = xs[i] - intercept - slope * ts[i];
            ss += e * e;
        }
        return new SweepClock(intercept, slope, nominal, Math.sqrt(ss / n), n);
    }

    /**
     * Where the recording crosses the midpoint between the levels before and after an edge expected near
     * {@code p}: lines fitted over {@code span} samples ending {@code reach} samples before p and starting
     * {@code reach} after it; NaN when no crossing is found within {@code reach} of p.
     */
    private static double crossing(double[] y, double p, int reach, int span) {
        int c = (int) Math.round(p);
        int lo = c - reach - span;
        int hi = c + reach + span;
        if (lo < 0 || hi >= y.length) {
            return Double.NaN;
        }
        Line before = Line.fit(y, c - reach - span, c - reach, c);
        Line after = Line.fit(y, c + reach, c + reach + span, c);
        double rise = after.value() - before.value();
        if (rise == 0) {
            return Double.NaN;
        }
        for (int i = c - reach; i < c + reach; i++) {
            double mid0 = 0.5 * (before.at(i - c) + after.at(i - c));
            double mid1 = 0.5 * (before.at(i + 1 - c) + after.at(i + 1 - c));
            double d0 = (y[i] - mid0) * Math.signum(rise);
            double d1 = (y[i + 1] - mid1) * Math.signum(rise);
            if (d0 < 0 && d1 >= 0) {
                return i + d0 / (d0 - d1);
            }
        }
        return Double.NaN;
    }

    /** A straight line: its value at a reference sample and its slope per sample. */
    private record Line(double value, double slope) {
        double at(double offset) {
            return value + slope * offset;
        }

        /** The least-squares line over samples [from, to), its value taken at sample {@code at}. */
        static Line fit(double[] y, int from, int to, int at) {
            return SweepClock.line(y, from, to, at);
        }
    }

    private static Line line(double[] y, int from, int to, int at) {
        int n = to - from;
        double mt = 0.5 * (from + to - 1);
        double my = 0;
        for (int i = from; i < to; i++) {
            my += y[i];
        }
        my /= n;
        double stt = 0;
        double sty = 0;
        for (int i = from; i < to; i++) {
            stt += (i - mt) * (i - mt);
            sty += (i - mt) * (y[i] - my);
        }
        double slope = stt > 0 ? sty / stt : 0;
        return new Line(my + slope * (at - mt), slope);
    }
}
