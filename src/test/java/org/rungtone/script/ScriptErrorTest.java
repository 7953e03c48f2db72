package org.rungtone.script;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/** Every class of script error gives its one-line message with file, line and column. */
class ScriptErrorTest {
    static Stream<Arguments> problems() {
        return Stream.of(
                // syntax: what was found and what could have come there
                Arguments.of("duration 1s\nout 1 +",
                        "t.rung:2:8: unexpected end of file; expected an expression"),
                Arguments.of("duration 1s\nout (1 + 2))", "t.rung:2:12: unexpected ')'; expected an operator or a "
                        + "statement (let, out, duration, wavetable or rate)"),
                Arguments.of("duration 1s\nout (1", "t.rung:2:7: unexpected end of file; expected an operator, "
                        + "')' or ','"),
                Arguments.of("duration 1s\nlet a 3\nout a", "t.rung:2:7: unexpected number '3'; expected '='"),
                Arguments.of("duration 1s\nlet for = 1\nout 1", "t.rung:2:5: unexpected 'for'; expected a name"),
                Arguments.of("duration 1s\nout 1 $ 2", "t.rung:2:7: unexpected character '$'; expected an "
                        + "operator or a statement (let, out, duration, wavetable or rate)"),
                Arguments.of("duration 1s\nlet x = 1\ny = 2\nout x",
                        "t.rung:3:1: unexpected name 'y'; did you mean 'let y = ...'?"),
                Arguments.of("duration 1s\nout sine(440Hz) -6dB", "t.rung:2:17: unexpected gain '-6dB'; expected "
                        + "an operator (write '- 6dB' to subtract it, or '* -6dB' to apply it as a gain)"),
                Arguments.of("duration 1s\nout sine(440 Hz)", "t.rung:2:14: unexpected name 'Hz'; did you mean "
                        + "'440Hz' (no space before the unit)?"),
                Arguments.of("duration 1s\nout 0.5 * if t < 1 then 1 else 0", "t.rung:2:11: unexpected 'if'; a "
                        + "conditional inside a larger expression needs parentheses: (if ... then ... else ...)"),
                // units
                Arguments.of("duration 2khz\nout 1", "t.rung:1:11: unknown unit 'khz' in '2khz'; did you mean 'kHz'?"),
                Arguments.of("duration 1s\nout 12volts", "t.rung:2:7: unknown unit 'volts' in '12volts'; expected "
                        + "one of Hz, kHz, MHz, s, ms, us, %, k or dB"),
                // names
                Arguments.of("duration 1s\nlet freq = 440Hz\nout sine(frq)",
                        "t.rung:3:10: unknown name 'frq'; did you mean 'freq'?"),
                Arguments.of("duration 1s\nout sine(zzz)", "t.rung:2:10: unknown name 'zzz'; expected a built-in "
                        + "(t, n, fs, phase, pitch, dur, pi) or a name defined above with 'let'"),
                Arguments.of("duration 1s\nout sinee(440Hz)",
                        "t.rung:2:5: unknown function 'sinee'; did you mean 'sine'?"),
                Arguments.of("duration 1s\nout wobble(440Hz)", "t.rung:2:5: unknown function 'wobble'; expected "
                        + "one of the functions listed in docs/script-language.md"),
                Arguments.of("duration 1s\nout a\nlet a = 1", "t.rung:2:5: 'a' is used before its definition on "
                        + "line 3; move that 'let' above this line"),
                Arguments.of("duration 1s\nlet a = a + 1\nout a", "t.rung:2:9: 'a' refers to itself; a named "
                        + "value cannot be defined in terms of itself"),
                Arguments.of("duration 1s\nlet a = 1\nlet a = 2\nout a",
                        "t.rung:3:5: 'a' is already defined on line 2; pick another name"),
                Arguments.of("duration 1s\nlet t = 1\nout t", "t.rung:2:5: 't' is a built-in name; pick another name"),
                Arguments.of("duration 1s\nlet sine = 1\nout sine",
                        "t.rung:2:5: 'sine' is a built-in function; pick another name"),
                Arguments.of("duration 1s\nout sine", "t.rung:2:5: 'sine' is a function; expected a call such as "
                        + "sine(frequency [, start_phase])"),
                Arguments.of("duration 1s\nlet env = decay(1s)\nout env(2)",
                        "t.rung:3:5: 'env' is a value, not a function; write it without parentheses"),
                // argument counts name the function and its signature
                Arguments.of("duration 1s\nout sine(440Hz, 0, 1)", "t.rung:2:5: 'sine' takes 1 or 2 arguments but "
                        + "got 3; expected sine(frequency [, start_phase])"),
                Arguments.of("duration 1s\nout pulse(440Hz)",
                        "t.rung:2:5: 'pulse' takes 2 arguments but got 1; expected pulse(frequency, width)"),
                Arguments.of("duration 1s\nout notes(sine(pitch), 1s)", "t.rung:2:5: 'notes' takes at least 3 "
                        + "arguments but got 2; expected notes(voice, length, step, ...)"),
                Arguments.of("duration 1s\nout adsr(1, 2, 3)", "t.rung:2:5: 'adsr' takes 4 or 5 arguments but got "
                        + "3; expected adsr(attack, decay, sustain, release [, off])"),
                // pairs and rests
                Arguments.of("duration 1s\nout (1, 2) + 3", "t.rung:2:5: a pair (a, b) is only allowed as a point "
                        + "of segments(...), an input of mix(...) or a step of notes(...)"),
                Arguments.of("duration 1s\nout sine(rest)",
                        "t.rung:2:10: 'rest' is only allowed as a step of notes(...)"),
                Arguments.of("duration 1s\nout segments(0, 1)", "t.rung:2:14: segments(...) takes (time, level) "
                        + "points; expected a pair such as (250ms, 0.5)"),
                // statement structure
                Arguments.of("let a = 1\nout a", "t.rung:1:1: the script declares neither 'duration' nor "
                        + "'wavetable'; expected a line such as 'duration 2s' or 'wavetable 256 samples'"),
                Arguments.of("duration 1s\nlet a = 1", "t.rung:2:10: the script has no 'out' line; expected 'out' "
                        + "followed by the signal to play, as the last line"),
                Arguments.of("duration 1s\nwavetable 256\nout 1", "t.rung:2:1: 'wavetable' conflicts with "
                        + "'duration' on line 1; a script is either a clip (duration) or a wavetable"),
                Arguments.of("duration 1s\nduration 2s\nout 1",
                        "t.rung:2:1: 'duration' is already set on line 1; expected it once"),
                Arguments.of("duration 1s\nrate 8kHz\nrate 16kHz\nout 1",
                        "t.rung:3:1: 'rate' is already set on line 2; expected one 'rate' line"),
                Arguments.of("duration 1s\nout 1\nlet b = 2",
                        "t.rung:3:1: 'let' after 'out'; expected 'out' to be the last line"),
                // constants and ranges
                Arguments.of("duration t\nout 1",
                        "t.rung:1:10: the duration must be a constant such as 2s; this one depends on 't'"),
                Arguments.of("duration fs\nout 1",
                        "t.rung:1:10: the duration must be a constant such as 2s; this one depends on 'fs'"),
                Arguments.of("duration -1s\nout 1", "t.rung:1:10: the duration must be positive; got -1"),
                Arguments.of("wavetable 100.5\nout 1", "t.rung:1:11: the wavetable length must be a whole number of "
                        + "samples from 2 to 1048576; got 100.5"),
                Arguments.of("wavetable 256\nrate 0\nout 1", "t.rung:2:6: the rate must be positive; got 0"),
                Arguments.of("duration 1s\nout sine(440Hz) for t", "t.rung:2:21: the length after 'for' must be a "
                        + "constant such as 250ms; this one depends on 't'"),
                Arguments.of("duration 1s\nout sine(440Hz) for -1s",
                        "t.rung:2:21: the length after 'for' must be positive; got -1"),
                Arguments.of("duration 1s\nout (1 for 1s) repeat 2.5", "t.rung:2:23: the count after 'repeat' must "
                        + "be a whole number from 1 to 1000000; got 2.5"),
                Arguments.of("duration 1s\nout sine(440Hz) repeat 2", "t.rung:2:17: 'repeat' needs a part with a "
                        + "known length; expected one made with 'for', e.g. (beep for 200ms) repeat 3"),
                Arguments.of("duration 1s\nout sequence(1 for 1s, sine(440Hz))", "t.rung:2:24: part 2 of "
                        + "sequence(...) has no known length; expected one made with 'for', e.g. tone for 300ms"),
                Arguments.of("duration 1s\nout notes(1, 1s, t)",
                        "t.rung:2:18: a note must be a constant such as C#5 or 440Hz; this one depends on 't'"),
                Arguments.of("duration 1s\nout notes(1, 0, A4)",
                        "t.rung:2:14: the note length must be positive; got 0"),
                Arguments.of("duration 1s\nout segments((1s, 0), (0.5s, 1))",
                        "t.rung:2:24: segment times must not decrease; expected at least 1 s here"),
                Arguments.of("duration 1s\nout sine(logsweep(0Hz, 1kHz, 1s))",
                        "t.rung:2:19: a logsweep frequency must be above 0 Hz; got 0"),
                // variables that exist only in some places
                Arguments.of("duration 1s\nout phase", "t.rung:2:5: 'phase' is only defined in a wavetable script; "
                        + "expected t (time in seconds) in a clip"),
                Arguments.of("duration 1s\nout pitch", "t.rung:2:5: 'pitch' is only defined inside the voice of "
                        + "notes(...); expected it in the first argument of notes"),
                // evaluation: the first NaN or infinity, with position and time
                Arguments.of("duration 1s\nout 1 / (t - 0.5)", "t.rung:2:7: '/' produced infinity at t = 500ms "
                        + "(sample 8000); expected a finite value, check the range of its inputs"),
                Arguments.of("duration 1s\nlet x = sqrt(0.25 - t)\nout 0.1 * sine(440Hz + 100 * x)",
                        "t.rung:2:9: 'sqrt' produced NaN (not a number) at t = 250.1ms (sample 4001); expected a "
                        + "finite value, check the range of its inputs"),
                Arguments.of("duration 1s\nout log(-1)", "t.rung:2:5: 'log' produced NaN (not a number) at t = 0s "
                        + "(sample 0); expected a finite value, check the range of its inputs"),
                Arguments.of("duration 1s\nout if sqrt(0.5 - t) > 0.1 then 1 else 0", "t.rung:2:8: 'sqrt' produced "
                        + "NaN (not a number) at t = 500.1ms (sample 8001); expected a finite value, check the range "
                        + "of its inputs"),
                // the first part is -infinity at 1 s too, but it has ended: the second part is to blame
                Arguments.of("duration 2s\nrate 1kHz\nout sequence(log(1 - t) for 1s, sqrt(t - 10ms) for 1s)",
                        "t.rung:3:33: 'sqrt' produced NaN (not a number) at t = 1s (sample 1000); expected a finite "
                        + "value, check the range of its inputs"),
                Arguments.of("wavetable 64\nout 1 / (phase - 0.5)", "t.rung:2:7: '/' produced infinity at sample 32 "
                        + "of the cycle; expected a finite value, check the range of its inputs"),
                Arguments.of("duration 1e308s\nout 1", "t.rung:1:1: the clip is more than 100000000 samples long at "
                        + "16000 Hz; expected a shorter duration or a lower rate"),
                // a bare gain where mix expects a signal would be a DC offset (a real example's mistake)
                Arguments.of("duration 1s\nout mix(sine(A4), 0.7, sine(E5), 0.3)", "t.rung:2:19: mix takes signals,"
                        + " and this input is a plain number that would be added as a DC offset; give an input's"
                        + " gain as a pair: mix((a, 0.7), (b, 0.3))"));
    }

    @ParameterizedTest
    @MethodSource("problems")
    void reportsProblemWithPosition(String source, String message) {
        ScriptError e = assertThrows(ScriptError.class,
                () -> RungScript.parse(source, "t.rung").render(Double.NaN, 1));
        assertEquals(message, e.getMessage());
        String[] where = message.split(":");
        assertEquals("t.rung", e.fileName());
        assertEquals(Integer.parseInt(where[1]), e.line());
        assertEquals(Integer.parseInt(where[2]), e.column());
    }

    @Test
    void excerptShowsTheLineWithACaretUnderTheColumn() {
        ScriptError e = assertThrows(ScriptError.class,
                () -> RungScript.parse("duration 1s\nout 0.5 * sinee(440Hz)\n", "chime.rung"));
        assertEquals(List.of("out 0.5 * sinee(440Hz)", "          ^"), e.excerpt());
    }

    @Test
    void excerptKeepsTabsSoTheCaretLinesUp() {
        ScriptError e = assertThrows(ScriptError.class,
                () -> RungScript.parse("duration 1s\n\tout\tfoo", "tabs.rung"));
        assertEquals("tabs.rung:2:6: unknown name 'foo'; expected a built-in (t, n, fs, phase, pitch, dur, pi) or "
                + "a name defined above with 'let'", e.getMessage());
        assertEquals(List.of("\tout\tfoo", "\t   \t^"), e.excerpt());
    }

    @Test
    void excerptEscapesTerminalControlsAndTheCaretFollows() {
        // ESC [ 2 J clears a terminal; echoed raw, the error line would be wiped off the screen
        ScriptError e = assertThrows(ScriptError.class,
                () -> RungScript.parse("duration 1s\nout 1 \u001b[2J + \u009b2J + foo\n", "esc.rung"));
        assertEquals(List.of("out 1 \\u001B[2J + \\u009B2J + foo", "      ^"), e.excerpt());
        ScriptError later = new ScriptError("esc.rung", 2, 13, "unknown name 'foo'", "out 1\u001b[2J + foo");
        assertEquals(List.of("out 1\\u001B[2J + foo", " ".repeat(17) + "^"), later.excerpt());
        assertTrue(later.excerpt().stream().allMatch(line -> line.chars().noneMatch(c -> c < 0x20 && c != '\t'
                || c >= 0x7f && c <= 0x9f)));
    }

    @Test
    void endOfFileErrorPointsJustAfterTheLastToken() {
        ScriptError e = assertThrows(ScriptError.class,
                () -> RungScript.parse("duration 1s\nout 2 *   # more to come\n\n", "eof.rung"));
        assertEquals("eof.rung:2:8: unexpected end of file; expected an expression", e.getMessage());
        assertEquals(List.of("out 2 *   # more to come", "       ^"), e.excerpt());
    }

    @Test
    void nanThatIsNotSelectedDoesNotStopRendering() {
        double[] y = assertDoesNotThrow(() -> Scripts.clip("if t > 2 then log(-1) else 0.5", 1, 1000));
        for (double v : y) {
            assertEquals(0.5, v, 0);
        }
    }

    @Test
    void deeplyNestedScriptIsReportedWhereTheParserGaveUp() {
        String source = "duration 1s\nout " + "(".repeat(100_000) + "1" + ")".repeat(100_000);
        ScriptError e = assertThrows(ScriptError.class, () -> RungScript.parse(source, "deep.rung"));
        // on line 2, among the parentheses; the exact column depends on the stack's size
        assertTrue(e.getMessage().matches("deep\\.rung:2:\\d+: the expression is nested too deeply here to be"
                + " read; expected fewer parentheses or operators inside one another"), e.getMessage());
        assertTrue(e.column() > 4 && e.column() <= 4 + 100_000, e.getMessage());
        assertEquals(ScriptError.EXCERPT_WIDTH + 6, e.excerpt().get(0).length(), "cut to a window, marked twice");
        assertEquals("^", e.excerpt().get(1).substring(e.excerpt().get(1).length() - 1));
    }

    @Test
    void aLongChainOfOperatorsIsReportedInsideIt() {
        String sum = String.join(" + ", java.util.Collections.nCopies(300, "t"));
        ScriptError e = assertThrows(ScriptError.class,
                () -> RungScript.parse("duration 1s\nout 0.001 * (" + sum + ")\n", "sum.rung"));
        // the chain is left-deep, the last + on top: the product is level 1, the j-th + from the end level
        // j + 1, so the 256th + from the end (the 44th of 299) is the first too deep; 4 characters per term
        int plus = 299 - 256 + 1;
        int column = "out 0.001 * (".length() + 3 + 4 * (plus - 1);
        assertEquals("sum.rung:2:" + column + ": the expression is nested more than 256 levels deep here (each"
                + " operation inside another counts, and so does each named value where it is used); expected a"
                + " flatter script: split long chains into named parts with let", e.getMessage());
        // 256 levels are fine
        String ok = String.join(" + ", java.util.Collections.nCopies(250, "t"));
        assertEquals(RungScript.Kind.CLIP, RungScript.parse("duration 1s\nout 0.001 * (" + ok + ")\n", "ok.rung")
                .kind());
    }

    @Test
    void aLongChainOfNamedValuesIsReportedAtTheLineWhereItGetsTooDeep() {
        StringBuilder b = new StringBuilder("duration 10ms\nlet a0 = t\n");
        for (int i = 1; i < 3000; i++) {
            b.append("let a").append(i).append(" = a").append(i - 1).append(" + 0.000001\n");
        }
        String source = b.append("out 0.001 * a2999\n").toString();
        ScriptError e = assertThrows(ScriptError.class, () -> RungScript.parse(source, "lets.rung"));
        // the product of out is level 1; each let adds two, its name where it is used and its '+': the '+' of
        // a(2999 - m) is level 3 + 2m, so the first too deep (level 257) is that of a2872, on line 2874
        assertEquals("lets.rung:2874:19: the expression is nested more than 256 levels deep here", e.getMessage()
                .substring(0, e.getMessage().indexOf(" (")));
        assertEquals(List.of("let a2872 = a2871 + 0.000001", " ".repeat(18) + "^"), e.excerpt());
    }
}
