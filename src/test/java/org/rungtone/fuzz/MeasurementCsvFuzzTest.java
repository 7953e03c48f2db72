package org.rungtone.fuzz;

import com.code_intelligence.jazzer.junit.FuzzTest;
import java.nio.charset.StandardCharsets;
import org.rungtone.calibrate.BoardFit;
import org.rungtone.calibrate.FitReport;
import org.rungtone.calibrate.MeasurementCsv;
import org.rungtone.calibrate.Measurements;
import org.rungtone.internal.InputError;

/**
 * Fuzz target: any text given as a measurement file either parses (and then fits, or is refused by the fit
 * with a clear message) or raises {@link InputError} whose one-line message names the file; nothing else may
 * escape, and a fit's levels must be finite. In {@code mvn verify} this replays the seed corpus in
 * {@code src/test/resources/org/rungtone/fuzz/MeasurementCsvFuzzTestInputs/}; {@code ./fuzz csv 300} fuzzes it.
 */
class MeasurementCsvFuzzTest {
    private static final String NAME = "fuzz.csv";

    @FuzzTest(maxDuration = "10m")
    void parsesOrRejectsCleanly(byte[] data) {
        String text = new String(data, StandardCharsets.UTF_8);
        // With the bit depth given (6) and taken from the file's binary column (0).
        for (int bits : new int[] {6, 0}) {
            try {
                Measurements m = MeasurementCsv.parse(text, NAME, bits);
                FitReport fit = BoardFit.fit(m, BoardFit.Settings.defaults());
                for (double v : fit.levels().levels()) {
                    if (!Double.isFinite(v)) {
                        throw new AssertionError("a fit produced a level that is not finite");
                    }
                }
            } catch (InputError e) {
                String msg = e.getMessage();
                if (msg == null || !msg.startsWith(NAME + ":") || msg.contains("\n") || msg.contains("\r")) {
                    throw new AssertionError("unclear error message: " + msg, e);
                }
            }
        }
    }
}
