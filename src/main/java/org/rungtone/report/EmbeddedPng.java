package org.rungtone.report;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Base64;
import java.util.Optional;
import org.rungtone.internal.Checks;
import org.rungtone.internal.InputError;
import org.rungtone.internal.OutputFolder;

/**
 * A PNG file read for embedding in a page: its bytes, its size from the header, and the description the
 * plot carries ({@link PngText}).
 *
 * @param bytes the file's bytes (handed over without a copy: the page only encodes them)
 * @param width width in pixels
 * @param height height in pixels
 * @param description what the plot shows, when the file says
 */
record EmbeddedPng(byte[] bytes, int width, int height, Optional<String> description) {
    private static final byte[] SIGNATURE = {(byte) 0x89, 'P', 'N', 'G', '\r', '\n', 0x1a, '\n'};

    /**
     * Reads {@code file} (from the output folder's staging area while a build writes it).
     *
     * @throws InputError when it cannot be read or is not a PNG
     */
    static EmbeddedPng read(Path file) {
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(OutputFolder.staged(file));
        } catch (IOException e) {
            throw new InputError(file + ": cannot read this plot for report.html (" + e.getClass().getSimpleName()
                    + "); rebuild to write it again", e);
        }
        boolean png = bytes.length >= 24;
        for (int i = 0; png && i < SIGNATURE.length; i++) {
            png = bytes[i] == SIGNATURE[i];
        }
        Checks.checkInput(png, "%s: not a PNG image; report.html embeds PNG plots only", file);
        return new EmbeddedPng(bytes, readInt(bytes, 16), readInt(bytes, 20), PngText.description(bytes));
    }

    /** The bytes as base64, for a {@code data:} URI. */
    String base64() {
        return Base64.getEncoder().encodeToString(bytes);
    }

    /** A big-endian 32-bit value; PNG's IHDR puts width at byte 16 and height at byte 20. */
    private static int readInt(byte[] b, int at) {
        return (b[at] & 0xff) << 24 | (b[at + 1] & 0xff) << 16 | (b[at + 2] & 0xff) << 8 | (b[at + 3] & 0xff);
    }
}
