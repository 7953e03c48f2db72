package org.rungtone.script;

import java.nio.charset.StandardCharsets;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.Size;

/** Whatever the input, parsing and rendering fail only with {@link ScriptError}. */
class ScriptFuzzTest {
    private static final List<String> VOCABULARY = List.of(
            "duration", "wavetable", "samples", "rate", "let", "out", "if", "then", "else", "and", "or", "not",
            "for", "at", "every", "repeat", "rest", "x", "y", "t", "n", "fs", "phase", "pitch", "dur", "pi",
            "sine", "triangle", "square", "sawup", "sawdown", "pulse", "linsweep", "logsweep", "adsr", "decay",
            "segments", "white", "gauss", "pink", "clip", "saturate", "mix", "fade", "sequence", "notes", "min",
            "max", "clamp", "log", "sqrt", "db", "atan2", "mod", "0", "1", "2.5", "-6dB", "+3dB", "440Hz",
            "2.5kHz", "250ms", "1s", "1e308", "1e-308", "25%", "20k", "3zz", "A4", "C#5", "Bb3", "+", "-", "*",
            "/", "^", "(", ")", ",", "=", "<", "<=", ">", ">=", "==", "!=", "\n", "#", "@", "\t", "\u00b5s");

    private static final List<String> OPENINGS = List.of("", "duration 1s\nout ", "wavetable 64\nout ",
            "duration 2s\nrate 200\nlet x = sine(440Hz)\nlet y = ");

    @Property(tries = 300)
    void randomBytesOnlyEverGiveScriptErrors(@ForAll @Size(max = 200) byte[] bytes) {
        attempt(new String(bytes, StandardCharsets.UTF_8));
        attempt(new String(bytes, StandardCharsets.ISO_8859_1));
    }

    @Property(tries = 1000)
    void randomTokenSequencesOnlyEverGiveScriptErrors(@ForAll("openings") String opening,
            @ForAll("tokens") List<String> tokens) {
        attempt(opening + String.join(" ", tokens));
        attempt(opening + String.join("", tokens));
    }

    @Property(tries = 1000)
    void randomWellFormedExpressionsOnlyEverGiveScriptErrors(@ForAll("expressions") String expr) {
        attempt("duration 1s\nrate 200\nlet x = sine(440Hz)\nout " + expr);
        attempt("wavetable 64\nlet x = sine(3Hz)\nout " + expr);
    }

    @Provide
    Arbitrary<String> expressions() {
        return expression(3);
    }

    private static Arbitrary<String> expression(int depth) {
        Arbitrary<String> leaf = Arbitraries.of("t", "n", "fs", "pi", "pitch", "dur", "phase", "0", "1", "-1",
                "0.5", "440Hz", "250ms", "-6dB", "A4", "1e308", "x", "rest", "white()");
        if (depth == 0) {
            return leaf;
        }
        Arbitrary<String> sub = expression(depth - 1);
        Arbitrary<String> functions = Arbitraries.of("sine", "triangle", "square", "sawup", "pulse", "linsweep",
                "logsweep", "adsr", "decay", "segments", "gauss", "pink", "clip", "saturate", "mix", "fade",
                "sequence", "notes", "min", "clamp", "log", "sqrt", "db", "mod", "exp", "frac");
        return Arbitraries.oneOf(leaf,
                Combinators.combine(sub, Arbitraries.of("+", "-", "*", "/", "^", "<", "and", "for", "at", "every",
                        "repeat"), sub).as((a, op, b) -> "(" + a + " " + op + " " + b + ")"),
                Combinators.combine(functions, sub.list().ofMaxSize(4))
                        .as((f, args) -> f + "(" + String.join(", ", args) + ")"),
                Combinators.combine(sub, sub).as((a, b) -> "(" + a + ", " + b + ")"),
                Combinators.combine(sub, sub, sub).as((c, a, b) -> "(if " + c + " then " + a + " else " + b + ")"));
    }

    @Provide
    Arbitrary<String> openings() {
        return Arbitraries.of(OPENINGS);
    }

    @Provide
    Arbitrary<List<String>> tokens() {
        return Arbitraries.of(VOCABULARY).list().ofMaxSize(40);
    }

    /** Parses, and renders small scripts at a low rate; only {@link ScriptError} may escape. */
    private static void attempt(String source) {
        try {
            RungScript script = RungScript.parse(source, "fuzz.rung");
            boolean small = script.kind() == RungScript.Kind.CLIP
                    ? script.durationSeconds() * 200 <= 4000 : script.tableLength() <= 4096;
            if (small) {
                script.render(200, 1);
            }
        } catch (ScriptError expected) {
            // the one failure a script may cause
        }
    }
}
