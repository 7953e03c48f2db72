package org.rungtone.script.eval;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.rungtone.script.ast.Expr;
import org.rungtone.script.ast.Pos;
import org.rungtone.script.ast.SExpression;
import org.rungtone.script.ast.ScriptProblem;

/**
 * Compiles calls of built-in functions (already checked for name and argument count). Shaping functions that
 * are combinations of simpler operations are built from them: {@code clip(x, L)} = max(−L, min(L, x)),
 * {@code saturate(x, k)} = tanh(k·x), {@code mix((a, g), b)} = g·a + b.
 */
final class CallCompiler {
    private final Compiler compiler;

    CallCompiler(Compiler compiler) {
        this.compiler = compiler;
    }

    Eval call(Expr.Call c, Frame f) {
        String name = c.function();
        List<Expr> a = c.args();
        Pos p = c.pos();
        switch (name) {
            case "atan2":
            case "hypot":
            case "mod":
                return arith(p, name, Arith.Op.valueOf(name.toUpperCase(Locale.ROOT)), arg(a, 0, f), arg(a, 1, f));
            case "min":
            case "max":
                return chain(p, name, Arith.Op.valueOf(name.toUpperCase(Locale.ROOT)), a, f);
            case "clamp":
                return arith(p, "clamp", Arith.Op.MIN, arith(p, "clamp", Arith.Op.MAX, arg(a, 0, f), arg(a, 1, f)),
                        arg(a, 2, f));
            case "clip": {
                Eval limit = a.size() > 1 ? arg(a, 1, f) : new Const(p, "1", 1);
                Eval low = compiler.fold(new MathCall(p, "clip", MathCall.Fn.NEG, limit));
                return arith(p, "clip", Arith.Op.MAX, low, arith(p, "clip", Arith.Op.MIN, limit, arg(a, 0, f)));
            }
            case "saturate": {
                Eval x = a.size() > 1 ? arith(p, "saturate", Arith.Op.MUL, arg(a, 1, f), arg(a, 0, f)) : arg(a, 0, f);
                return new MathCall(p, "saturate", MathCall.Fn.TANH, x);
            }
            case "db":
                return new MathCall(p, name, MathCall.Fn.DB, arg(a, 0, f));
            case "mix":
                return mix(p, a, f);
            default:
                break;
        }
        if (Library.function(name).usage().equals(name + "(x)")) {
            return new MathCall(p, name, MathCall.Fn.valueOf(name.toUpperCase(Locale.ROOT)), arg(a, 0, f));
        }
        compiler.refuseInConstants(name);
        return signal(c, f);
    }

    private Eval signal(Expr.Call c, Frame f) {
        String name = c.function();
        List<Expr> a = c.args();
        Pos p = c.pos();
        switch (name) {
            case "sine":
                return oscillator(c, Oscillator.Wave.SINE, f);
            case "triangle":
                return oscillator(c, Oscillator.Wave.TRIANGLE, f);
            case "square":
                return oscillator(c, Oscillator.Wave.SQUARE, f);
            case "sawup":
                return oscillator(c, Oscillator.Wave.SAW_UP, f);
            case "sawdown":
                return oscillator(c, Oscillator.Wave.SAW_DOWN, f);
            case "pulse":
                return oscillator(c, Oscillator.Wave.PULSE, f);
            case "linsweep":
            case "logsweep":
                return sweep(c, f);
            case "adsr": {
                Eval release = arg(a, 3, f);
                Eval off = a.size() > 4 ? arg(a, 4, f)
                        : arith(p, "adsr", Arith.Op.SUB, compiler.compile(new Expr.Name(p, "dur"), f), release);
                return new Adsr(p, arg(a, 0, f), arg(a, 1, f), arg(a, 2, f), release, off, f);
            }
            case "decay":
                return new Decay(p, arg(a, 0, f), f);
            case "segments":
                return segments(c, f);
            case "white":
                return new Noise(p, name, Noise.Kind.WHITE, a.isEmpty() ? new Const(p, "1", 1) : arg(a, 0, f),
                        compiler.nextNoiseStream(), compiler.rateHz);
            case "gauss":
                return new Noise(p, name, Noise.Kind.GAUSS, arg(a, 0, f), compiler.nextNoiseStream(),
                        compiler.rateHz);
            case "pink":
                return new Noise(p, name, Noise.Kind.PINK, arg(a, 0, f), compiler.nextNoiseStream(),
                        compiler.rateHz);
            case "fade":
                return new Fade(p, arg(a, 0, f), arg(a, 1, f), arg(a, 2, f), f);
            case "sequence":
                return sequence(c, f);
            default:
                return notes(c, f);
        }
    }

    private Eval arg(List<Expr> args, int i, Frame f) {
        return compiler.compile(args.get(i), f);
    }

    private Eval arith(Pos p, String label, Arith.Op op, Eval x, Eval y) {
        return compiler.fold(new Arith(p, label, op, x, y));
    }

    private Eval chain(Pos p, String label, Arith.Op op, List<Expr> args, Frame f) {
        Eval acc = arg(args, 0, f);
        for (int i = 1; i < args.size(); i++) {
            acc = arith(p, label, op, acc, arg(args, i, f));
        }
        return acc;
    }

    private Eval mix(Pos p, List<Expr> args, Frame f) {
        Eval acc = null;
        for (Expr e : args) {
            Eval term = e instanceof Expr.Pair pair
                    ? arith(pair.pos(), "mix", Arith.Op.MUL, compiler.compile(pair.first(), f),
                            compiler.compile(pair.second(), f))
                    : compiler.compile(e, f);
            if (!(e instanceof Expr.Pair) && term.isConstant()) {
                // a bare number here would be added as a constant offset, never a gain of its neighbour
                throw new ScriptProblem(e.pos(), "mix takes signals, and this input is a plain number that would"
                        + " be added as a DC offset; give an input's gain as a pair: mix((a, 0.7), (b, 0.3))");
            }
            acc = acc == null ? term : arith(p, "mix", Arith.Op.ADD, acc, term);
        }
        return acc;
    }

    private Eval oscillator(Expr.Call c, Oscillator.Wave wave, Frame f) {
        List<Expr> a = c.args();
        Eval shape = a.size() > 1 ? arg(a, 1, f) : null;
        return new Oscillator(c.pos(), c.function(), wave, arg(a, 0, f), shape, f);
    }

    private Eval sweep(Expr.Call c, Frame f) {
        List<Expr> a = c.args();
        Eval from = arg(a, 0, f);
        Eval to = arg(a, 1, f);
        boolean exponential = c.function().equals("logsweep");
        if (exponential) {
            for (int i = 0; i < 2; i++) {
                Eval end = i == 0 ? from : to;
                if (end.isConstant()) {
                    Compiler.require(a.get(i).pos(), ((Const) end).value > 0, "a logsweep frequency",
                            "above 0 Hz", ((Const) end).value);
                }
            }
        }
        return new Sweep(c.pos(), c.function(), exponential, from, to, arg(a, 2, f), f);
    }

    private Eval segments(Expr.Call c, Frame f) {
        List<Expr> a = c.args();
        double[] times = new double[a.size()];
        double[] levels = new double[a.size()];
        for (int i = 0; i < a.size(); i++) {
            Expr.Pair point = (Expr.Pair) a.get(i);
            times[i] = compiler.constant(point.first(), f, "a segment time", "250ms");
            levels[i] = compiler.constant(point.second(), f, "a segment level", "0.5");
            Compiler.require(point.first().pos(), Double.isFinite(times[i]), "a segment time", "finite", times[i]);
            if (i > 0 && times[i] < times[i - 1]) {
                throw new ScriptProblem(point.first().pos(), "segment times must not decrease; expected at least "
                        + SExpression.number(times[i - 1]) + " s here");
            }
        }
        return new Segments(c.pos(), times, levels, f);
    }

    private Eval sequence(Expr.Call c, Frame f) {
        List<Eval> parts = new ArrayList<>();
        List<Frame> frames = new ArrayList<>();
        double[] lengths = new double[c.args().size()];
        for (int k = 0; k < lengths.length; k++) {
            Frame inner = Frame.shifted(f, Double.NaN);
            Eval part = compiler.compile(c.args().get(k), inner);
            lengths[k] = part.lengthSeconds;
            if (!(lengths[k] > 0) || Double.isInfinite(lengths[k])) {
                throw new ScriptProblem(c.args().get(k).pos(), "part " + (k + 1) + " of sequence(...) has no known "
                        + "length; expected one made with 'for', e.g. tone for 300ms");
            }
            Arrays.fill(inner.span, lengths[k]);
            parts.add(part);
            frames.add(inner);
        }
        return new SequencePart(c.pos(), parts, frames, lengths, f);
    }

    private Eval notes(Expr.Call c, Frame f) {
        List<Expr> a = c.args();
        double step = compiler.constant(a.get(1), f, "the note length", "250ms");
        Compiler.require(a.get(1).pos(), step > 0 && step < Double.POSITIVE_INFINITY, "the note length",
                "positive", step);
        int count = a.size() - 2;
        double[] lengths = new double[count];
        double[] pitches = new double[count];
        for (int k = 0; k < count; k++) {
            Expr e = a.get(k + 2);
            Expr pitch = e instanceof Expr.Pair pair ? pair.first() : e;
            lengths[k] = step;
            if (e instanceof Expr.Pair pair) {
                lengths[k] = compiler.constant(pair.second(), f, "the note length", "250ms");
                Compiler.require(pair.second().pos(), lengths[k] > 0 && lengths[k] < Double.POSITIVE_INFINITY,
                        "the note length", "positive", lengths[k]);
            }
            if (pitch instanceof Expr.Rest) {
                pitches[k] = Double.NaN;
            } else {
                pitches[k] = compiler.constant(pitch, f, "a note", "C#5 or 440Hz");
                Compiler.require(pitch.pos(), Double.isFinite(pitches[k]), "a note", "a finite frequency",
                        pitches[k]);
            }
        }
        Frame voice = Frame.voice(f);
        return new NotesPart(c.pos(), compiler.compile(a.get(0), voice), f, voice, lengths, pitches);
    }
}
