package org.rungtone.script.eval;

import java.util.Map;
import java.util.OptionalDouble;
import org.rungtone.internal.Units;
import org.rungtone.script.ast.Expr;
import org.rungtone.script.ast.Script;
import org.rungtone.script.ast.ScriptProblem;
import org.rungtone.script.ast.Stmt;

/**
 * A script compiled for one sample rate and seed, ready to render. Rendering runs the evaluator tree block by
 * block; the first sample of the output that is NaN or infinite stops it with the script position of the
 * operation that produced it (found by following non-finite values from the output back to their origin).
 */
public final class Program {
    private static final int MAX_TABLE = 1 << 20;
    private static final double[] RAMP = new double[Block.SIZE];

    static {
        for (int i = 0; i < Block.SIZE; i++) {
            RAMP[i] = i;
        }
    }

    private final Eval out;
    private final Frame frame;
    private final double rateHz;
    private final boolean wavetable;

    private Program(Eval out, Frame frame, double rateHz, boolean wavetable) {
        this.out = out;
        this.frame = frame;
        this.rateHz = rateHz;
        this.wavetable = wavetable;
    }

    /**
     * Checks a parsed script and works out its declarations.
     *
     * @throws ScriptProblem at the first problem
     */
    public static Header check(Script script) {
        Map<String, Stmt.Let> lets = Resolver.check(script);
        Compiler constants = new Compiler(lets, Double.NaN, 0, true);
        Frame none = Frame.root(0, false);
        boolean wavetable = false;
        double duration = Double.NaN;
        int table = 0;
        OptionalDouble rate = OptionalDouble.empty();
        for (Stmt s : script.statements()) {
            if (s instanceof Stmt.Duration d) {
                duration = constants.constant(d.seconds(), none, "the duration", "2s");
                Compiler.require(d.seconds().pos(), duration > 0 && duration < Double.POSITIVE_INFINITY,
                        "the duration", "positive", duration);
            } else if (s instanceof Stmt.Wavetable w) {
                wavetable = true;
                double length = constants.constant(w.length(), none, "the wavetable length", "256");
                Compiler.require(w.length().pos(), length == Math.rint(length) && length >= 2 && length <= MAX_TABLE,
                        "the wavetable length", "a whole number of samples from 2 to " + MAX_TABLE, length);
                table = (int) length;
            } else if (s instanceof Stmt.Rate r) {
                double hz = constants.constant(r.hertz(), none, "the rate", "16kHz");
                Compiler.require(r.hertz().pos(), hz > 0 && hz < Double.POSITIVE_INFINITY, "the rate", "positive",
                        hz);
                rate = OptionalDouble.of(hz);
            }
        }
        return new Header(wavetable, wavetable ? Double.NaN : duration, table, rate);
    }

    /**
     * Compiles a checked script. For a wavetable the script sees a rate of one cycle per second
     * ({@code fs} = table length, {@code t} = {@code phase}); {@code rateHz} is then only a label.
     *
     * @throws ScriptProblem for problems that show only when compiling (constants, frames, lengths)
     */
    public static Program compile(Script script, Header header, double rateHz, long seed) {
        Map<String, Stmt.Let> lets = Resolver.check(script);
        double scriptRate = header.wavetable() ? header.tableLength() : rateHz;
        Compiler compiler = new Compiler(lets, scriptRate, seed, false);
        Frame root = Frame.root(header.wavetable() ? 1.0 : header.durationSeconds(), header.wavetable());
        Expr output = null;
        for (Stmt s : script.statements()) {
            if (s instanceof Stmt.Out o) {
                output = o.value();
            }
        }
        return new Program(compiler.compile(output, root), root, scriptRate, header.wavetable());
    }

    /**
     * Renders {@code samples} samples from time 0.
     *
     * @throws ScriptProblem at the first NaN or infinite output sample
     */
    public double[] render(int samples) {
        double[] result = new double[samples];
        Block b = new Block();
        for (long start = 0; start < samples; start += Block.SIZE) {
            int length = (int) Math.min(Block.SIZE, samples - start);
            b.advance(start, length);
            double first = start;
            // Simple loops over a precomputed ramp vectorize, and t stays correctly rounded.
            for (int i = 0; i < length; i++) {
                frame.t[i] = (first + RAMP[i]) / rateHz;
            }
            if (frame.indexUsed) {
                for (int i = 0; i < length; i++) {
                    frame.index[i] = first + RAMP[i];
                }
            }
            if (wavetable) {
                System.arraycopy(frame.t, 0, frame.phase, 0, length);
            }
            double[] y = out.run(b);
            for (int i = 0; i < length; i++) {
                double v = y[i];
                if (v - v != 0) {
                    throw nonFinite(b, i);
                }
                result[(int) start + i] = v;
            }
        }
        return result;
    }

    private ScriptProblem nonFinite(Block b, int i) {
        Eval origin = out;
        boolean deeper = true;
        while (deeper) {
            deeper = false;
            for (Eval in : origin.culprits(i)) {
                if (in.ranIn(b) && !Double.isFinite(in.lastResult()[i])) {
                    origin = in;
                    deeper = true;
                    break;
                }
            }
        }
        double v = origin.lastResult()[i];
        String what = Double.isNaN(v) ? "NaN (not a number)" : v > 0 ? "infinity" : "-infinity";
        long sample = b.start + i;
        String when = wavetable ? "sample " + sample + " of the cycle"
                : "t = " + Units.format(sample / rateHz, "s") + " (sample " + sample + ")";
        return new ScriptProblem(origin.pos, "'" + origin.label + "' produced " + what + " at " + when
                + "; expected a finite value, check the range of its inputs");
    }
}
