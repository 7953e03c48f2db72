package org.rungtone.testing;

import java.io.ByteArrayOutputStream;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;

/**
 * Writes WAV test fixtures of any layout byte by byte, including broken ones, so the reader's tests do not
 * depend on the writer they check.
 */
public final class WavFixtures {
    private WavFixtures() {
    }

    /** Sample layouts the fixtures can hold. */
    public enum Layout {
        U8(1, 8), S16(1, 16), S24(1, 24), S32(1, 32), F32(3, 32), F64(3, 64);

        final int tag;
        final int bits;

        Layout(int tag, int bits) {
            this.tag = tag;
            this.bits = bits;
        }
    }

    /** Encodes interleaved samples (full scale [-1, 1]) in a layout; PCM values are rounded and clipped. */
    public static byte[] encode(Layout layout, double[] interleaved) {
        int bytes = layout.bits / 8;
        ByteBuffer b = ByteBuffer.allocate(interleaved.length * bytes).order(ByteOrder.LITTLE_ENDIAN);
        for (double v : interleaved) {
            switch (layout) {
                case U8:
                    b.put((byte) (clip(Math.round(v * 128), -128, 127) + 128));
                    break;
                case S16:
                    b.putShort((short) clip(Math.round(v * 32768), -32768, 32767));
                    break;
                case S24:
                    long s = clip(Math.round(v * 8388608), -8388608, 8388607);
                    b.put((byte) s).put((byte) (s >> 8)).put((byte) (s >> 16));
                    break;
                case S32:
                    b.putInt((int) clip(Math.round(v * 2147483648.0), Integer.MIN_VALUE, Integer.MAX_VALUE));
                    break;
                case F32:
                    b.putFloat((float) v);
                    break;
                default:
                    b.putDouble(v);
                    break;
            }
        }
        return b.array();
    }

    private static long clip(long v, long lo, long hi) {
        return Math.max(lo, Math.min(hi, v));
    }

    /** A builder for a WAV byte stream with full control over every field. */
    public static final class Builder {
        private int tag;
        private int channels = 1;
        private long rate = 8000;
        private int bits = 16;
        private Integer blockAlign;
        private boolean extensible;
        private int validBits;
        private byte[] data = new byte[0];
        private Long dataSizeField;
        private byte[] extraChunkBeforeData;
        private String riff = "RIFF";
        private boolean fmtFirst = true;

        /** Layout and samples. */
        public Builder layout(Layout l, int channels, long rate, double[] interleaved) {
            this.tag = l.tag;
            this.bits = l.bits;
            this.channels = channels;
            this.rate = rate;
            this.data = encode(l, interleaved);
            return this;
        }

        /** Raw sample bytes of any format tag and width, e.g. G.711 code words (tag 6 or 7, 8 bits). */
        public Builder raw(int formatTag, int bitsPerSample, int channelCount, long rateHz, byte[] sampleBytes) {
            this.tag = formatTag;
            this.bits = bitsPerSample;
            this.channels = channelCount;
            this.rate = rateHz;
            this.data = sampleBytes.clone();
            return this;
        }

        /** Overrides the format tag. */
        public Builder tag(int t) {
            this.tag = t;
            return this;
        }

        /** Overrides the channel count field. */
        public Builder channels(int c) {
            this.channels = c;
            return this;
        }

        /** Overrides the rate field. */
        public Builder rate(long r) {
            this.rate = r;
            return this;
        }

        /** Overrides the block-align field. */
        public Builder blockAlign(int a) {
            this.blockAlign = a;
            return this;
        }

        /** Writes WAVE_FORMAT_EXTENSIBLE with the given valid bits (the sub-format is the layout's tag). */
        public Builder extensible(int valid) {
            this.extensible = true;
            this.validBits = valid;
            return this;
        }

        /** Writes this value in the data chunk's size field instead of the true size. */
        public Builder dataSizeField(long size) {
            this.dataSizeField = size;
            return this;
        }

        /** Adds an unknown chunk (odd sizes are padded) before the data chunk. */
        public Builder extraChunk(byte[] body) {
            this.extraChunkBeforeData = body;
            return this;
        }

        /** Replaces the RIFF magic. */
        public Builder magic(String m) {
            this.riff = m;
            return this;
        }

        /** Puts the data chunk before the fmt chunk. */
        public Builder dataBeforeFmt() {
            this.fmtFirst = false;
            return this;
        }

        /** The file bytes. */
        public byte[] bytes() {
            ByteArrayOutputStream o = new ByteArrayOutputStream();
            int align = blockAlign != null ? blockAlign : channels * bits / 8;
            ByteBuffer fmt = ByteBuffer.allocate(extensible ? 40 : 16).order(ByteOrder.LITTLE_ENDIAN);
            fmt.putShort((short) (extensible ? 0xFFFE : tag)).putShort((short) channels).putInt((int) rate)
                    .putInt((int) (rate * align)).putShort((short) align).putShort((short) bits);
            if (extensible) {
                fmt.putShort((short) 22).putShort((short) validBits).putInt(channels == 2 ? 3 : 4);
                fmt.putShort((short) tag).put(new byte[] {0, 0, 0, 0, 0x10, 0, (byte) 0x80, 0, 0, (byte) 0xAA,
                    0, 0x38, (byte) 0x9B, 0x71});
            }
            ByteArrayOutputStream body = new ByteArrayOutputStream();
            body.writeBytes("WAVE".getBytes());
            byte[] fmtChunk = chunk("fmt ", fmt.array(), fmt.capacity());
            byte[] dataChunk = chunk("data", data, dataSizeField != null ? dataSizeField : data.length);
            if (fmtFirst) {
                body.writeBytes(fmtChunk);
            }
            if (extraChunkBeforeData != null) {
                body.writeBytes(chunk("LIST", extraChunkBeforeData, extraChunkBeforeData.length));
            }
            body.writeBytes(dataChunk);
            if (!fmtFirst) {
                body.writeBytes(fmtChunk);
            }
            o.writeBytes(riff.getBytes());
            o.writeBytes(le32(body.size()));
            o.writeBytes(body.toByteArray());
            return o.toByteArray();
        }

        private static byte[] chunk(String id, byte[] b, long sizeField) {
            ByteArrayOutputStream o = new ByteArrayOutputStream();
            o.writeBytes(id.getBytes());
            o.writeBytes(le32(sizeField));
            o.writeBytes(b);
            if ((b.length & 1) != 0) {
                o.write(0);
            }
            return o.toByteArray();
        }

        private static byte[] le32(long v) {
            return new byte[] {(byte) v, (byte) (v >> 8), (byte) (v >> 16), (byte) (v >> 24)};
        }
    }

    /** A new fixture builder. */
    public static Builder wav() {
        return new Builder();
    }

    /** A mono 16-bit sine, handy for end-to-end tests. */
    public static byte[] sine16(double rate, double seconds, double hz, double amplitude) {
        int n = (int) Math.round(rate * seconds);
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = amplitude * Math.sin(2 * Math.PI * hz * i / rate);
        }
        return wav().layout(Layout.S16, 1, (long) rate, x).bytes();
    }
}
