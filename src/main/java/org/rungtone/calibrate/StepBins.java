package org.rungtone.calibrate;

/**
 * A recording reduced to the means of short runs of samples inside the sweep's steps (package-private): each
 * step's samples, less a guard of {@value #GUARD_SECONDS} s (at least {@value #GUARD_SAMPLES} samples) on
 * both sides of each edge where the input's anti-alias filter rings, are cut into bins of {@link #width}
 * samples, about {@value #BIN_SECONDS} s (the few samples left over at a step's end are not used). Every
 * model term is averaged over a bin exactly (a geometric sum for the exponential, the Dirichlet kernel for
 * the sinusoids), so the bins lose only what varies within a millisecond, and the fits run on some 1000
 * numbers a second instead of the sample rate. Steps are grouped in segments of about
 * {@value #SEGMENT_SECONDS} s, over which hum is taken as steady.
 */
final class StepBins {
    static final double GUARD_SECONDS = 0.001;
    static final int GUARD_SAMPLES = 24;
    static final double BIN_SECONDS = 0.001;
    static final double SEGMENT_SECONDS = 1.0;

    final int steps;
    /** Edge k (k = 0..steps): the sample where step k begins; the last is where the last step ends. */
    final double[] edge;
    /** Bins of step k: {@code binFrom[k] .. binFrom[k + 1] - 1}, consecutive, {@link #width} samples apart. */
    final int[] binFrom;
    final int[] firstSample;
    /** Samples per bin. */
    final int width;
    final double[] mean;
    /** Segment of each step, 0-based, rising. */
    final int[] segment;
    final int segments;
    final double rateHz;

    private StepBins(double[] edge, int[] binFrom, int[] firstSample, int width, double[] mean, int[] segment,
            double rateHz) {
        this.steps = edge.length - 1;
        this.edge = edge;
        this.binFrom = binFrom;
        this.firstSample = firstSample;
        this.width = width;
        this.mean = mean;
        this.segment = segment;
        this.segments = steps == 0 ? 0 : segment[steps - 1] + 1;
        this.rateHz = rateHz;
    }

    /** The bins of every step of {@code sweep} placed by {@code clock} in {@code y}. */
    static StepBins of(double[] y, double rateHz, RecordingSweep sweep, SweepClock clock) {
        long[] ticks = sweep.stepStartTicks();
        int steps = ticks.length - 1;
        double[] edge = new double[steps + 1];
        for (int k = 0; k <= steps; k++) {
            edge[k] = clock.sampleAt(ticks[k]);
        }
        double guard = Math.max(GUARD_SECONDS * rateHz, GUARD_SAMPLES);
        int width = Math.max(1, (int) Math.round(BIN_SECONDS * rateHz));
        int estimate = (int) ((edge[steps] - edge[0]) / width) + steps + 1;
        int[] first = new int[estimate];
        double[] mean = new double[estimate];
        int[] from = new int[steps + 1];
        int[] segment = new int[steps];
        int bins = 0;
        int seg = 0;
        double segStart = edge[0];
        double segmentSamples = SEGMENT_SECONDS * rateHz;
        for (int k = 0; k < steps; k++) {
            if (edge[k] - segStart >= segmentSamples && edge[steps] - edge[k] >= segmentSamples) {
                seg++;
                segStart = edge[k];
            }
            segment[k] = seg;
            from[k] = bins;
            int a = (int) Math.ceil(edge[k] + guard);
            int parts = ((int) Math.floor(edge[k + 1] - guard) - a + 1) / width;
            for (int j = 0; j < parts; j++) {
                int s0 = a + j * width;
                double sum = 0;
                for (int i = s0; i < s0 + width; i++) {
                    sum += y[i];
                }
                first[bins] = s0;
                mean[bins] = sum / width;
                bins++;
            }
        }
        from[steps] = bins;
        return new StepBins(edge, from, java.util.Arrays.copyOf(first, bins), width,
                java.util.Arrays.copyOf(mean, bins), segment, rateHz);
    }

    /** Number of bins. */
    int bins() {
        return mean.length;
    }

    /** The bin's centre, in samples. */
    double centre(int bin) {
        return firstSample[bin] + 0.5 * (width - 1);
    }
}
