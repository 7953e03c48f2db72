package org.rungtone.script.eval;

import java.util.Arrays;
import java.util.HashMap;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import org.rungtone.script.ast.Expr;
import org.rungtone.script.ast.Pos;
import org.rungtone.script.ast.SExpression;
import org.rungtone.script.ast.ScriptProblem;
import org.rungtone.script.ast.Stmt;

/**
 * Turns checked expressions into a tree of block evaluators for one sample rate and seed. A named value is
 * compiled once per time frame it is used in (a part has its own clock, so its oscillators are its own);
 * operations whose inputs are all constant are folded into constants.
 *
 * <p>In constants-only mode (for the declaration lines, before any sample rate is known) everything that
 * depends on time, the sample rate or noise is refused.
 */
final class Compiler {
    /** Upper bound on compiled nodes, against scripts whose named values expand without end. */
    static final int MAX_NODES = 10_000;
    /**
     * Deepest nesting of expressions, counted with named values expanded where they are used. Checking,
     * compiling and rendering each recurse once per level; this keeps them all far from the end of a thread's
     * stack (a chain of lets some 700 deep already reached it on a 1 MB stack).
     */
    static final int MAX_DEPTH = 256;

    private final Map<String, Stmt.Let> lets;
    final double rateHz;
    final boolean constantsOnly;
    private final long seed;
    private final Map<Frame, Map<String, Eval>> instances = new IdentityHashMap<>();
    private final CallCompiler calls = new CallCompiler(this);
    private long noiseStreams;
    private int nodes;
    private int depth;

    Compiler(Map<String, Stmt.Let> lets, double rateHz, long seed, boolean constantsOnly) {
        this.lets = lets;
        this.rateHz = rateHz;
        this.seed = seed;
        this.constantsOnly = constantsOnly;
    }

    /** Thrown in constants-only mode at the first thing that is not a constant; carries its name. */
    static final class NotConstant extends RuntimeException {
        private static final long serialVersionUID = 1L;

        NotConstant(String what) {
            super(what, null, false, false);
        }
    }

    /**
     * Compiles {@code e} to be evaluated in frame {@code f}. A node that is not itself a timing construct
     * carries the longest part length among its inputs, so {@code 0.5 * (tone for 1s)} still lasts 1 s.
     */
    Eval compile(Expr e, Frame f) {
        if (depth >= MAX_DEPTH) {
            throw tooDeep(e.pos());
        }
        depth++;
        Eval v;
        try {
            v = node(e, f);
        } finally {
            depth--;
        }
        if (Double.isNaN(v.lengthSeconds)) {
            for (Eval in : v.inputs()) {
                if (!Double.isNaN(in.lengthSeconds)) {
                    v.lengthSeconds = Double.isNaN(v.lengthSeconds) ? in.lengthSeconds
                            : Math.max(v.lengthSeconds, in.lengthSeconds);
                }
            }
        }
        return v;
    }

    /** The problem of an expression at {@code pos} that lies more than {@link #MAX_DEPTH} levels deep. */
    static ScriptProblem tooDeep(Pos pos) {
        return new ScriptProblem(pos, "the expression is nested more than " + MAX_DEPTH + " levels deep here (each"
                + " operation inside another counts, and so does each named value where it is used); expected a"
                + " flatter script: split long chains into named parts with let");
    }

    private Eval node(Expr e, Frame f) {
        if (++nodes > MAX_NODES) {
            throw new ScriptProblem(e.pos(), "the script grows to more than " + MAX_NODES + " steps when its "
                    + "named values are expanded; expected fewer nested copies of the same parts");
        }
        if (e instanceof Expr.Num n) {
            return new Const(n.pos(), n.text(), n.value());
        } else if (e instanceof Expr.Decibels d) {
            return new Const(d.pos(), SExpression.number(d.db()) + "dB", d.factor());
        } else if (e instanceof Expr.Note n) {
            return new Const(n.pos(), n.name(), n.hz());
        } else if (e instanceof Expr.Name n) {
            return name(n, f);
        } else if (e instanceof Expr.Call c) {
            return fold(calls.call(c, f));
        } else if (e instanceof Expr.Unary u) {
            MathCall.Fn fn = u.op() == Expr.UnaryOp.NEG ? MathCall.Fn.NEG : MathCall.Fn.NOT;
            return fold(new MathCall(u.pos(), u.op().symbol(), fn, compile(u.operand(), f)));
        } else if (e instanceof Expr.Binary b) {
            Arith.Op op = Arith.Op.valueOf(b.op().name());
            return fold(new Arith(b.pos(), b.op().symbol(), op, compile(b.left(), f), compile(b.right(), f)));
        } else if (e instanceof Expr.Conditional c) {
            return fold(new Select(c.pos(), compile(c.test(), f), compile(c.then(), f),
                    compile(c.otherwise(), f)));
        } else if (e instanceof Expr.Timed t) {
            return timed(t, f);
        }
        // Pairs and rests only occur where the resolver allowed them, and those callers unpack them.
        throw new IllegalStateException("unexpected " + SExpression.of(e));
    }

    private Eval name(Expr.Name n, Frame f) {
        String id = n.id();
        Stmt.Let let = lets.get(id);
        if (let != null) {
            Map<String, Eval> inFrame = instances.computeIfAbsent(f, k -> new HashMap<>());
            Eval known = inFrame.get(id);
            if (known == null) {
                known = compile(let.value(), f);
                inFrame.put(id, known);
            }
            return known;
        }
        switch (id) {
            case "pi":
                return new Const(n.pos(), id, Math.PI);
            case "fs":
                refuseInConstants(id);
                return new Const(n.pos(), id, rateHz);
            case "t":
                refuseInConstants(id);
                return new Var(n.pos(), id, f.t);
            case "n":
                refuseInConstants(id);
                f.root.indexUsed = true;
                return new Var(n.pos(), id, f.root.index);
            case "dur":
                refuseInConstants(id);
                // A fixed length becomes a constant, so envelopes that use it take their constant paths.
                return Double.isNaN(f.fixedSpan) ? new Var(n.pos(), id, f.span) : new Const(n.pos(), id, f.fixedSpan);
            case "pitch":
                refuseInConstants(id);
                if (f.pitch == null) {
                    throw new ScriptProblem(n.pos(), "'pitch' is only defined inside the voice of notes(...); "
                            + "expected it in the first argument of notes");
                }
                return new Var(n.pos(), id, f.pitch);
            default:
                refuseInConstants(id);
                if (f.root.phase == null) {
                    throw new ScriptProblem(n.pos(), "'phase' is only defined in a wavetable script; "
                            + "expected t (time in seconds) in a clip");
                }
                return new Var(n.pos(), id, f.root.phase);
        }
    }

    void refuseInConstants(String what) {
        if (constantsOnly) {
            throw new NotConstant(what);
        }
    }

    private Eval timed(Expr.Timed e, Frame f) {
        refuseInConstants(e.op().word());
        Pos at = e.amount().pos();
        switch (e.op()) {
            case FOR: {
                double length = constant(e.amount(), f, "the length after 'for'", "250ms");
                require(at, length > 0 && length < Double.POSITIVE_INFINITY, "the length after 'for'",
                        "positive", length);
                Frame inner = Frame.sameClock(f, length);
                return new ForPart(e.pos(), compile(e.part(), inner), f, inner, length);
            }
            case AT: {
                double start = constant(e.amount(), f, "the start time after 'at'", "1.5s");
                require(at, Double.isFinite(start), "the start time after 'at'", "finite", start);
                Frame inner = Frame.shifted(f, start);
                return new AtPart(e.pos(), compile(e.part(), inner), f, inner, start);
            }
            case EVERY: {
                double period = constant(e.amount(), f, "the period after 'every'", "500ms");
                require(at, period > 0 && period < Double.POSITIVE_INFINITY, "the period after 'every'",
                        "positive", period);
                Frame inner = Frame.child(f, period);
                return new EveryPart(e.pos(), compile(e.part(), inner), f, inner, period);
            }
            default: {
                double count = constant(e.amount(), f, "the count after 'repeat'", "3");
                require(at, count == Math.rint(count) && count >= 1 && count <= 1_000_000,
                        "the count after 'repeat'", "a whole number from 1 to 1000000", count);
                Frame inner = Frame.shifted(f, Double.NaN);
                Eval part = compile(e.part(), inner);
                double length = part.lengthSeconds;
                if (!(length > 0) || Double.isInfinite(length)) {
                    throw new ScriptProblem(e.pos(), "'repeat' needs a part with a known length; expected "
                            + "one made with 'for', e.g. (beep for 200ms) repeat 3");
                }
                Arrays.fill(inner.span, length);
                return new RepeatPart(e.pos(), part, f, inner, length, (long) count);
            }
        }
    }

    /**
     * The value of an expression that must be constant.
     *
     * @throws ScriptProblem naming {@code what} and an {@code example} when it varies
     */
    double constant(Expr e, Frame f, String what, String example) {
        Eval v;
        try {
            v = compile(e, f);
        } catch (NotConstant nc) {
            throw notConstant(e, what, example, nc.getMessage());
        }
        if (!v.isConstant()) {
            throw notConstant(e, what, example, firstVarying(v).label);
        }
        return ((Const) v).value;
    }

    private static ScriptProblem notConstant(Expr e, String what, String example, String cause) {
        return new ScriptProblem(e.pos(), what + " must be a constant such as " + example + "; this one depends on '"
                + cause + "'");
    }

    private static Eval firstVarying(Eval v) {
        for (Eval in : v.inputs()) {
            if (!in.isConstant()) {
                return firstVarying(in);
            }
        }
        return v;
    }

    /** Fails with "WHAT must be RULE; got VALUE" unless {@code ok}. */
    static void require(Pos pos, boolean ok, String what, String rule, double value) {
        if (!ok) {
            throw new ScriptProblem(pos, what + " must be " + rule + "; got " + SExpression.number(value));
        }
    }

    /** Replaces a pure node whose inputs are all constant by its value. */
    Eval fold(Eval e) {
        if (!e.pure()) {
            return e;
        }
        List<Eval> in = e.inputs();
        for (Eval x : in) {
            if (!x.isConstant()) {
                return e;
            }
        }
        Block one = new Block();
        one.advance(0, 1);
        return new Const(e.pos, e.label, e.compute(one)[0]);
    }

    /** A fresh random stream for the next noise node; streams are numbered in compile order. */
    SplitMix64 nextNoiseStream() {
        return SplitMix64.stream(seed, noiseStreams++);
    }
}
