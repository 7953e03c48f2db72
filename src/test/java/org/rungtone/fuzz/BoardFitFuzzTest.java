package org.rungtone.fuzz;

import com.code_intelligence.jazzer.junit.FuzzTest;
import java.nio.charset.StandardCharsets;
import org.rungtone.calibrate.BoardFit;
import org.rungtone.calibrate.FitReport;
import org.rungtone.calibrate.MeasurementCsv;
import org.rungtone.calibrate.Measurements;
import org.rungtone.internal.InputError;

/**
 * Fuzz target of the board fit behind the measurement-file reader: any text that reads as measurements
 * (with the bit depth given and taken from the file's binary column) either fits to finite levels or is
 * refused with an {@link InputError} whose one-line message names the file; nothing else may escape. The
 * least-squares fit is far slower than the reader, so this target runs apart from
 * {@link MeasurementCsvFuzzTest}. In {@code mvn verify} this replays the seed corpus in
 * {@code src/test/resources/org/rungtone/fuzz/BoardFitFuzzTestInputs/}; {@code ./fuzz fit 300} fuzzes it.
 */
class BoardFitFuzzTest {
    private static final String NAME = "fuzz.csv";

    @FuzzTest(maxDuration = "30m")
    void fitsOrRejectsCleanly(byte[] data) {
        String text = new String(data, StandardCharsets.UTF_8);
        for (int bits : new int[] {6, 0}) {
            Measurements m;
            try {
                m = MeasurementCsv.parse(text, NAME, bits);
            } catch (InputError e) {
                // The reader's refusals are MeasurementCsvFuzzTest's concern.
                continue;
            }
            try {
                FitReport fit = BoardFit.fit(m, BoardFit.Settings.defaults());
                for (double v : fit.levels().levels()) {
                    if (!Double.isFinite(v)) {
                        throw new AssertionError("a fit produced a level that is not finite");
                    }
                }
            } catch (InputError e) {
                FuzzMessages.checkMessage(e, NAME);
            }
        }
    }
}
