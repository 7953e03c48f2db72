package org.rungtone.report;

import java.io.ByteArrayOutputStream;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.Optional;
import java.util.zip.CRC32;

/**
 * A plot's description carried inside its PNG file, so that a page embedding the file can give it an alt
 * text without knowing how it was drawn. The text goes in an {@code iTXt} chunk (UTF-8) under the keyword
 * {@code Description}, one of the PNG specification's predefined keywords (W3C, "Portable Network Graphics
 * (PNG) Specification", 2nd ed., 2003, sections 11.3.4.2 and 11.3.4.5), placed right after {@code IHDR}.
 */
final class PngText {
    private static final String KEYWORD = "Description";
    private static final int SIGNATURE_BYTES = 8;
    /** Length, type and CRC around every chunk's data. */
    private static final int CHUNK_OVERHEAD = 12;

    private PngText() {
    }

    /** The PNG with {@code description} added as an iTXt chunk after IHDR. */
    static byte[] withDescription(byte[] png, String description) {
        int afterHeader = SIGNATURE_BYTES + CHUNK_OVERHEAD + ByteBuffer.wrap(png, SIGNATURE_BYTES, 4).getInt();
        byte[] body = chunkData(description);
        ByteBuffer chunk = ByteBuffer.allocate(CHUNK_OVERHEAD + body.length);
        chunk.putInt(body.length).put("iTXt".getBytes(StandardCharsets.US_ASCII)).put(body);
        CRC32 crc = new CRC32();
        crc.update(chunk.array(), 4, 4 + body.length);
        chunk.putInt((int) crc.getValue());
        ByteArrayOutputStream out = new ByteArrayOutputStream(png.length + chunk.capacity());
        out.write(png, 0, afterHeader);
        out.writeBytes(chunk.array());
        out.write(png, afterHeader, png.length - afterHeader);
        return out.toByteArray();
    }

    /** The data of the iTXt chunk that carries {@code description}. */
    static byte[] chunkData(String description) {
        ByteArrayOutputStream data = new ByteArrayOutputStream();
        data.writeBytes(KEYWORD.getBytes(StandardCharsets.ISO_8859_1));
        // keyword end, compression flag and method (none), empty language tag and translated keyword
        data.writeBytes(new byte[] {0, 0, 0, 0, 0});
        data.writeBytes(description.getBytes(StandardCharsets.UTF_8));
        return data.toByteArray();
    }

    /** The text of the first uncompressed {@code iTXt Description} chunk, if there is one. */
    static Optional<String> description(byte[] png) {
        int at = SIGNATURE_BYTES;
        while (at + CHUNK_OVERHEAD <= png.length) {
            int length = ByteBuffer.wrap(png, at, 4).getInt();
            if (length < 0 || at + CHUNK_OVERHEAD + length > png.length) {
                return Optional.empty();
            }
            String type = new String(png, at + 4, 4, StandardCharsets.US_ASCII);
            if (type.equals("iTXt")) {
                Optional<String> text = text(Arrays.copyOfRange(png, at + 8, at + 8 + length));
                if (text.isPresent()) {
                    return text;
                }
            }
            if (type.equals("IEND")) {
                return Optional.empty();
            }
            at += CHUNK_OVERHEAD + length;
        }
        return Optional.empty();
    }

    /** The text of an iTXt chunk's data when its keyword is ours and it is not compressed. */
    private static Optional<String> text(byte[] data) {
        byte[] key = KEYWORD.getBytes(StandardCharsets.ISO_8859_1);
        if (data.length < key.length + 5 || !Arrays.equals(data, 0, key.length, key, 0, key.length)
                || data[key.length] != 0 || data[key.length + 1] != 0) {
            return Optional.empty();
        }
        int at = key.length + 3;
        for (int zeros = 0; zeros < 2 && at < data.length; at++) {
            if (data[at] == 0) {
                zeros++;
            }
        }
        return Optional.of(new String(data, at, data.length - at, StandardCharsets.UTF_8));
    }
}
