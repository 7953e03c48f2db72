package org.rungtone.source;

import java.io.EOFException;
import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.List;
import org.rungtone.internal.FileNames;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;

/**
 * Decodes WAV files (RIFF; Microsoft/IBM "Multimedia Programming Interface and Data Specifications 1.0",
 * 1991, and Microsoft "Multiple Channel Audio Data and WAVE Files" for WAVE_FORMAT_EXTENSIBLE): PCM 8-bit
 * unsigned, 16/24/32-bit signed, IEEE float 32/64, 8-bit A-law and µ-law (ITU-T G.711, {@link G711}),
 * extensible with any of these as sub-format, 1..8 channels, 1 Hz..384 kHz. Unknown chunks are skipped,
 * odd-sized chunks padded; a data size of 0xFFFFFFFF or one past the end of the file is read "to the end of
 * the file" with a warning. The path {@code -} ({@link FileNames#isStandardInput}) reads standard input,
 * held in memory ({@link StandardInput}).
 *
 * <p>The data is streamed in blocks straight into the mono result (mix-down or one channel), so the raw
 * bytes are never held whole. The JDK's {@code javax.sound.sampled} reader is not used: it refuses
 * extensible float and 64-bit float files and "unknown length" data chunks, and would need the whole file
 * decoded per channel before mixing; tests cross-check this decoder against it on the layouts it reads.
 */
public final class WavReader {
    static final int BLOCK_BYTES = 1 << 16;
    private WavReader() {
    }

    /**
     * A decoded file.
     *
     * @param format the layout
     * @param signal the mono signal (mixed down or the chosen channel)
     * @param warnings non-fatal problems found in the file
     */
    public record Decoded(WavFormat format, Signal signal, List<String> warnings) {
        /** Copies the warnings. */
        public Decoded {
            warnings = List.copyOf(warnings);
        }
    }

    /**
     * Reads {@code file} and mixes all channels down to mono by averaging.
     *
     * @throws InputError naming the file and the problem for anything that is not a readable WAV file
     */
    public static Decoded read(Path file) {
        return read(file, 0);
    }

    /**
     * Reads {@code file}; {@code channel} 0 averages all channels, 1..C picks one.
     *
     * @throws InputError naming the file and the problem for anything that is not a readable WAV file
     */
    public static Decoded read(Path file, int channel) {
        try (Stream s = open(file, channel)) {
            double[] mono = new double[s.length()];
            s.read(0, mono, 0, mono.length);
            return new Decoded(s.format(), Signal.wrap(mono, s.sampleRateHz()), s.warnings());
        }
    }

    /**
     * Reads every channel separately, for tests and tools that need them.
     *
     * @throws InputError naming the file and the problem
     */
    public static double[][] readChannels(Path file) {
        int channels;
        try (Stream s = open(file, 0)) {
            channels = s.format().channels();
        }
        double[][] out = new double[channels][];
        for (int c = 1; c <= channels; c++) {
            out[c - 1] = read(file, c).signal().unsafeSamples();
        }
        return out;
    }

    /**
     * Opens {@code file} for reading by range: the header is parsed now, the samples are decoded block by
     * block as they are read (mixed down when {@code channel} is 0, else that channel 1..C). Close it after use.
     *
     * @throws InputError naming the file and the problem for anything that is not a readable WAV file
     */
    public static Stream open(Path file, int channel) {
        WavBytes bytes = FileNames.isStandardInput(file)
                ? WavBytes.of(StandardInput.bytes(), FileNames.STANDARD_INPUT_NAME) : open(file);
        WavDecoder d = new WavDecoder(bytes);
        try {
            d.parse();
            if (channel < 0 || channel > d.format.channels()) {
                throw Setting.CHANNEL.problem("%s: has %d channel(s); %s must be 0 (mix down) or 1..%d: %d",
                        bytes.name, d.format.channels(), Setting.CHANNEL.ref(), d.format.channels(), channel);
            }
            return new Stream(d, channel);
        } catch (IOException e) {
            bytes.close();
            throw readError(bytes, e);
        } catch (RuntimeException e) {
            bytes.close();
            throw e;
        }
    }

    /** A failed read as the user's error: a file that ends early, or one the system cannot read. */
    private static InputError readError(WavBytes bytes, IOException e) {
        return e instanceof EOFException ? new InputError(bytes.name + ": ends early (truncated file)", e)
                : new InputError(bytes.name + ": cannot be read (" + e.getMessage() + ")", e);
    }

    /** An open WAV file read by range: its layout, its warnings and its mono samples on demand. */
    public static final class Stream implements SampleSource {
        private final WavDecoder decoder;
        private final int pick;

        private Stream(WavDecoder decoder, int pick) {
            this.decoder = decoder;
            this.pick = pick;
        }

        /** The layout. */
        public WavFormat format() {
            return decoder.format;
        }

        /** Non-fatal problems found in the header. */
        public List<String> warnings() {
            return List.copyOf(decoder.warnings);
        }

        @Override
        public double sampleRateHz() {
            return decoder.format.sampleRateHz();
        }

        @Override
        public int length() {
            return (int) decoder.format.frames();
        }

        @Override
        public void read(int from, double[] dst, int offset, int count) {
            org.rungtone.internal.Checks.checkArgument(from >= 0 && count >= 0 && from + count <= length(),
                    "range %d+%d outside 0..%d", from, count, length());
            try {
                decoder.decodeRange(pick, from, count, dst, offset);
            } catch (IOException e) {
                throw readError(decoder.bytes, e);
            }
        }

        @Override
        public void close() {
            decoder.bytes.close();
        }
    }

    private static WavBytes open(Path file) {
        try {
            if (Files.isDirectory(file)) {
                throw InputError.inFile(file, "is a folder, not a WAV file");
            }
            String shortName = file.getFileName() == null ? file.toString() : file.getFileName().toString();
            return WavBytes.of(FileChannel.open(file, StandardOpenOption.READ), file.toString(), shortName);
        } catch (NoSuchFileException e) {
            throw InputError.inFile(file, "no such file", e);
        } catch (AccessDeniedException e) {
            throw InputError.inFile(file, "permission denied", e);
        } catch (IOException e) {
            throw InputError.inFile(file, "cannot be opened (" + e.getMessage() + ")", e);
        }
    }
}
