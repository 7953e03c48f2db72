package org.rungtone.fuzz;

import com.code_intelligence.jazzer.junit.FuzzTest;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.rungtone.internal.InputError;
import org.rungtone.source.WavReader;

/**
 * Fuzz target: any bytes given to the WAV reader either decode or raise {@link InputError} with a message
 * naming the file; nothing else may escape. In {@code mvn verify} this replays the seed corpus in
 * {@code src/test/resources/org/rungtone/fuzz/WavReaderFuzzTestInputs/}; {@code ./fuzz wav 300} fuzzes it.
 */
class WavReaderFuzzTest {
    private static final Path FILE = scratch();

    private static Path scratch() {
        try {
            Path dir = Files.isDirectory(Path.of("/dev/shm")) ? Path.of("/dev/shm") : null;
            Path p = dir == null ? Files.createTempFile("fuzz", ".wav") : Files.createTempFile(dir, "fuzz", ".wav");
            p.toFile().deleteOnExit();
            return p;
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
    }

    @FuzzTest(maxDuration = "10m")
    void decodesOrRejectsCleanly(byte[] data) throws IOException {
        Files.write(FILE, data);
        try {
            WavReader.Decoded d = WavReader.read(FILE);
            if (d.signal().length() == 0) {
                throw new AssertionError("decoded an empty signal without an error");
            }
            for (double v : d.signal().unsafeSamples()) {
                if (!Double.isFinite(v)) {
                    throw new AssertionError("non-finite sample escaped the reader");
                }
            }
        } catch (InputError e) {
            String m = e.getMessage();
            if (m == null || !m.startsWith(FILE.toString() + ": ") || m.contains("\n")) {
                throw new AssertionError("unclear error message: " + m, e);
            }
        }
    }
}
