package org.rungtone.source;

import java.io.EOFException;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.file.AccessDeniedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;

/**
 * Decodes WAV files (RIFF; Microsoft/IBM "Multimedia Programming Interface and Data Specifications 1.0",
 * 1991, and Microsoft "Multiple Channel Audio Data and WAVE Files" for WAVE_FORMAT_EXTENSIBLE): PCM 8-bit
 * unsigned, 16/24/32-bit signed, IEEE float 32/64, extensible with PCM or float sub-format, 1..8 channels,
 * 1 Hz..384 kHz. Unknown chunks are skipped, odd-sized chunks padded; a data size of 0xFFFFFFFF or one
 * past the end of the file is read "to the end of the file" with a warning.
 *
 * <p>The data is streamed in blocks straight into the mono result (mix-down or one channel), so the raw
 * bytes are never held whole. The JDK's {@code javax.sound.sampled} reader is not used: it refuses
 * extensible float and 64-bit float files and "unknown length" data chunks, and would need the whole file
 * decoded per channel before mixing; tests cross-check this decoder against it on the layouts it reads.
 */
public final class WavReader {
    private static final int BLOCK_BYTES = 1 << 16;
    private static final long UNKNOWN_SIZE = 0xFFFF_FFFFL;
    /**
     * Largest float sample accepted, in full-scale units: far above integer PCM written as floats without
     * scaling (2^32), yet small enough that sums of squares over any file stay finite (common practice, no
     * source). Larger values are damaged data; 1e308 samples would overflow the mix-down and the conditioning.
     */
    private static final double MAX_FLOAT_SAMPLE = 1e15;
    private static final byte[] GUID_TAIL = {0x00, 0x00, 0x00, 0x00, 0x10, 0x00, (byte) 0x80, 0x00, 0x00,
        (byte) 0xAA, 0x00, 0x38, (byte) 0x9B, 0x71};

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
        Decoder d = new Decoder(file);
        FileChannel ch = open(file);
        try {
            d.parse(ch);
            if (channel < 0 || channel > d.format.channels()) {
                throw Setting.CHANNEL.problem("%s: has %d channel(s); %s must be 0 (mix down) or 1..%d: %d", file,
                        d.format.channels(), Setting.CHANNEL.ref(), d.format.channels(), channel);
            }
            return new Stream(d, ch, channel);
        } catch (IOException e) {
            closeQuietly(ch);
            throw readError(file, e);
        } catch (RuntimeException e) {
            closeQuietly(ch);
            throw e;
        }
    }

    /** A failed read as the user's error: a file that ends early, or one the system cannot read. */
    private static InputError readError(Path file, IOException e) {
        return e instanceof EOFException ? InputError.inFile(file, "ends early (truncated file)", e)
                : InputError.inFile(file, "cannot be read (" + e.getMessage() + ")", e);
    }

    private static void closeQuietly(FileChannel ch) {
        try {
            ch.close();
        } catch (IOException ignored) {
            // nothing was written; the read error that led here is the one to report
        }
    }

    /** An open WAV file read by range: its layout, its warnings and its mono samples on demand. */
    public static final class Stream implements SampleSource {
        private final Decoder decoder;
        private final FileChannel channel;
        private final int pick;

        private Stream(Decoder decoder, FileChannel channel, int pick) {
            this.decoder = decoder;
            this.channel = channel;
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
                decoder.decodeRange(channel, pick, from, count, dst, offset);
            } catch (IOException e) {
                throw readError(decoder.file, e);
            }
        }

        @Override
        public void close() {
            closeQuietly(channel);
        }
    }

    private static FileChannel open(Path file) {
        try {
            if (Files.isDirectory(file)) {
                throw InputError.inFile(file, "is a folder, not a WAV file");
            }
            return FileChannel.open(file, StandardOpenOption.READ);
        } catch (NoSuchFileException e) {
            throw InputError.inFile(file, "no such file", e);
        } catch (AccessDeniedException e) {
            throw InputError.inFile(file, "permission denied", e);
        } catch (IOException e) {
            throw InputError.inFile(file, "cannot be opened (" + e.getMessage() + ")", e);
        }
    }

    /** Header parsing and block decoding for one file. */
    private static final class Decoder {
        private final Path file;
        private final List<String> warnings = new ArrayList<>();
        private WavFormat format;
        private long dataOffset;

        Decoder(Path file) {
            this.file = file;
        }

        private InputError bad(String message) {
            return InputError.inFile(file, message);
        }

        void parse(FileChannel ch) throws IOException {
            long size = ch.size();
            if (size < 12) {
                throw bad("is too short to be a WAV file (" + size + " bytes; a RIFF header needs 12)");
            }
            ByteBuffer head = readAt(ch, 0, 12);
            String riff = fourCc(head, 0);
            if (!riff.equals("RIFF")) {
                if (riff.equals("RF64") || riff.equals("RIFX")) {
                    throw bad("is a " + riff + " file; convert it to a plain RIFF WAV (little-endian)");
                }
                throw bad("is not a WAV file (no RIFF header at byte 0)");
            }
            if (!fourCc(head, 8).equals("WAVE")) {
                throw bad("is a RIFF file but not WAVE (form type '" + printable(fourCc(head, 8)) + "')");
            }
            long pos = 12;
            ByteBuffer fmt = null;
            long fmtPos = 0;
            long dataSize = -1;
            while (pos + 8 <= size) {
                ByteBuffer hdr = readAt(ch, pos, 8);
                String id = fourCc(hdr, 0);
                long chunkSize = hdr.getInt(4) & 0xFFFF_FFFFL;
                long body = pos + 8;
                if (id.equals("fmt ")) {
                    if (chunkSize < 16 || body + chunkSize > size) {
                        throw bad("fmt chunk at byte " + pos + " is truncated or too short (" + chunkSize
                                + " bytes)");
                    }
                    fmt = readAt(ch, body, (int) Math.min(chunkSize, 64));
                    fmtPos = pos;
                } else if (id.equals("data")) {
                    if (fmt == null) {
                        throw bad("data chunk at byte " + pos + " comes before any fmt chunk");
                    }
                    dataOffset = body;
                    long available = size - body;
                    if (chunkSize == UNKNOWN_SIZE || chunkSize > available) {
                        warnings.add(String.format(Locale.ROOT, "%s: data chunk says %d bytes but %d remain;"
                                + " reading to the end of the file", file.getFileName(), chunkSize, available));
                        dataSize = available;
                    } else {
                        dataSize = chunkSize;
                    }
                    break;
                }
                pos = body + chunkSize + (chunkSize & 1);
            }
            if (fmt == null) {
                throw bad("has no fmt chunk (truncated header?)");
            }
            if (dataSize < 0) {
                throw bad("has no data chunk (truncated file?)");
            }
            format = parseFormat(fmt, fmtPos, dataSize);
        }

        private WavFormat parseFormat(ByteBuffer f, long at, long dataSize) {
            int tag = f.getShort(0) & 0xFFFF;
            int channels = f.getShort(2) & 0xFFFF;
            long rate = f.getInt(4) & 0xFFFF_FFFFL;
            int blockAlign = f.getShort(12) & 0xFFFF;
            int bits = f.getShort(14) & 0xFFFF;
            int validBits = bits;
            int effective = tag;
            if (tag == 0xFFFE) {
                if (f.limit() < 40) {
                    throw bad("extensible fmt chunk at byte " + at + " is shorter than 40 bytes");
                }
                validBits = f.getShort(18) & 0xFFFF;
                effective = f.getShort(24) & 0xFFFF;
                for (int i = 0; i < GUID_TAIL.length; i++) {
                    if (f.get(26 + i) != GUID_TAIL[i]) {
                        throw bad("extensible sub-format GUID is not a standard PCM or float one");
                    }
                }
                if (validBits == 0 || validBits > bits) {
                    validBits = bits;
                }
            }
            if (channels == 0) {
                throw bad("says it has 0 channels");
            }
            if (channels > 8) {
                throw bad("has " + channels + " channels; Rungtone reads 1..8");
            }
            if (rate < 1 || rate > 384_000) {
                throw bad("has an unusable sample rate of " + rate + " Hz (1 Hz..384 kHz)");
            }
            WavFormat.Encoding enc;
            if (effective == 1) {
                switch (bits) {
                    case 8:
                        enc = WavFormat.Encoding.PCM_U8;
                        break;
                    case 16:
                        enc = WavFormat.Encoding.PCM_S16;
                        break;
                    case 24:
                        enc = WavFormat.Encoding.PCM_S24;
                        break;
                    case 32:
                        enc = WavFormat.Encoding.PCM_S32;
                        break;
                    default:
                        throw bad("PCM with " + bits + " bits per sample is not supported (8, 16, 24, 32)");
                }
            } else if (effective == 3) {
                if (bits == 32) {
                    enc = WavFormat.Encoding.FLOAT32;
                } else if (bits == 64) {
                    enc = WavFormat.Encoding.FLOAT64;
                } else {
                    throw bad("float with " + bits + " bits per sample is not supported (32, 64)");
                }
            } else {
                throw bad(String.format(Locale.ROOT, "uses format tag 0x%04X (%s); Rungtone reads PCM (1),"
                        + " IEEE float (3) and extensible (0xFFFE); convert it to 16-bit PCM", effective,
                        tagName(effective)));
            }
            int expectAlign = channels * bits / 8;
            if (blockAlign != expectAlign) {
                throw bad("block align is " + blockAlign + " but " + channels + " channel(s) of " + bits
                        + " bits need " + expectAlign + " (corrupt header)");
            }
            long frames = dataSize / blockAlign;
            if (dataSize % blockAlign != 0) {
                warnings.add(file.getFileName() + ": data ends with a partial frame; it was dropped");
            }
            if (frames == 0) {
                throw bad("has no audio samples (empty data chunk)");
            }
            if (frames > Integer.MAX_VALUE - 16) {
                throw bad("is too long (" + frames + " frames); split it");
            }
            return new WavFormat(tag, enc, channels, (int) rate, bits, validBits, blockAlign, frames);
        }

        /** Decodes frames {@code first .. first + count - 1} into {@code out[off ..]}, checking every sample. */
        void decodeRange(FileChannel ch, int channel, long first, int count, double[] out, int off)
                throws IOException {
            int channels = format.channels();
            int frameBytes = format.blockAlign();
            int framesPerBlock = Math.max(1, Math.min(count, BLOCK_BYTES / frameBytes));
            ByteBuffer buf = ByteBuffer.allocate(framesPerBlock * frameBytes).order(ByteOrder.LITTLE_ENDIAN);
            double mixScale = channel == 0 ? 1.0 / channels : 1.0;
            int c0 = channel == 0 ? 0 : channel - 1;
            int c1 = channel == 0 ? channels : channel;
            long frame = first;
            long end = first + count;
            double[] raw = new double[framesPerBlock * channels];
            boolean checked = format.encoding() == WavFormat.Encoding.FLOAT32
                    || format.encoding() == WavFormat.Encoding.FLOAT64;
            while (frame < end) {
                int n = (int) Math.min(framesPerBlock, end - frame);
                buf.clear().limit(n * frameBytes);
                long at = dataOffset + frame * frameBytes;
                while (buf.hasRemaining()) {
                    int r = ch.read(buf, at + buf.position());
                    if (r < 0) {
                        throw new EOFException();
                    }
                }
                int o = off + (int) (frame - first);
                samples(buf, n * channels, raw);
                for (int i = 0; i < n; i++) {
                    double acc = 0;
                    int base = i * channels;
                    for (int c = c0; c < c1; c++) {
                        double v = raw[base + c];
                        if (checked && !(Math.abs(v) <= MAX_FLOAT_SAMPLE)) {
                            throw damaged(frame + i, c, v);
                        }
                        acc += v;
                    }
                    out[o + i] = acc * mixScale;
                }
                frame += n;
            }
        }

        /**
         * The first {@code count} interleaved samples of {@code b} in full-scale units (bulk views if possible;
         * scaling multiplies by the exact power-of-two reciprocal, which equals dividing).
         */
        private void samples(ByteBuffer b, int count, double[] dst) {
            b.position(0);
            switch (format.encoding()) {
                case PCM_U8:
                    for (int i = 0; i < count; i++) {
                        dst[i] = ((b.get(i) & 0xFF) - 128) * (1.0 / 128);
                    }
                    break;
                case PCM_S16: {
                    short[] v = new short[count];
                    b.asShortBuffer().get(v, 0, count);
                    for (int i = 0; i < count; i++) {
                        dst[i] = v[i] * (1.0 / 32768);
                    }
                    break;
                }
                case PCM_S24:
                    for (int i = 0; i < count; i++) {
                        int at = 3 * i;
                        int v = (b.get(at) & 0xFF) | ((b.get(at + 1) & 0xFF) << 8) | (b.get(at + 2) << 16);
                        dst[i] = v * (1.0 / 8388608);
                    }
                    break;
                case PCM_S32: {
                    int[] v = new int[count];
                    b.asIntBuffer().get(v, 0, count);
                    for (int i = 0; i < count; i++) {
                        dst[i] = v[i] * (1.0 / 2147483648L);
                    }
                    break;
                }
                case FLOAT32: {
                    float[] v = new float[count];
                    b.asFloatBuffer().get(v, 0, count);
                    for (int i = 0; i < count; i++) {
                        dst[i] = v[i];
                    }
                    break;
                }
                default:
                    b.asDoubleBuffer().get(dst, 0, count);
                    break;
            }
        }

        private InputError damaged(long idx, int c, double v) {
            String what = Double.isNaN(v) ? "NaN" : Double.isInfinite(v) ? "infinite"
                    : String.format(Locale.ROOT, "%.3g, far beyond full scale (1.0)", v);
            return bad(String.format(Locale.ROOT, "sample %d of channel %d (at %.3f s) is %s;"
                    + " the file is damaged or was written without clipping", idx, c + 1,
                    idx / (double) format.sampleRateHz(), what));
        }

        private static ByteBuffer readAt(FileChannel ch, long pos, int len) throws IOException {
            ByteBuffer b = ByteBuffer.allocate(len).order(ByteOrder.LITTLE_ENDIAN);
            while (b.hasRemaining()) {
                if (ch.read(b, pos + b.position()) < 0) {
                    throw new EOFException();
                }
            }
            return b.flip();
        }

        private static String fourCc(ByteBuffer b, int at) {
            char[] c = new char[4];
            for (int i = 0; i < 4; i++) {
                c[i] = (char) (b.get(at + i) & 0xFF);
            }
            return new String(c);
        }

        private static String printable(String s) {
            return s.replaceAll("[^\\x20-\\x7e]", "?");
        }

        private static String tagName(int tag) {
            switch (tag) {
                case 2:
                    return "Microsoft ADPCM";
                case 6:
                    return "A-law";
                case 7:
                    return "mu-law";
                case 0x11:
                    return "IMA ADPCM";
                case 0x55:
                    return "MPEG layer 3";
                default:
                    return "compressed or unknown";
            }
        }
    }
}
