package org.rungtone.fuzz;

import com.code_intelligence.jazzer.junit.FuzzTest;
import java.nio.charset.StandardCharsets;
import org.rungtone.internal.InputError;
import org.rungtone.script.RungScript;
import org.rungtone.script.ScriptError;
import org.rungtone.source.Signal;

/**
 * Fuzz target: any text given to the {@code .rung} parser, checker and evaluator either renders finite samples
 * or raises {@link InputError} (normally {@link ScriptError}) with a one-line message naming the file; nothing
 * else may escape. In {@code mvn verify} this replays the seed corpus in
 * {@code src/test/resources/org/rungtone/fuzz/RungScriptFuzzTestInputs/}; {@code ./fuzz script 300} fuzzes it.
 * (Named apart from the jqwik {@code org.rungtone.script.ScriptFuzzTest} so {@code -Dtest} picks one class.)
 */
class RungScriptFuzzTest {
    private static final String FILE = "fuzz.rung";
    /** Render rate: low, so each execution stays fast. */
    private static final double RATE_HZ = 2000;
    /** Longest clip rendered per execution, in samples; longer ones are only parsed and checked. */
    private static final double MAX_CLIP_SAMPLES = 200_000;
    /** Longest wavetable rendered per execution. */
    private static final int MAX_TABLE = 65_536;

    @FuzzTest(maxDuration = "10m")
    void parsesRendersOrRejectsCleanly(byte[] data) {
        String text = new String(data, StandardCharsets.UTF_8);
        try {
            RungScript script = RungScript.parse(text, FILE);
            boolean table = script.kind() == RungScript.Kind.WAVETABLE;
            if (table ? script.tableLength() > MAX_TABLE : script.durationSeconds() * RATE_HZ > MAX_CLIP_SAMPLES) {
                return;
            }
            Signal s = script.render(RATE_HZ, 1);
            long expected = table ? script.tableLength() : (long) Math.rint(script.durationSeconds() * RATE_HZ);
            if (s.length() != expected) {
                throw new AssertionError("rendered " + s.length() + " samples, expected " + expected);
            }
            for (double v : s.unsafeSamples()) {
                if (!Double.isFinite(v)) {
                    throw new AssertionError("non-finite sample escaped the evaluator");
                }
            }
        } catch (InputError e) {
            FuzzMessages.checkMessage(e, FILE);
            if (e instanceof ScriptError se && se.excerpt().size() != 2) {
                throw new AssertionError("excerpt is not two lines: " + se.excerpt(), e);
            }
        }
    }
}
