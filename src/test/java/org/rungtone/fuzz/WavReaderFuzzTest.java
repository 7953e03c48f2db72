package org.rungtone.fuzz;

import com.code_intelligence.jazzer.junit.FuzzTest;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.rungtone.internal.InputError;
import org.rungtone.source.WavReader;

/**
 * Fuzz target: any bytes given to the WAV reader either decode or raise {@link InputError} with a message
 * naming the file; nothing else may escape, and reading the file by range (as a build streams it) gives the
 * same samples as reading it whole. In {@code mvn verify} this replays the seed corpus in
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

    @FuzzTest(maxDuration = "30m")
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
            // Read by range, as a build streams it: the same samples, in two pieces.
            double[] whole = d.signal().unsafeSamples();
            try (WavReader.Stream s = WavReader.open(FILE, 0)) {
                int cut = whole.length / 3;
                double[] parts = new double[whole.length];
                s.read(cut, parts, cut, whole.length - cut);
                s.read(0, parts, 0, cut);
                if (!java.util.Arrays.equals(whole, parts)) {
                    throw new AssertionError("reading by range differs from reading the whole file");
                }
            }
        } catch (InputError e) {
            FuzzMessages.checkMessage(e, FILE.toString());
        }
    }
}
