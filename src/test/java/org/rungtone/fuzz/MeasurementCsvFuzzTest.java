package org.rungtone.fuzz;

import com.code_intelligence.jazzer.junit.FuzzTest;
import java.nio.charset.StandardCharsets;
import org.rungtone.calibrate.MeasurementCsv;
import org.rungtone.calibrate.Measurements;
import org.rungtone.calibrate.Reading;
import org.rungtone.internal.InputError;

/**
 * Fuzz target of the measurement-file reader alone: any text, read with the bit depth given and with the bit
 * depth taken from the file's binary column, either parses into readings with finite volts and codes in range
 * or raises {@link InputError} whose one-line message starts with the file name and a colon; nothing else may
 * escape. The fit is fuzzed apart by {@link BoardFitFuzzTest}, so this target runs fast enough for millions of
 * inputs. In {@code mvn verify} this replays the seed corpus in
 * {@code src/test/resources/org/rungtone/fuzz/MeasurementCsvFuzzTestInputs/} (files named
 * {@code regression-*} are inputs that once escaped); {@code ./fuzz csv 600} fuzzes it.
 */
class MeasurementCsvFuzzTest {
    private static final String NAME = "fuzz.csv";

    @FuzzTest(maxDuration = "30m")
    void parsesOrRejectsCleanly(byte[] data) {
        String text = new String(data, StandardCharsets.UTF_8);
        // With the bit depth given (6) and taken from the file's binary column (0).
        for (int bits : new int[] {6, 0}) {
            try {
                check(MeasurementCsv.parse(text, NAME, bits), bits);
            } catch (InputError e) {
                FuzzMessages.checkMessage(e, NAME);
            }
        }
    }

    private static void check(Measurements m, int bits) {
        if (m.bits() < 1 || m.bits() > 16 || (bits != 0 && m.bits() != bits)) {
            throw new AssertionError("accepted a file with a bit depth of " + m.bits());
        }
        for (Reading r : m.readings()) {
            if (r.code() < 0 || r.code() >= 1 << m.bits() || !Double.isFinite(r.volts())
                    || Math.abs(r.volts()) > MeasurementCsv.MAX_VOLTS) {
                throw new AssertionError("accepted a reading out of range: " + r);
            }
        }
    }
}
