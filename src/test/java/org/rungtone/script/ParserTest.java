package org.rungtone.script;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/** Every construct of the language parses into the expected tree (compared as s-expressions). */
class ParserTest {
    static Stream<Arguments> expressions() {
        return Stream.of(
                // numbers and unit suffixes (values in SI units)
                Arguments.of("440", "440"),
                Arguments.of("440Hz", "440"),
                Arguments.of("2.5kHz", "2500"),
                Arguments.of("1MHz", "1000000"),
                Arguments.of("1.2s", "1.2"),
                Arguments.of("250ms", "0.25"),
                Arguments.of("125us", "1.25E-4"),
                Arguments.of("125\u00b5s", "1.25E-4"),
                Arguments.of("25%", "0.25"),
                Arguments.of("20k", "20000"),
                Arguments.of("1e3", "1000"),
                Arguments.of(".5", "0.5"),
                Arguments.of("3.", "3"),
                // decibels keep their written value; the sign belongs to the number
                Arguments.of("-6dB", "(dB -6)"),
                Arguments.of("+3.5dB", "(dB 3.5)"),
                Arguments.of("0.5 * -6dB", "(* 0.5 (dB -6))"),
                Arguments.of("- 6dB", "(neg (dB 6))"),
                Arguments.of("1 - 6dB", "(- 1 (dB 6))"),
                // notes
                Arguments.of("A4", "(note A4)"),
                Arguments.of("C#5", "(note C#5)"),
                Arguments.of("Bb3", "(note Bb3)"),
                // names and built-ins
                Arguments.of("t", "t"),
                Arguments.of("n / fs", "(/ n fs)"),
                Arguments.of("2 * pi * t", "(* (* 2 pi) t)"),
                // operators, precedence and associativity
                Arguments.of("1 + 2 * 3", "(+ 1 (* 2 3))"),
                Arguments.of("(1 + 2) * 3", "(* (+ 1 2) 3)"),
                Arguments.of("1 - 2 - 3", "(- (- 1 2) 3)"),
                Arguments.of("8 / 4 / 2", "(/ (/ 8 4) 2)"),
                Arguments.of("2 ^ 3 ^ 2", "(^ 2 (^ 3 2))"),
                Arguments.of("-2 ^ 2", "(neg (^ 2 2))"),
                Arguments.of("2 ^ -1", "(^ 2 (neg 1))"),
                Arguments.of("--1", "(neg (neg 1))"),
                Arguments.of("+1", "1"),
                Arguments.of("t < 1", "(< t 1)"),
                Arguments.of("t <= 1", "(<= t 1)"),
                Arguments.of("t > 1", "(> t 1)"),
                Arguments.of("t >= 1", "(>= t 1)"),
                Arguments.of("t == 1", "(== t 1)"),
                Arguments.of("t != 1", "(!= t 1)"),
                Arguments.of("t > 1 and t < 2 or not t", "(or (and (> t 1) (< t 2)) (not t))"),
                Arguments.of("1 + t < 2 * t", "(< (+ 1 t) (* 2 t))"),
                // conditional
                Arguments.of("if t < 1 then 2 else 3 + 4", "(if (< t 1) 2 (+ 3 4))"),
                Arguments.of("0.5 * (if t < 1 then 2 else 3)", "(* 0.5 (if (< t 1) 2 3))"),
                Arguments.of("if t < 1 then 2 else if t < 2 then 3 else 4", "(if (< t 1) 2 (if (< t 2) 3 4))"),
                // calls
                Arguments.of("sin(2 * pi * 440 * t)", "(sin (* (* (* 2 pi) 440) t))"),
                Arguments.of("white()", "(white)"),
                Arguments.of("min(1, 2, 3)", "(min 1 2 3)"),
                Arguments.of("clamp(t, 0, 1)", "(clamp t 0 1)"),
                Arguments.of("sine(A4, 0.25)", "(sine (note A4) 0.25)"),
                Arguments.of("square(1kHz, 30%)", "(square 1000 0.3)"),
                Arguments.of("sine(logsweep(20Hz, 20kHz, 10s))", "(sine (logsweep 20 20000 10))"),
                Arguments.of("adsr(5ms, 50ms, 0.6, 200ms)", "(adsr 0.005 0.05 0.6 0.2)"),
                Arguments.of("segments((0, 0), (10ms, 1), (1s, 0))",
                        "(segments (pair 0 0) (pair 0.01 1) (pair 1 0))"),
                Arguments.of("mix((sine(A4), -6dB), white())", "(mix (pair (sine (note A4)) (dB -6)) (white))"),
                Arguments.of("notes(sine(pitch), 250ms, C4, rest, (E4, 500ms), (rest, 1s))",
                        "(notes (sine pitch) 0.25 (note C4) (rest) (pair (note E4) 0.5) (pair (rest) 1))"),
                // timing words: tighter than + and -, looser than * and /, applied left to right
                Arguments.of("sine(A4) for 1s", "(for (sine (note A4)) 1)"),
                Arguments.of("0.5 * x for 1s at 2s", "(at (for (* 0.5 x) 1) 2)"),
                Arguments.of("a at 0s + b at 500ms", "(+ (at a 0) (at b 0.5))"),
                Arguments.of("beep for 100ms every 1s", "(every (for beep 100ms) 1)"),
                Arguments.of("(beep for 100ms) repeat 3", "(repeat (for beep 0.1) 3)"));
    }

    @ParameterizedTest
    @MethodSource("expressions")
    void parsesExpression(String source, String expected) {
        String lets = "let x = 1\nlet a = 1\nlet b = 2\nlet beep = sine(1kHz)\n";
        String all = RungScript.parse("duration 1s\n" + lets + "out " + source, "test.rung").toSExpression();
        String out = all.substring(all.indexOf("(out ") + 5, all.length() - 2);
        assertEquals(expected.replace("100ms", "0.1"), out);
    }

    @Test
    void parsesWholeScriptWithCommentsAndDeclarations() {
        String source = String.join("\n",
                "# a chime",
                "duration 1.5s   # length of the clip",
                "rate 8kHz",
                "let f = C#5 # a note",
                "",
                "out 0.5 * sine(f)");
        assertEquals("(script (duration 1.5) (rate 8000) (let f (note C#5)) (out (* 0.5 (sine f))))",
                RungScript.parse(source, "chime.rung").toSExpression());
    }

    @Test
    void parsesWavetableWithAndWithoutSamplesWord() {
        assertEquals("(script (wavetable 256) (out (sin (* (* 2 pi) phase))))",
                RungScript.parse("wavetable 256 samples\nout sin(2*pi*phase)", "w.rung").toSExpression());
        assertEquals("(script (wavetable 64) (out phase))",
                RungScript.parse("wavetable 64 out phase", "w.rung").toSExpression());
    }

    @Test
    void acceptsWindowsLineEndingsTabsAndByteOrderMark() {
        String source = "\uFEFFduration\t1s\r\nlet\tx = 2\r\nout x\r\n";
        assertEquals("(script (duration 1) (let x 2) (out x))",
                RungScript.parse(source, "crlf.rung").toSExpression());
    }
}
