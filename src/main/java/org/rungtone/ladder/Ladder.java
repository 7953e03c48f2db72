package org.rungtone.ladder;

import java.util.ArrayList;
import java.util.List;
import org.rungtone.internal.Checks;

/**
 * One concrete network: a {@link LadderSpec}'s topology, pins, load and buffer with a particular set of
 * resistor values (the nominal ones, a proposal, or one Monte Carlo board). Immutable.
 *
 * <p>Levels come from the exact fast solution ({@link LevelSolver}); node voltages, output resistance and
 * pin currents from full nodal analysis of each code (see {@link NodalSolver}).
 */
public final class Ladder {
    private final LadderSpec spec;
    private final double[] ohms;

    private Ladder(LadderSpec spec, double[] ohms) {
        this.spec = spec;
        this.ohms = ohms;
    }

    /** The nominal network of a description. */
    public static Ladder nominal(LadderSpec spec) {
        return new Ladder(spec, spec.ohms());
    }

    /**
     * The description's network with other resistor values, in the order of {@link LadderSpec#parts()}.
     *
     * @throws IllegalArgumentException when the count differs or a value is not positive and finite
     */
    public static Ladder of(LadderSpec spec, double[] ohms) {
        Checks.checkArgument(ohms.length == spec.parts().size(), "need %d resistor values, got %d",
                spec.parts().size(), ohms.length);
        for (double r : ohms) {
            Checks.checkArgument(Double.isFinite(r) && r > 0, "resistor values must be positive: %s", r);
        }
        return new Ladder(spec, ohms.clone());
    }

    /** The description this network follows. */
    public LadderSpec spec() {
        return spec;
    }

    /** The resistor values in the order of the spec's parts, a copy. */
    public double[] ohms() {
        return ohms.clone();
    }

    /** The parts with this network's values. */
    public List<Part> parts() {
        List<Part> out = new ArrayList<>();
        List<Part> nominal = spec.parts();
        for (int i = 0; i < ohms.length; i++) {
            out.add(nominal.get(i).withOhms(ohms[i]));
        }
        return out;
    }

    /** The ladder output (buffer input) of every code, volts. */
    public double[] ladderVolts() {
        double[] v = new double[1 << spec.bits()];
        LevelSolver.ladderVolts(spec, ohms, v, new LevelSolver.Scratch(spec.bits()));
        return v;
    }

    /** The buffered output level of every code. */
    public LevelTable levels() {
        double[] v = new double[1 << spec.bits()];
        LevelSolver.outputVolts(spec, ohms, v, new LevelSolver.Scratch(spec.bits()));
        return LevelTable.of(spec.bits(), v, "modelled " + spec.describe());
    }

    /** All node voltages of one code by nodal analysis (one node for summing networks, N for R-2R). */
    public double[] nodeVolts(int code) {
        return new NodalSolver(spec, ohms, checkCode(code)).nodeVolts();
    }

    /** The Thévenin resistance at the ladder output for one code, ohms (load included). */
    public double outputOhms(int code) {
        return new NodalSolver(spec, ohms, checkCode(code)).outputOhms();
    }

    /** Current out of each pin for one code, amperes; negative while the pin sinks. */
    public double[] pinAmps(int code) {
        return new NodalSolver(spec, ohms, checkCode(code)).pinAmps();
    }

    /** The worst source and sink current of every pin over all codes, bit 0 first. */
    public List<PinCurrent> pinCurrents() {
        return scan().pins();
    }

    /** The lowest and highest Thévenin resistance at the ladder output over all codes, ohms. */
    public double[] outputOhmsRange() {
        DcScan s = scan();
        return new double[] {s.minOutputOhms(), s.maxOutputOhms()};
    }

    /** Pin currents and output resistance of every code, in one pass. */
    record DcScan(List<PinCurrent> pins, double minOutputOhms, double maxOutputOhms) {
    }

    DcScan scan() {
        int bits = spec.bits();
        double[] source = new double[bits];
        double[] sink = new double[bits];
        int[] sourceCode = new int[bits];
        int[] sinkCode = new int[bits];
        double minOut = Double.POSITIVE_INFINITY;
        double maxOut = 0;
        boolean summing = spec.topology().isSumming();
        double[] node = summing ? ladderVolts() : null;
        for (int code = 0; code < 1 << bits; code++) {
            double[] amps;
            double outOhms;
            if (summing) {
                amps = summingAmps(code, node[code]);
                outOhms = summingOutputOhms(code);
            } else {
                NodalSolver solver = new NodalSolver(spec, ohms, code);
                amps = solver.pinAmps();
                outOhms = solver.outputOhms();
            }
            minOut = Math.min(minOut, outOhms);
            maxOut = Math.max(maxOut, outOhms);
            for (int bit = 0; bit < bits; bit++) {
                if (amps[bit] > source[bit]) {
                    source[bit] = amps[bit];
                    sourceCode[bit] = code;
                }
                if (-amps[bit] > sink[bit]) {
                    sink[bit] = -amps[bit];
                    sinkCode[bit] = code;
                }
            }
        }
        List<PinCurrent> pins = new ArrayList<>();
        for (int bit = 0; bit < bits; bit++) {
            pins.add(new PinCurrent(bit, source[bit], sourceCode[bit], sink[bit], sinkCode[bit]));
        }
        return new DcScan(List.copyOf(pins), minOut, maxOut);
    }

    private double summingOutputOhms(int code) {
        double g = Double.isInfinite(spec.loadOhms()) ? 0 : 1 / spec.loadOhms();
        for (int bit = 0; bit < spec.bits(); bit++) {
            boolean high = ((code >> bit) & 1) != 0;
            g += 1 / (ohms[bit] + (high ? spec.pinROhmsHigh() : spec.pinROhmsLow()));
        }
        return 1 / g;
    }

    private double[] summingAmps(int code, double node) {
        double[] amps = new double[spec.bits()];
        for (int bit = 0; bit < amps.length; bit++) {
            boolean high = ((code >> bit) & 1) != 0;
            double v = high ? spec.logicHighVolts() : spec.logicLowVolts();
            double r = high ? spec.pinROhmsHigh() : spec.pinROhmsLow();
            amps[bit] = (v - node) / (ohms[bit] + r);
        }
        return amps;
    }

    private int checkCode(int code) {
        Checks.checkArgument(code >= 0 && code < 1 << spec.bits(), "code must be 0..%d: %d",
                (1 << spec.bits()) - 1, code);
        return code;
    }
}
