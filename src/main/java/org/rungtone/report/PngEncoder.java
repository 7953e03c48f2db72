package org.rungtone.report;

import java.awt.image.BufferedImage;
import java.awt.image.DataBufferInt;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.zip.CRC32;
import java.util.zip.Deflater;
import org.rungtone.internal.Checks;

/**
 * Encodes a drawn chart as a PNG file (W3C, "Portable Network Graphics (PNG) Specification", 2nd ed., 2003):
 * 8-bit RGB, no interlacing, every row filtered with "Up" (its difference from the row above, section 9.2),
 * the rows in one zlib stream in one {@code IDAT} chunk. Reads the image's pixels straight from its buffer and
 * deflates in memory: no image-writer lookup, no temporary file, so the first chart of a run costs little more
 * than the next. Up suits charts: most rows repeat the row above (background, frame, grid) and filter to
 * zeros. The same pixels as any other PNG encoder would store; the bytes differ.
 */
final class PngEncoder {
    private static final byte[] SIGNATURE = {(byte) 0x89, 'P', 'N', 'G', '\r', '\n', 0x1a, '\n'};
    /** Deflate level: 4 keeps a chart smaller than the JDK's writer made it and deflates at close to 1's pace. */
    private static final int LEVEL = 4;
    private static final byte FILTER_UP = 2;
    private static final int BYTES_PER_PIXEL = 3;
    private static final int CHUNK_OVERHEAD = 12;

    private PngEncoder() {
    }

    /**
     * The image as PNG bytes, with {@code description} in an {@code iTXt} chunk after {@code IHDR}
     * ({@link PngText}).
     *
     * @param image an image of type {@link BufferedImage#TYPE_INT_RGB}
     */
    static byte[] encode(BufferedImage image, String description) {
        Checks.checkArgument(image.getType() == BufferedImage.TYPE_INT_RGB, "PNG encoder takes RGB images only");
        int w = image.getWidth();
        int h = image.getHeight();
        byte[] ihdr = new byte[13];
        putInt(ihdr, 0, w);
        putInt(ihdr, 4, h);
        ihdr[8] = 8; // bits per sample
        ihdr[9] = 2; // colour type: RGB; compression, filter and interlace methods 0
        byte[] text = PngText.chunkData(description);
        byte[] idat = deflate(filtered(((DataBufferInt) image.getRaster().getDataBuffer()).getData(), w, h));
        byte[] out = new byte[SIGNATURE.length + 4 * CHUNK_OVERHEAD + ihdr.length + text.length + idat.length];
        System.arraycopy(SIGNATURE, 0, out, 0, SIGNATURE.length);
        int at = chunk(out, SIGNATURE.length, "IHDR", ihdr, ihdr.length);
        at = chunk(out, at, "iTXt", text, text.length);
        at = chunk(out, at, "IDAT", idat, idat.length);
        chunk(out, at, "IEND", idat, 0);
        return out;
    }

    /** The rows, each a filter-type byte (Up) and its R, G, B bytes less those of the pixel above. */
    private static byte[] filtered(int[] pixels, int w, int h) {
        byte[] rows = new byte[h * (1 + BYTES_PER_PIXEL * w)];
        int at = 0;
        for (int y = 0; y < h; y++) {
            rows[at++] = FILTER_UP;
            int row = y * w;
            int above = row - w;
            for (int x = 0; x < w; x++) {
                int p = pixels[row + x];
                int q = y > 0 ? pixels[above + x] : 0;
                rows[at] = (byte) ((p >> 16) - (q >> 16));
                rows[at + 1] = (byte) ((p >> 8) - (q >> 8));
                rows[at + 2] = (byte) (p - q);
                at += BYTES_PER_PIXEL;
            }
        }
        return rows;
    }

    /** {@code data} as one zlib stream. */
    private static byte[] deflate(byte[] data) {
        Deflater deflater = new Deflater(LEVEL);
        try {
            deflater.setInput(data);
            deflater.finish();
            byte[] out = new byte[data.length / 4 + 64];
            int n = 0;
            while (!deflater.finished()) {
                if (n == out.length) {
                    out = Arrays.copyOf(out, out.length * 2);
                }
                n += deflater.deflate(out, n, out.length - n);
            }
            return Arrays.copyOf(out, n);
        } finally {
            deflater.end();
        }
    }

    /** Writes a chunk (length, type, the first {@code length} bytes of data, CRC) at {@code at}; returns its end. */
    private static int chunk(byte[] out, int at, String type, byte[] data, int length) {
        putInt(out, at, length);
        byte[] t = type.getBytes(StandardCharsets.US_ASCII);
        System.arraycopy(t, 0, out, at + 4, 4);
        System.arraycopy(data, 0, out, at + 8, length);
        CRC32 crc = new CRC32();
        crc.update(out, at + 4, 4 + length);
        putInt(out, at + 8 + length, (int) crc.getValue());
        return at + CHUNK_OVERHEAD + length;
    }

    private static void putInt(byte[] b, int at, int v) {
        b[at] = (byte) (v >>> 24);
        b[at + 1] = (byte) (v >>> 16);
        b[at + 2] = (byte) (v >>> 8);
        b[at + 3] = (byte) v;
    }
}
