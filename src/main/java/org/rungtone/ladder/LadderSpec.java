package org.rungtone.ladder;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import org.tomlj.TomlTable;

/**
 * An immutable, validated description of a resistor-ladder DAC: topology, bit depth, resistor values,
 * preferred-value series, tolerance, logic levels and pin output resistances, load and buffer. One
 * description serves every command and the project file's {@code [ladder]} table ({@link #fromToml}).
 *
 * <p>Values not given are derived: a weighted ladder gets {@code R_i = base_r · 2^(N−1−i)} (bit 0, the LSB,
 * has the largest resistor); an R-2R ladder gets rungs of {@code base_r}, legs and termination of
 * {@code 2·base_r}. When a series is named, derived values are snapped to its nearest member (what a builder
 * would fit); values the user lists are taken as written. {@link #levels()} solves the nominal network
 * exactly ({@link LevelSolver}); {@link #warnings()} collects what is suspicious but not wrong.
 *
 * <p>Defaults: weighted, 8 bits, base_r 10 kΩ, 5 % parts, 5 V / 0 V logic, pins 25 Ω high and 20 Ω low,
 * no load, unity buffer swinging 0 V to logic high.
 */
public final class LadderSpec {
    /** Bits used when neither bits nor a resistor list is given. */
    public static final int DEFAULT_BITS = 8;
    /** Default base resistance, ohms. */
    public static final double DEFAULT_BASE_R_OHMS = 10e3;

    private final Topology topology;
    private final int bits;
    private final List<Double> resistors;
    private final double baseROhms;
    private final ESeries series;
    private final double tolerance;
    private final double logicHighVolts;
    private final double logicLowVolts;
    private final double pinROhmsHigh;
    private final double pinROhmsLow;
    private final double loadOhms;
    private final double bufferGain;
    private final double outMinVolts;
    private final double outMaxVoltsGiven;

    private final Buffer buffer;
    private final List<Part> parts;
    private final LevelTable levels;
    private final List<String> warnings;

    private LadderSpec(Builder b) {
        topology = b.topology;
        resistors = List.copyOf(b.resistors);
        bits = b.bits != 0 ? b.bits : (resistors.isEmpty() ? DEFAULT_BITS : resistors.size());
        baseROhms = b.baseROhms;
        series = b.series;
        tolerance = b.tolerance;
        logicHighVolts = b.logicHighVolts;
        logicLowVolts = b.logicLowVolts;
        pinROhmsHigh = b.pinROhmsHigh;
        pinROhmsLow = b.pinROhmsLow;
        loadOhms = b.loadOhms;
        bufferGain = b.bufferGain;
        outMinVolts = b.outMinVolts;
        outMaxVoltsGiven = b.outMaxVolts;
        SpecChecks.check(this);
        buffer = new Buffer(bufferGain, outMinVolts, outMaxVolts());
        parts = Collections.unmodifiableList(resolveParts());
        double[] ladderVolts = new double[1 << bits];
        LevelSolver.ladderVolts(this, ohmsOf(parts), ladderVolts, new LevelSolver.Scratch(bits));
        SpecChecks.checkSpan(this, ladderVolts);
        double[] out = new double[ladderVolts.length];
        for (int k = 0; k < out.length; k++) {
            out[k] = buffer.apply(ladderVolts[k]);
        }
        levels = LevelTable.of(bits, out, "modelled " + describe());
        warnings = List.copyOf(SpecChecks.warnings(this, ladderVolts));
    }

    /** A builder with the defaults. */
    public static Builder builder() {
        return new Builder();
    }

    /** A builder holding this description, to change a few settings. */
    public Builder toBuilder() {
        Builder b = new Builder();
        b.topology = topology;
        b.bits = bits;
        b.resistors = new ArrayList<>(resistors);
        b.baseROhms = baseROhms;
        b.series = series;
        b.tolerance = tolerance;
        b.logicHighVolts = logicHighVolts;
        b.logicLowVolts = logicLowVolts;
        b.pinROhmsHigh = pinROhmsHigh;
        b.pinROhmsLow = pinROhmsLow;
        b.loadOhms = loadOhms;
        b.bufferGain = bufferGain;
        b.outMinVolts = outMinVolts;
        b.outMaxVolts = outMaxVoltsGiven;
        return b;
    }

    /**
     * Reads a {@code [ladder]} table. Every error names the file, the line and the key, e.g.
     * {@code "board.toml:7: ladder.resistors: expected 6 values for 6 bits, got 5"}.
     *
     * @param ladderTable the contents of the {@code [ladder]} table
     * @param file the file it came from, for messages
     * @throws org.rungtone.internal.InputError when a key is unknown, a value malformed or the ladder invalid
     */
    public static LadderSpec fromToml(TomlTable ladderTable, Path file) {
        Builder b = LadderFile.read(ladderTable, file);
        try {
            return b.build();
        } catch (LadderSpecError e) {
            throw LadderFile.locate(e, ladderTable, file);
        }
    }

    private List<Part> resolveParts() {
        List<Part> list = new ArrayList<>();
        if (topology.isSumming()) {
            for (int i = 0; i < bits; i++) {
                double r = resistors.isEmpty() ? snap(baseROhms * Math.pow(2, bits - 1 - i)) : resistors.get(i);
                list.add(new Part(Part.Role.LEG, i, r));
            }
            return list;
        }
        // every part's own value when given (legs, rungs, termination), else R and 2R from base_r
        boolean own = !resistors.isEmpty();
        double r = snap(baseROhms);
        double r2 = snap(2 * baseROhms);
        for (int i = 0; i < bits; i++) {
            list.add(new Part(Part.Role.LEG, i, own ? resistors.get(i) : r2));
        }
        for (int i = 0; i + 1 < bits; i++) {
            list.add(new Part(Part.Role.RUNG, i, own ? resistors.get(bits + i) : r));
        }
        list.add(new Part(Part.Role.TERMINATION, 0, own ? resistors.get(2 * bits - 1) : r2));
        return list;
    }

    private double snap(double ohms) {
        return series == null ? ohms : series.nearest(ohms);
    }

    static double[] ohmsOf(List<Part> parts) {
        double[] v = new double[parts.size()];
        for (int i = 0; i < v.length; i++) {
            v[i] = parts.get(i).ohms();
        }
        return v;
    }

    /** The network shape. */
    public Topology topology() {
        return topology;
    }

    /** Bit depth N, 1..16. */
    public int bits() {
        return bits;
    }

    /**
     * The resistors as the user gave them: one per bit, bit 0 first (weighted, custom), or every part in the
     * order of {@link #parts()} (r2r); empty when derived from base_r.
     */
    public List<Double> resistors() {
        return resistors;
    }

    /** The base resistance in ohms: the MSB resistor of a weighted ladder, R of an R-2R ladder. */
    public double baseROhms() {
        return baseROhms;
    }

    /** The preferred-value series to snap and propose values from, if named. */
    public Optional<ESeries> series() {
        return Optional.ofNullable(series);
    }

    /** Resistor tolerance as a fraction (0.05 for 5 %). */
    public double tolerance() {
        return tolerance;
    }

    /** Pin output level for a 1 bit, volts. */
    public double logicHighVolts() {
        return logicHighVolts;
    }

    /** Pin output level for a 0 bit, volts. */
    public double logicLowVolts() {
        return logicLowVolts;
    }

    /** Pin output resistance when driving high, ohms. */
    public double pinROhmsHigh() {
        return pinROhmsHigh;
    }

    /** Pin output resistance when driving low, ohms. */
    public double pinROhmsLow() {
        return pinROhmsLow;
    }

    /** Load resistance from the ladder output to ground, ohms; infinite for none. */
    public double loadOhms() {
        return loadOhms;
    }

    /** The buffer stage, with out_max resolved (it follows logic high unless given). */
    public Buffer buffer() {
        return buffer;
    }

    double bufferGain() {
        return bufferGain;
    }

    double outMinVolts() {
        return outMinVolts;
    }

    /** The buffer's highest output: as given, else logic high. */
    public double outMaxVolts() {
        return Double.isNaN(outMaxVoltsGiven) ? logicHighVolts : outMaxVoltsGiven;
    }

    /** True when the buffer's out_max was given rather than following logic high. */
    public boolean outMaxGiven() {
        return !Double.isNaN(outMaxVoltsGiven);
    }

    /**
     * Every resistor of the network with its nominal value: the legs of bits 0..N−1, then for R-2R the rungs
     * between nodes 0-1 .. (N−2)-(N−1) and the termination.
     */
    public List<Part> parts() {
        return parts;
    }

    /** The nominal resistor values in the order of {@link #parts()}, a copy. */
    public double[] ohms() {
        return ohmsOf(parts);
    }

    /** The exact output level of every code of the nominal network, after the buffer. */
    public LevelTable levels() {
        return levels;
    }

    /**
     * The ideal transfer of this topology with perfect parts and pins, times the buffer gain, unclipped. A
     * summing ladder spans logic low to logic high in 2^N − 1 steps; an R-2R ladder gives
     * {@code V_L + (V_H − V_L)·k/2^N} less the termination's share {@code V_L/2^N} (Horowitz and Hill).
     */
    public LevelTable idealLevels() {
        int n = 1 << bits;
        double[] v = new double[n];
        double swing = logicHighVolts - logicLowVolts;
        for (int k = 0; k < n; k++) {
            double volts = topology.isSumming()
                    ? logicLowVolts + swing * k / (n - 1)
                    : (logicLowVolts * (n - 1) + swing * k) / n;
            v[k] = bufferGain * volts;
        }
        return LevelTable.of(bits, v, "ideal " + topology.key());
    }

    /** Things that are suspicious but not wrong (pins as strong as the resistors, clipping), capped. */
    public List<String> warnings() {
        return warnings;
    }

    /** A short description for reports: "r2r 8-bit, 1% parts". */
    public String describe() {
        return String.format(Locale.ROOT, "%s %d-bit, %s parts", topology.key(), bits,
                SpecChecks.percent(tolerance));
    }

    @Override
    public boolean equals(Object o) {
        if (!(o instanceof LadderSpec)) {
            return false;
        }
        LadderSpec s = (LadderSpec) o;
        return topology == s.topology && bits == s.bits && resistors.equals(s.resistors)
                && Double.compare(baseROhms, s.baseROhms) == 0 && series == s.series
                && Double.compare(tolerance, s.tolerance) == 0
                && Double.compare(logicHighVolts, s.logicHighVolts) == 0
                && Double.compare(logicLowVolts, s.logicLowVolts) == 0
                && Double.compare(pinROhmsHigh, s.pinROhmsHigh) == 0
                && Double.compare(pinROhmsLow, s.pinROhmsLow) == 0
                && Double.compare(loadOhms, s.loadOhms) == 0 && Double.compare(bufferGain, s.bufferGain) == 0
                && Double.compare(outMinVolts, s.outMinVolts) == 0
                && Double.compare(outMaxVoltsGiven, s.outMaxVoltsGiven) == 0;
    }

    @Override
    public int hashCode() {
        return Objects.hash(topology, bits, resistors, baseROhms, series, tolerance, logicHighVolts,
                logicLowVolts, pinROhmsHigh, pinROhmsLow, loadOhms, bufferGain, outMinVolts, outMaxVoltsGiven);
    }

    @Override
    public String toString() {
        return "LadderSpec[" + describe() + ", " + parts + "]";
    }

    /** Collects settings; {@link #build()} validates them all at once. */
    public static final class Builder {
        private Topology topology = Topology.WEIGHTED;
        private int bits;
        private List<Double> resistors = new ArrayList<>();
        private double baseROhms = DEFAULT_BASE_R_OHMS;
        private ESeries series;
        private double tolerance = 0.05;
        private double logicHighVolts = 5.0;
        private double logicLowVolts = 0.0;
        private double pinROhmsHigh = 25.0;
        private double pinROhmsLow = 20.0;
        private double loadOhms = Double.POSITIVE_INFINITY;
        private double bufferGain = 1.0;
        private double outMinVolts = 0.0;
        private double outMaxVolts = Double.NaN;

        private Builder() {
        }

        /** Network shape. */
        public Builder topology(Topology value) {
            topology = Objects.requireNonNull(value, "topology");
            return this;
        }

        /** Bit depth 1..16; 0 means the length of the resistor list, or 8 without one. */
        public Builder bits(int value) {
            bits = value;
            return this;
        }

        /** Per-bit resistors in ohms, bit 0 (LSB) first; an empty list derives them from base_r. */
        public Builder resistors(List<Double> ohms) {
            resistors = new ArrayList<>(ohms);
            return this;
        }

        /** Per-bit resistors in ohms, bit 0 (LSB) first. */
        public Builder resistors(double... ohms) {
            resistors = new ArrayList<>();
            for (double r : ohms) {
                resistors.add(r);
            }
            return this;
        }

        /** Base resistance in ohms: MSB resistor of a weighted ladder, R of an R-2R ladder. */
        public Builder baseROhms(double value) {
            baseROhms = value;
            return this;
        }

        /** Preferred-value series for derived values and proposals; null for none. */
        public Builder series(ESeries value) {
            series = value;
            return this;
        }

        /** Resistor tolerance as a fraction, 0 .. 0.5. */
        public Builder tolerance(double fraction) {
            tolerance = fraction;
            return this;
        }

        /** Pin output level for a 1 bit, volts. */
        public Builder logicHighVolts(double value) {
            logicHighVolts = value;
            return this;
        }

        /** Pin output level for a 0 bit, volts. */
        public Builder logicLowVolts(double value) {
            logicLowVolts = value;
            return this;
        }

        /** Pin output resistance when high, ohms (0 for an ideal pin). */
        public Builder pinROhmsHigh(double value) {
            pinROhmsHigh = value;
            return this;
        }

        /** Pin output resistance when low, ohms. */
        public Builder pinROhmsLow(double value) {
            pinROhmsLow = value;
            return this;
        }

        /** Both pin output resistances, ohms. */
        public Builder pinROhms(double value) {
            pinROhmsHigh = value;
            pinROhmsLow = value;
            return this;
        }

        /** Load from the ladder output to ground, ohms; infinity for none. */
        public Builder loadOhms(double value) {
            loadOhms = value;
            return this;
        }

        /** Buffer voltage gain. */
        public Builder bufferGain(double value) {
            bufferGain = value;
            return this;
        }

        /** Lowest buffer output, volts. */
        public Builder outMinVolts(double value) {
            outMinVolts = value;
            return this;
        }

        /** Highest buffer output, volts; NaN to follow logic high. */
        public Builder outMaxVolts(double value) {
            outMaxVolts = value;
            return this;
        }

        /**
         * Validates and solves the description.
         *
         * @throws LadderSpecError naming the key at fault when a value is out of range, a per-bit list has
         *     the wrong length or the buffer swing leaves no usable span
         */
        public LadderSpec build() {
            return new LadderSpec(this);
        }
    }
}
