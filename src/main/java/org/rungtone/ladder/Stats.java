package org.rungtone.ladder;

import java.util.Arrays;
import org.rungtone.internal.Checks;

/**
 * Summary of a sample of values: mean, standard deviation and order statistics. Percentiles use the
 * nearest-rank definition (the smallest value with at least p of the sample at or below it).
 *
 * @param mean arithmetic mean
 * @param stdDev sample standard deviation (n − 1); 0 for one value
 * @param min smallest value
 * @param p01 1st percentile
 * @param p10 10th percentile
 * @param p50 median
 * @param p90 90th percentile
 * @param p99 99th percentile
 * @param max largest value
 */
public record Stats(double mean, double stdDev, double min, double p01, double p10, double p50, double p90,
        double p99, double max) {
    /**
     * Summarises {@code values}.
     *
     * @throws IllegalArgumentException when empty
     */
    public static Stats of(double[] values) {
        Checks.checkArgument(values.length > 0, "need at least one value");
        double[] s = values.clone();
        Arrays.sort(s);
        double sum = 0;
        for (double v : s) {
            sum += v;
        }
        double mean = sum / s.length;
        double ss = 0;
        for (double v : s) {
            ss += (v - mean) * (v - mean);
        }
        double sd = s.length > 1 ? Math.sqrt(ss / (s.length - 1)) : 0;
        return new Stats(mean, sd, s[0], rank(s, 0.01), rank(s, 0.10), rank(s, 0.50), rank(s, 0.90), rank(s, 0.99),
                s[s.length - 1]);
    }

    private static double rank(double[] sorted, double p) {
        int i = (int) Math.ceil(p * sorted.length) - 1;
        return sorted[Math.max(0, Math.min(sorted.length - 1, i))];
    }
}
