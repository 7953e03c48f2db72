package org.rungtone.calibrate;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.BitSet;
import java.util.Collection;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.SortedSet;
import java.util.TreeMap;
import java.util.TreeSet;
import org.rungtone.internal.Checks;

/**
 * The readings of one board: every reading as taken, the codes listed without a reading, and per-code means
 * with their spread. Repeated readings of a code are averaged; their pooled standard deviation
 * {@code sqrt(Σ(n_k − 1)·s_k² / Σ(n_k − 1))} estimates the meter's and board's noise.
 */
public final class Measurements {
    private final int bits;
    private final String source;
    private final List<Reading> readings;
    private final SortedSet<Integer> unmeasured;
    private final List<CodeMean> means;
    private final BitSet measured;

    private Measurements(int bits, String source, List<Reading> readings, SortedSet<Integer> unmeasured) {
        this.bits = bits;
        this.source = source;
        this.readings = List.copyOf(readings);
        this.means = Collections.unmodifiableList(reduce(this.readings));
        this.measured = new BitSet(1 << bits);
        for (CodeMean m : means) {
            measured.set(m.code());
        }
        TreeSet<Integer> left = new TreeSet<>(unmeasured);
        for (CodeMean m : means) {
            left.remove(m.code());
        }
        this.unmeasured = Collections.unmodifiableSortedSet(left);
    }

    /**
     * Readings of an N-bit board.
     *
     * @param unmeasured codes listed (in a plan) but not read; codes that do have a reading are dropped
     * @param source where the readings came from, for reports ("readings.csv")
     * @throws IllegalArgumentException when a code is out of range or a reading is not finite
     */
    public static Measurements of(int bits, List<Reading> readings, Collection<Integer> unmeasured,
            String source) {
        Checks.checkBits(bits);
        int n = 1 << bits;
        for (Reading r : readings) {
            Checks.checkArgument(r.code() >= 0 && r.code() < n, "code %d is outside 0..%d", r.code(), n - 1);
            Checks.checkArgument(Double.isFinite(r.volts()), "reading of code %d is not finite", r.code());
        }
        for (int c : unmeasured) {
            Checks.checkArgument(c >= 0 && c < n, "code %d is outside 0..%d", c, n - 1);
        }
        return new Measurements(bits, source, readings, new TreeSet<>(unmeasured));
    }

    private static List<CodeMean> reduce(List<Reading> readings) {
        Map<Integer, List<Reading>> byCode = new TreeMap<>();
        for (Reading r : readings) {
            byCode.computeIfAbsent(r.code(), k -> new ArrayList<>()).add(r);
        }
        List<CodeMean> out = new ArrayList<>();
        for (Map.Entry<Integer, List<Reading>> e : byCode.entrySet()) {
            List<Reading> list = e.getValue();
            double sum = 0;
            double lo = Double.POSITIVE_INFINITY;
            double hi = Double.NEGATIVE_INFINITY;
            for (Reading r : list) {
                sum += r.volts();
                lo = Math.min(lo, r.volts());
                hi = Math.max(hi, r.volts());
            }
            double mean = sum / list.size();
            double ss = 0;
            for (Reading r : list) {
                ss += (r.volts() - mean) * (r.volts() - mean);
            }
            double std = list.size() > 1 ? Math.sqrt(ss / (list.size() - 1)) : 0;
            out.add(new CodeMean(e.getKey(), mean, list.size(), std, hi - lo, list.get(0).line()));
        }
        return out;
    }

    /** Bit depth N. */
    public int bits() {
        return bits;
    }

    /** Where the readings came from. */
    public String source() {
        return source;
    }

    /** Every reading in file order. */
    public List<Reading> readings() {
        return readings;
    }

    /** One entry per measured code, ascending by code. */
    public List<CodeMean> means() {
        return means;
    }

    /** Codes that were listed but have no reading. */
    public SortedSet<Integer> unmeasured() {
        return unmeasured;
    }

    /** True when every code 0 .. 2^N − 1 has at least one reading. */
    public boolean everyCode() {
        return means.size() == 1 << bits;
    }

    /** True when {@code code} has a reading. */
    public boolean has(int code) {
        return code >= 0 && code < 1 << bits && measured.get(code);
    }

    /**
     * The meter resolution the readings were written with: the median over readings of the step of their
     * last digit; 0 when no reading says (computed values).
     */
    public double resolutionVolts() {
        double[] steps = readings.stream().mapToDouble(Reading::stepVolts).filter(s -> s > 0).toArray();
        if (steps.length == 0) {
            return 0;
        }
        Arrays.sort(steps);
        return steps[steps.length / 2];
    }

    /** The pooled standard deviation of repeated readings, volts; 0 when no code was read twice. */
    public double repeatSpreadVolts() {
        double ss = 0;
        int dof = 0;
        for (CodeMean m : means) {
            if (m.count() > 1) {
                ss += (m.count() - 1) * m.stdVolts() * m.stdVolts();
                dof += m.count() - 1;
            }
        }
        return dof == 0 ? 0 : Math.sqrt(ss / dof);
    }

    /** Codes read more than once. */
    public int repeatedCodes() {
        int n = 0;
        for (CodeMean m : means) {
            if (m.count() > 1) {
                n++;
            }
        }
        return n;
    }
}
