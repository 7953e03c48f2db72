package org.rungtone.internal;

import java.nio.file.Path;

/** What a file's name says: its stem names a sound, a board or an output folder by default. */
public final class FileNames {
    private FileNames() {
    }

    /** The file name without its extension, or {@code fallback} for a path without a name. */
    public static String stem(Path p, String fallback) {
        String f = p.getFileName() == null ? fallback : p.getFileName().toString();
        int dot = f.lastIndexOf('.');
        return dot > 0 ? f.substring(0, dot) : f;
    }
}
