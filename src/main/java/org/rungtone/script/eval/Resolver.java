package org.rungtone.script.eval;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.rungtone.script.ast.Expr;
import org.rungtone.script.ast.Pos;
import org.rungtone.script.ast.Script;
import org.rungtone.script.ast.ScriptProblem;
import org.rungtone.script.ast.Stmt;
import org.rungtone.script.ast.Suggestions;

/**
 * Static checks that need no sample rate: the statement structure (one clip or wavetable declaration, at most
 * one rate, one {@code out} at the end), names defined before use and only once, known functions with the
 * right number of arguments, pairs and rests only where a function accepts them, and expressions at most
 * {@link Compiler#MAX_DEPTH} levels deep.
 */
final class Resolver {
    private final Map<String, Stmt.Let> all = new LinkedHashMap<>();
    private final Map<String, Stmt.Let> defined = new LinkedHashMap<>();
    private String defining;
    private int depth;

    private Resolver() {
    }

    /**
     * Checks {@code script} and returns its named values by name.
     *
     * @throws ScriptProblem at the first problem found, in source order
     */
    static Map<String, Stmt.Let> check(Script script) {
        Resolver r = new Resolver();
        for (Stmt s : script.statements()) {
            if (s instanceof Stmt.Let let && !r.all.containsKey(let.name())) {
                r.all.put(let.name(), let);
            }
        }
        r.statements(script);
        return r.defined;
    }

    private void statements(Script script) {
        Stmt kind = null;
        Stmt rate = null;
        Stmt out = null;
        for (Stmt s : script.statements()) {
            if (out != null) {
                throw new ScriptProblem(s.pos(), "'" + keyword(s) + "' after 'out'; expected 'out' to be the "
                        + "last line");
            }
            if (s instanceof Stmt.Duration d) {
                kind = declare(kind, s);
                check(d.seconds(), Library.Role.VALUE);
            } else if (s instanceof Stmt.Wavetable w) {
                kind = declare(kind, s);
                check(w.length(), Library.Role.VALUE);
            } else if (s instanceof Stmt.Rate r) {
                if (rate != null) {
                    throw new ScriptProblem(s.pos(), "'rate' is already set on line " + rate.pos().line()
                            + "; expected one 'rate' line");
                }
                rate = s;
                check(r.hertz(), Library.Role.VALUE);
            } else if (s instanceof Stmt.Let let) {
                let(let);
            } else {
                out = s;
                check(((Stmt.Out) s).value(), Library.Role.VALUE);
            }
        }
        if (kind == null) {
            throw new ScriptProblem(new Pos(1, 1), "the script declares neither 'duration' nor 'wavetable'; "
                    + "expected a line such as 'duration 2s' or 'wavetable 256 samples'");
        }
        if (out == null) {
            throw new ScriptProblem(script.end(), "the script has no 'out' line; expected 'out' followed by the "
                    + "signal to play, as the last line");
        }
    }

    private static Stmt declare(Stmt previous, Stmt s) {
        if (previous != null) {
            String what = keyword(previous);
            String line = " on line " + previous.pos().line();
            if (what.equals(keyword(s))) {
                throw new ScriptProblem(s.pos(), "'" + what + "' is already set" + line + "; expected it once");
            }
            throw new ScriptProblem(s.pos(), "'" + keyword(s) + "' conflicts with '" + what + "'" + line
                    + "; a script is either a clip (duration) or a wavetable");
        }
        return s;
    }

    private static String keyword(Stmt s) {
        if (s instanceof Stmt.Duration) {
            return "duration";
        } else if (s instanceof Stmt.Wavetable) {
            return "wavetable";
        } else if (s instanceof Stmt.Rate) {
            return "rate";
        } else if (s instanceof Stmt.Let) {
            return "let";
        }
        return "out";
    }

    private void let(Stmt.Let let) {
        String name = let.name();
        if (Library.VARIABLES.contains(name)) {
            throw new ScriptProblem(let.namePos(), "'" + name + "' is a built-in name; pick another name");
        }
        if (Library.function(name) != null) {
            throw new ScriptProblem(let.namePos(), "'" + name + "' is a built-in function; pick another name");
        }
        Stmt.Let earlier = defined.get(name);
        if (earlier != null) {
            throw new ScriptProblem(let.namePos(), "'" + name + "' is already defined on line "
                    + earlier.pos().line() + "; pick another name");
        }
        defining = name;
        check(let.value(), Library.Role.VALUE);
        defining = null;
        defined.put(name, let);
    }

    private void check(Expr e, Library.Role role) {
        if (depth >= Compiler.MAX_DEPTH) {
            throw Compiler.tooDeep(e.pos());
        }
        depth++;
        try {
            checkNode(e, role);
        } finally {
            depth--;
        }
    }

    private void checkNode(Expr e, Library.Role role) {
        if (e instanceof Expr.Pair p) {
            pair(p, role);
        } else if (e instanceof Expr.Rest) {
            if (role != Library.Role.STEP) {
                throw new ScriptProblem(e.pos(), "'rest' is only allowed as a step of notes(...)");
            }
        } else if (role == Library.Role.POINT) {
            throw new ScriptProblem(e.pos(), "segments(...) takes (time, level) points; expected a pair such as "
                    + "(250ms, 0.5)");
        } else if (e instanceof Expr.Name n) {
            name(n);
        } else if (e instanceof Expr.Call c) {
            call(c);
        } else if (e instanceof Expr.Unary u) {
            check(u.operand(), Library.Role.VALUE);
        } else if (e instanceof Expr.Binary b) {
            check(b.left(), Library.Role.VALUE);
            check(b.right(), Library.Role.VALUE);
        } else if (e instanceof Expr.Conditional c) {
            check(c.test(), Library.Role.VALUE);
            check(c.then(), Library.Role.VALUE);
            check(c.otherwise(), Library.Role.VALUE);
        } else if (e instanceof Expr.Timed t) {
            check(t.part(), Library.Role.VALUE);
            check(t.amount(), Library.Role.VALUE);
        }
    }

    private void pair(Expr.Pair p, Library.Role role) {
        if (role == Library.Role.VALUE) {
            throw new ScriptProblem(p.pos(), "a pair (a, b) is only allowed as a point of segments(...), "
                    + "an input of mix(...) or a step of notes(...)");
        }
        if (!(role == Library.Role.STEP && p.first() instanceof Expr.Rest)) {
            check(p.first(), Library.Role.VALUE);
        }
        check(p.second(), Library.Role.VALUE);
    }

    private void name(Expr.Name n) {
        String id = n.id();
        if (Library.VARIABLES.contains(id) || defined.containsKey(id)) {
            return;
        }
        if (id.equals(defining)) {
            throw new ScriptProblem(n.pos(), "'" + id + "' refers to itself; a named value cannot be defined "
                    + "in terms of itself");
        }
        Stmt.Let later = all.get(id);
        if (later != null) {
            throw new ScriptProblem(n.pos(), "'" + id + "' is used before its definition on line "
                    + later.pos().line() + "; move that 'let' above this line");
        }
        Library.Signature f = Library.function(id);
        if (f != null) {
            throw new ScriptProblem(n.pos(), "'" + id + "' is a function; expected a call such as " + f.usage());
        }
        List<String> known = new ArrayList<>(defined.keySet());
        known.addAll(Library.VARIABLES);
        String hint = Suggestions.nearest(id, known);
        throw new ScriptProblem(n.pos(), "unknown name '" + id + "'; " + (hint != null
                ? "did you mean '" + hint + "'?"
                : "expected a built-in (t, n, fs, phase, pitch, dur, pi) or a name defined above with 'let'"));
    }

    private void call(Expr.Call c) {
        String name = c.function();
        Library.Signature f = Library.function(name);
        if (f == null) {
            if (defined.containsKey(name) || all.containsKey(name) || Library.VARIABLES.contains(name)) {
                throw new ScriptProblem(c.pos(), "'" + name + "' is a value, not a function; write it without "
                        + "parentheses");
            }
            String hint = Suggestions.nearest(name, Library.functionNames());
            throw new ScriptProblem(c.pos(), "unknown function '" + name + "'; " + (hint != null
                    ? "did you mean '" + hint + "'?"
                    : "expected one of the functions listed in docs/script-language.md"));
        }
        int count = c.args().size();
        if (count < f.min() || (f.max() >= 0 && count > f.max())) {
            throw new ScriptProblem(c.pos(), "'" + name + "' takes " + f.counted() + " but got " + count
                    + "; expected " + f.usage());
        }
        for (int i = 0; i < count; i++) {
            check(c.args().get(i), Library.role(name, i));
        }
    }
}
