package org.rungtone.internal;

import java.nio.file.Path;

/**
 * What a file's name says: its stem names a sound, a board or an output folder by default; the path {@code -}
 * stands for standard input.
 */
public final class FileNames {
    /** How reports and messages name standard input. */
    public static final String STANDARD_INPUT_NAME = "standard input";

    private FileNames() {
    }

    /** True for the path {@code -}: the source is read from standard input. */
    public static boolean isStandardInput(Path p) {
        return p.getNameCount() == 1 && !p.isAbsolute() && p.toString().equals("-");
    }

    /** The name reports give a source: its file name, or "standard input" for {@code -}. */
    public static String display(Path p) {
        if (isStandardInput(p)) {
            return STANDARD_INPUT_NAME;
        }
        return p.getFileName() == null ? p.toString() : p.getFileName().toString();
    }

    /**
     * The file name without its extension, or {@code fallback} for a path without a name and for standard
     * input (which has none).
     */
    public static String stem(Path p, String fallback) {
        String f = p.getFileName() == null || isStandardInput(p) ? fallback : p.getFileName().toString();
        int dot = f.lastIndexOf('.');
        return dot > 0 ? f.substring(0, dot) : f;
    }
}
