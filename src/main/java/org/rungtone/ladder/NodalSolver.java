package org.rungtone.ladder;

import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.DecompositionSolver;
import org.apache.commons.math3.linear.LUDecomposition;
import org.apache.commons.math3.linear.MatrixUtils;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;

/**
 * Full nodal analysis of one code: the conductance matrix G and source vector s of the network with every
 * pin in its state, solved by LU decomposition (Commons Math) for all node voltages, {@code G·v = s}. Each
 * pin is a Thévenin source turned into its Norton equivalent: conductance {@code g = 1/(R_leg + r(b))}
 * added to the diagonal of its node and current {@code g·V(b)} added to s. The Thévenin resistance seen at
 * the output is the output entry of {@code G⁻¹·e_out} with all sources zeroed.
 *
 * <p>This is the reference solution ({@link LevelSolver} must agree with it) and the source of node
 * voltages for pin currents and output resistance. Node numbering: a summing network has one node (0);
 * an R-2R ladder has node i at the leg of bit i, the output at node N−1.
 */
final class NodalSolver {
    private final LadderSpec spec;
    private final double[] ohms;
    private final int code;
    private final DecompositionSolver solver;

    /** Factorises the network of {@code spec} with values {@code ohms} for one code. */
    NodalSolver(LadderSpec spec, double[] ohms, int code) {
        this.spec = spec;
        this.ohms = ohms;
        this.code = code;
        // G is strictly diagonally dominant (every node has its own pin's leg to a source), so it is
        // nonsingular for any positive values. Commons Math's default singularity threshold (1e-11) is an
        // absolute bound on the pivots, in siemens here, and would call a network of 100 GOhm parts singular;
        // only a pivot that is zero or subnormal means a failed solve.
        this.solver = new LUDecomposition(conductance(), Double.MIN_NORMAL).getSolver();
    }

    static int nodeCount(LadderSpec spec) {
        return spec.topology().isSumming() ? 1 : spec.bits();
    }

    static int outputNode(LadderSpec spec) {
        return nodeCount(spec) - 1;
    }

    static int legNode(LadderSpec spec, int bit) {
        return spec.topology().isSumming() ? 0 : bit;
    }

    private boolean high(int bit) {
        return ((code >> bit) & 1) != 0;
    }

    private double legConductance(int bit) {
        return 1 / (ohms[bit] + (high(bit) ? spec.pinROhmsHigh() : spec.pinROhmsLow()));
    }

    private RealMatrix conductance() {
        int n = nodeCount(spec);
        int bits = spec.bits();
        RealMatrix g = MatrixUtils.createRealMatrix(n, n);
        for (int bit = 0; bit < bits; bit++) {
            int node = legNode(spec, bit);
            g.addToEntry(node, node, legConductance(bit));
        }
        if (!spec.topology().isSumming()) {
            for (int i = 0; i + 1 < bits; i++) {
                double gr = 1 / ohms[bits + i];
                g.addToEntry(i, i, gr);
                g.addToEntry(i + 1, i + 1, gr);
                g.addToEntry(i, i + 1, -gr);
                g.addToEntry(i + 1, i, -gr);
            }
            g.addToEntry(0, 0, 1 / ohms[2 * bits - 1]);
        }
        if (!Double.isInfinite(spec.loadOhms())) {
            int out = outputNode(spec);
            g.addToEntry(out, out, 1 / spec.loadOhms());
        }
        return g;
    }

    /** All node voltages of this code. */
    double[] nodeVolts() {
        RealVector s = new ArrayRealVector(nodeCount(spec));
        for (int bit = 0; bit < spec.bits(); bit++) {
            double v = high(bit) ? spec.logicHighVolts() : spec.logicLowVolts();
            s.addToEntry(legNode(spec, bit), legConductance(bit) * v);
        }
        return solver.solve(s).toArray();
    }

    /** The Thévenin resistance of the network seen from the output, load included. */
    double outputOhms() {
        RealVector unit = new ArrayRealVector(nodeCount(spec));
        unit.setEntry(outputNode(spec), 1);
        return solver.solve(unit).getEntry(outputNode(spec));
    }

    /** Current out of each pin into its leg, in amperes (negative when the pin sinks current). */
    double[] pinAmps() {
        double[] v = nodeVolts();
        double[] amps = new double[spec.bits()];
        for (int bit = 0; bit < amps.length; bit++) {
            double src = high(bit) ? spec.logicHighVolts() : spec.logicLowVolts();
            amps[bit] = (src - v[legNode(spec, bit)]) * legConductance(bit);
        }
        return amps;
    }
}
