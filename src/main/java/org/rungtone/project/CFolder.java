package org.rungtone.project;

import java.nio.file.Path;
import java.util.Optional;
import org.rungtone.internal.OutputFolder;
import org.rungtone.internal.Setting;
import org.rungtone.internal.SettingError;

/**
 * Where a build's C files go: the output folder, or a folder of their own ({@code project.c_out}, {@code
 * --c-out}) that is replaced as a whole exactly like the output folder ({@link OutputFolder}, role {@code c}):
 * nothing half-written, a failed build leaves it as it was, files the user put there are kept, and C files of
 * an earlier build that this one does not write are removed. Open it after the output folder; commit it
 * before.
 */
final class CFolder implements AutoCloseable {
    /** The role of the C files in their own folder (its manifest is {@code .rungtone-c-files}). */
    static final String ROLE = "c";

    private final Path dir;
    private final Optional<OutputFolder> folder;

    private CFolder(Path dir, Optional<OutputFolder> folder) {
        this.dir = dir;
        this.folder = folder;
    }

    /**
     * Opens the C folder of a build whose outputs go to {@code outDir}: {@code cOutDir}, or {@code outDir}
     * itself when none is given (or the same folder).
     *
     * @throws SettingError about {@link Setting#C_OUT} when the folder cannot be one, or it holds the output
     *     folder
     */
    static CFolder open(Path outDir, Optional<Path> cOutDir) {
        if (cOutDir.isEmpty() || same(outDir, cOutDir.get())) {
            return new CFolder(outDir, Optional.empty());
        }
        Path c = cOutDir.get();
        if (abs(outDir).startsWith(abs(c))) {
            throw Setting.C_OUT.error("%s holds the output folder %s; give the C files a folder of their own,"
                    + " or put it inside the output folder", c, outDir);
        }
        try {
            return new CFolder(c, Optional.of(OutputFolder.open(c, ROLE)));
        } catch (SettingError e) {
            throw e.setting() == Setting.OUT ? e.about(Setting.C_OUT) : e;
        }
    }

    /** The folder the C files go to, as given. */
    Path dir() {
        return dir;
    }

    /**
     * Puts the C files in place (nothing when they go to the output folder, which commits them).
     *
     * @throws SettingError about {@link Setting#C_OUT} when the folder cannot be replaced; it is then as it was
     */
    void commit() {
        try {
            folder.ifPresent(OutputFolder::commit);
        } catch (SettingError e) {
            throw e.setting() == Setting.OUT ? e.about(Setting.C_OUT) : e;
        }
    }

    @Override
    public void close() {
        folder.ifPresent(OutputFolder::close);
    }

    private static boolean same(Path a, Path b) {
        return abs(a).equals(abs(b));
    }

    private static Path abs(Path p) {
        return p.toAbsolutePath().normalize();
    }
}
