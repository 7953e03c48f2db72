package org.rungtone.internal;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.NotDirectoryException;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

/**
 * The one way Rungtone writes files: into a temporary file beside the target, then an atomic move into
 * place, so a failed run never leaves a half-written file. Below an open {@link OutputFolder} the write goes
 * to its staging folder. Folder problems become {@link InputError}s.
 */
public final class AtomicFiles {
    /** The fix every folder message ends with; the folder may come from an option or a project file. */
    private static final String CHOOSE = "choose another output folder (" + Setting.OUT.ref() + ")";

    private AtomicFiles() {
    }

    /** Writes the content of a stream-producing action. */
    @FunctionalInterface
    public interface Writer {
        /** Writes everything to {@code out}. */
        void write(OutputStream out) throws IOException;
    }

    /**
     * Creates {@code dir} (and parents) or fails with a clear message when it cannot be a folder.
     *
     * @throws InputError when the path is a file or cannot be created or written
     */
    public static Path prepareFolder(Path folder) {
        Path dir = OutputFolder.redirect(folder);
        if (Files.exists(dir) && !Files.isDirectory(dir)) {
            throw new SettingError(Setting.OUT, folder + ": the output folder is an existing file; " + CHOOSE, null);
        }
        try {
            Files.createDirectories(dir);
        } catch (FileAlreadyExistsException | NotDirectoryException e) {
            throw new SettingError(Setting.OUT, folder + ": cannot create output folder, a part of its path is a file; "
                    + CHOOSE, e);
        } catch (IOException e) {
            throw new SettingError(Setting.OUT, folder + ": cannot create output folder (" + reason(e) + "); " + CHOOSE,
                    e);
        }
        if (!Files.isWritable(dir)) {
            throw new SettingError(Setting.OUT, folder + ": output folder is not writable; " + CHOOSE, null);
        }
        return folder;
    }

    /**
     * Checks up front that the folder can be used, without creating it; lets a command fail before any
     * work when the output can never be written.
     *
     * @throws InputError when an existing part of the path is a file or not writable
     */
    public static void checkFolderUsable(Path dir) {
        Path p = dir.toAbsolutePath().normalize();
        while (p != null && !Files.exists(p)) {
            p = p.getParent();
        }
        if (p == null) {
            return;
        }
        if (!Files.isDirectory(p)) {
            throw new SettingError(Setting.OUT, dir + ": output folder cannot be created, " + p + " is a file; "
                    + CHOOSE, null);
        }
        if (!Files.isWritable(p)) {
            throw new SettingError(Setting.OUT, dir + ": output folder is not writable (" + p + "); " + CHOOSE, null);
        }
    }

    /** Writes UTF-8 text atomically, with {@code \n} line endings as given. */
    public static void writeString(Path target, String text) {
        write(target, out -> out.write(text.getBytes(StandardCharsets.UTF_8)));
    }

    /** Writes bytes atomically. */
    public static void writeBytes(Path target, byte[] bytes) {
        write(target, out -> out.write(bytes));
    }

    /**
     * Writes through {@code writer} into a temporary file beside {@code target}, then moves it into place.
     *
     * @throws InputError when the folder cannot be written
     */
    public static void write(Path target, Writer writer) {
        Path abs = OutputFolder.redirect(target);
        Path dir = abs.getParent();
        prepareFolder(target.toAbsolutePath().getParent());
        Path tmp = null;
        try {
            // Not Files.createTempFile: that makes the file owner-only; a new file here follows the umask.
            tmp = dir.resolve("." + abs.getFileName() + "." + Long.toHexString(System.nanoTime()) + ".part");
            try (OutputStream out = new java.io.BufferedOutputStream(Files.newOutputStream(tmp,
                    java.nio.file.StandardOpenOption.CREATE_NEW, java.nio.file.StandardOpenOption.WRITE),
                    1 << 16)) {
                writer.write(out);
            }
            try {
                Files.move(tmp, abs, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING);
            }
            tmp = null;
        } catch (IOException e) {
            throw new InputError(target + ": cannot write (" + reason(e) + ")", e);
        } finally {
            if (tmp != null) {
                try {
                    Files.deleteIfExists(tmp);
                } catch (IOException ignored) {
                    // the temporary file is hidden and named .part; nothing better to do
                }
            }
        }
    }

    private static String reason(IOException e) {
        if (e instanceof AccessDeniedException) {
            return "permission denied";
        }
        if (e instanceof NoSuchFileException) {
            return "no such folder";
        }
        String m = e.getMessage();
        return m == null ? e.getClass().getSimpleName() : m;
    }
}
