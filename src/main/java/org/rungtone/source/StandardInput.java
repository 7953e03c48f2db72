package org.rungtone.source;

import java.io.IOException;
import java.io.InputStream;
import org.rungtone.internal.FileNames;
import org.rungtone.internal.InputError;

/**
 * Standard input, read whole the first time a source asks for it and held in memory, since a WAV file is read
 * by position (header, then blocks in any order and from more than one thread) and a survey reads its source
 * once per rate. The bytes are kept for as long as the same {@link System#in} stream is in place.
 */
final class StandardInput {
    private static InputStream readFrom;
    private static byte[] held;

    private StandardInput() {
    }

    /**
     * Every byte of standard input, read once.
     *
     * @throws InputError naming standard input when it cannot be read
     */
    static synchronized byte[] bytes() {
        InputStream in = System.in;
        if (in != readFrom) {
            try {
                held = in.readAllBytes();
            } catch (IOException e) {
                throw new InputError(FileNames.STANDARD_INPUT_NAME + ": cannot be read (" + e.getMessage() + ")", e);
            }
            readFrom = in;
        }
        return held;
    }
}
