package org.rungtone.source;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.rungtone.internal.InputError;

/** Header parsing and block decoding for one WAV file (RIFF chunks, PCM, IEEE float, G.711, extensible). */
final class WavDecoder {
    private static final long UNKNOWN_SIZE = 0xFFFF_FFFFL;
    /**
     * Largest float sample accepted, in full-scale units: far above integer PCM written as floats without
     * scaling (2^32), yet small enough that sums of squares over any file stay finite (common practice, no
     * source). Larger values are damaged data; 1e308 samples would overflow the mix-down and the conditioning.
     */
    private static final double MAX_FLOAT_SAMPLE = 1e15;
    private static final byte[] GUID_TAIL = {0x00, 0x00, 0x00, 0x00, 0x10, 0x00, (byte) 0x80, 0x00, 0x00,
        (byte) 0xAA, 0x00, 0x38, (byte) 0x9B, 0x71};

    final WavBytes bytes;
    final List<String> warnings = new ArrayList<>();
    WavFormat format;
    long dataOffset;

    WavDecoder(WavBytes bytes) {
        this.bytes = bytes;
    }

    private InputError bad(String message) {
        return new InputError(bytes.name + ": " + message);
    }

    void parse() throws IOException {
        WavBytes ch = bytes;
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
                            + " reading to the end of the file", bytes.shortName, chunkSize, available));
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
        WavFormat.Encoding enc = WavFormat.Encoding.of(effective, bits);
        if (enc == null) {
            throw bad(unsupported(effective, bits));
        }
        int expectAlign = channels * bits / 8;
        if (blockAlign != expectAlign) {
            throw bad("block align is " + blockAlign + " but " + channels + " channel(s) of " + bits
                    + " bits need " + expectAlign + " (corrupt header)");
        }
        long frames = dataSize / blockAlign;
        if (dataSize % blockAlign != 0) {
            warnings.add(bytes.shortName + ": data ends with a partial frame; it was dropped");
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
    void decodeRange(int channel, long first, int count, double[] out, int off) throws IOException {
        int channels = format.channels();
        int frameBytes = format.blockAlign();
        int framesPerBlock = Math.max(1, Math.min(count, WavReader.BLOCK_BYTES / frameBytes));
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
            bytes.readFully(buf, dataOffset + frame * frameBytes);
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
            case MU_LAW:
                for (int i = 0; i < count; i++) {
                    dst[i] = G711.muLaw(b.get(i));
                }
                break;
            case A_LAW:
                for (int i = 0; i < count; i++) {
                    dst[i] = G711.aLaw(b.get(i));
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

    private static ByteBuffer readAt(WavBytes ch, long pos, int len) throws IOException {
        ByteBuffer b = ByteBuffer.allocate(len).order(ByteOrder.LITTLE_ENDIAN);
        ch.readFully(b, pos);
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

    /** Why a format tag and sample width cannot be read, with what to do. */
    private static String unsupported(int tag, int bits) {
        return switch (tag) {
            case 1 -> "PCM with " + bits + " bits per sample is not supported (8, 16, 24, 32)";
            case 3 -> "float with " + bits + " bits per sample is not supported (32, 64)";
            case 6, 7 -> (tag == 6 ? "A-law" : "mu-law") + " with " + bits + " bits per sample is not supported (8)";
            default -> String.format(Locale.ROOT, "uses format tag 0x%04X (%s); Rungtone reads PCM (1), IEEE"
                    + " float (3), A-law (6), mu-law (7) and extensible (0xFFFE); convert it to 16-bit PCM", tag,
                    switch (tag) {
                        case 2 -> "Microsoft ADPCM";
                        case 0x11 -> "IMA ADPCM";
                        case 0x55 -> "MPEG layer 3";
                        default -> "compressed or unknown";
                    });
        };
    }
}
