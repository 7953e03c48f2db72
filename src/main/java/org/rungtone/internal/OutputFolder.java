package org.rungtone.internal;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.DirectoryNotEmptyException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileVisitResult;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.SimpleFileVisitor;
import java.nio.file.StandardCopyOption;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.stream.Stream;

/**
 * An output folder replaced as a whole. While it is open, every {@link AtomicFiles} write below the folder goes
 * to a staging folder beside it; {@link #commit()} then puts the files the user put there (those not in the
 * previous run's manifest) into the staging folder too, writes the new manifest and swaps the staging folder
 * into place. Until then the folder stays exactly as it was: an error, an interrupt (the JVM's shutdown hook
 * removes the staging folder) or a full disk leave it untouched and no staging folder behind. Files that the
 * previous run wrote and this one does not are gone after the swap; files the user put there are kept.
 *
 * <p>The staging folder is also the lock that keeps two Rungtone commands from writing the folder at once:
 * the second stops with an {@link InputError}; one left by a run that was killed is removed. A swap cut short
 * between its two renames is finished by the next open. A folder opened inside one already open is part of it:
 * its commit and close do nothing.
 */
public final class OutputFolder implements AutoCloseable {
    /** The role of a build's outputs. */
    public static final String BUILD = "build";
    /** The staging folder's owner: the process id of the command writing it. */
    private static final String OWNER = ".rungtone-owner";
    /** Most entries a folder may hold that Rungtone did not write: more means it is not an output folder. */
    static final int MAX_FOREIGN_ENTRIES = 2_000;

    private static final List<OutputFolder> ACTIVE = new CopyOnWriteArrayList<>();

    private final Path dir;
    private final String manifest;
    private final boolean nested;
    private final Path staging;
    private final Path backup;
    private final Thread cleanup;
    private boolean finished;

    private OutputFolder(Path dir) {
        this.dir = dir;
        this.manifest = null;
        this.nested = true;
        this.staging = null;
        this.backup = null;
        this.cleanup = null;
    }

    private OutputFolder(Path dir, String role, Path staging) {
        this.dir = dir;
        this.manifest = manifestName(role);
        this.nested = false;
        this.staging = staging;
        this.backup = dir.resolveSibling("." + dir.getFileName() + ".rungtone-old");
        this.cleanup = new Thread(this::abandon, "rungtone-output-cleanup");
        Runtime.getRuntime().addShutdownHook(cleanup);
        ACTIVE.add(this);
    }

    /** The manifest of a role's files, one relative path a line, kept in the folder. */
    public static String manifestName(String role) {
        return ".rungtone-" + role + "-files";
    }

    /** Opens {@code dir} for a new set of a build's outputs. */
    public static OutputFolder open(Path dir) {
        return open(dir, BUILD);
    }

    /**
     * Opens {@code dir} for a new set of outputs of one role ({@code build}, {@code survey}, {@code plan}, ...):
     * the files that other roles wrote there are kept like the user's own.
     *
     * @throws InputError when the folder cannot be one (a file, not writable, the current folder or one of its
     *     parents), or another Rungtone command is writing it
     */
    public static OutputFolder open(Path dir, String role) {
        Path abs = dir.toAbsolutePath().normalize();
        for (OutputFolder f : ACTIVE) {
            if (abs.startsWith(f.dir)) {
                return new OutputFolder(abs); // inside a folder already open: its commit covers this one
            }
        }
        AtomicFiles.checkFolderUsable(abs);
        Path cwd = Path.of("").toAbsolutePath().normalize();
        if (abs.getParent() == null || cwd.startsWith(abs)) {
            throw new SettingError(Setting.OUT, dir + ": the output folder would be replaced as a whole, and it"
                    + " holds the current folder; choose a folder of its own (" + Setting.OUT.ref() + ")", null);
        }
        Path staging = abs.resolveSibling("." + abs.getFileName() + ".rungtone-new");
        try {
            Files.createDirectories(abs.getParent());
            claim(staging, dir);
            recover(abs);
            return new OutputFolder(abs, role, staging);
        } catch (IOException e) {
            throw new SettingError(Setting.OUT, dir + ": cannot prepare the output folder (" + e.getMessage()
                    + "); choose another output folder (" + Setting.OUT.ref() + ")", e);
        }
    }

    /**
     * Makes the staging folder, which is the lock: it holds the process id of its owner. A staging folder
     * whose owner has ended is left from an interrupted run and is removed.
     */
    private static void claim(Path staging, Path dir) throws IOException {
        for (int attempt = 0; attempt < 2; attempt++) {
            try {
                Files.createDirectory(staging);
                Files.writeString(staging.resolve(OWNER), Long.toString(ProcessHandle.current().pid()));
                return;
            } catch (FileAlreadyExistsException e) {
                if (ownerAlive(staging)) {
                    throw new InputError("another Rungtone command is writing " + dir + "; wait for it to finish");
                }
                deleteTree(staging);
            }
        }
        throw new InputError("another Rungtone command is writing " + dir + "; wait for it to finish");
    }

    /** True when the staging folder's owner still runs, or it is too new to have written its owner. */
    private static boolean ownerAlive(Path staging) throws IOException {
        try {
            long pid = Long.parseLong(Files.readString(staging.resolve(OWNER)).trim());
            return pid != ProcessHandle.current().pid() && ProcessHandle.of(pid).map(ProcessHandle::isAlive)
                    .orElse(false);
        } catch (NoSuchFileException | NumberFormatException e) {
            java.nio.file.attribute.FileTime made = Files.getLastModifiedTime(staging);
            return System.currentTimeMillis() - made.toMillis() < 10_000;
        }
    }

    /** The final folder (absolute). */
    public Path dir() {
        return dir;
    }

    /**
     * Where a file written below an open folder is until the commit, for reading it back before then; any
     * other path as it is.
     */
    public static Path staged(Path target) {
        Path staged = redirect(target);
        return Files.exists(staged) ? staged : target;
    }

    /** Where a write aimed at {@code target} goes now: its place in an open folder's staging, else itself. */
    static Path redirect(Path target) {
        Path abs = target.toAbsolutePath().normalize();
        for (OutputFolder f : ACTIVE) {
            if (abs.startsWith(f.dir)) {
                return f.staging.resolve(f.dir.relativize(abs).toString());
            }
        }
        return abs;
    }

    /**
     * Puts the new outputs in place: the user's own files are carried over, the new manifest written, and the
     * staging folder swapped with the folder.
     *
     * @throws InputError when the folder cannot be replaced; it is then as it was
     */
    public synchronized void commit() {
        if (nested) {
            return;
        }
        try {
            Files.delete(staging.resolve(OWNER));
            Set<String> written = list(staging);
            Set<String> previous = readManifest(dir.resolve(manifest));
            carryOver(written, previous);
            Files.writeString(staging.resolve(manifest), manifestText(written), StandardCharsets.UTF_8);
            if (Files.exists(dir, LinkOption.NOFOLLOW_LINKS)) {
                Files.move(dir, backup, StandardCopyOption.ATOMIC_MOVE);
                Files.move(staging, dir, StandardCopyOption.ATOMIC_MOVE);
                deleteTree(backup);
            } else {
                Files.move(staging, dir, StandardCopyOption.ATOMIC_MOVE);
            }
            finished = true;
        } catch (IOException e) {
            throw new SettingError(Setting.OUT, dir + ": cannot replace the output folder (" + e.getMessage()
                    + "); it is as it was", e);
        }
    }

    /** Removes the staging folder unless committed. */
    @Override
    public void close() {
        if (nested) {
            return;
        }
        abandon();
        ACTIVE.remove(this);
        try {
            Runtime.getRuntime().removeShutdownHook(cleanup);
        } catch (IllegalStateException ignored) {
            // the JVM is shutting down: the hook runs anyway
        }
    }

    private synchronized void abandon() {
        if (!finished) {
            finished = true;
            try {
                deleteTree(staging);
            } catch (IOException ignored) {
                // a hidden staging folder is left; the next open removes it
            }
        }
    }

    /** Links (or copies) every file of the folder that no Rungtone run wrote into the staging folder. */
    private void carryOver(Set<String> written, Set<String> previous) throws IOException {
        if (!Files.isDirectory(dir)) {
            return;
        }
        List<String> foreign = new ArrayList<>();
        for (String rel : list(dir)) {
            if (!previous.contains(rel) && !written.contains(rel) && !rel.equals(manifest)) {
                foreign.add(rel);
            }
        }
        if (foreign.size() > MAX_FOREIGN_ENTRIES) {
            throw new InputError(dir + " holds " + foreign.size() + " files Rungtone did not write; an output"
                    + " folder is replaced as a whole, so choose a folder of its own (" + Setting.OUT.key() + ")");
        }
        for (String rel : foreign) {
            Path from = dir.resolve(rel);
            Path to = staging.resolve(rel);
            Files.createDirectories(to.getParent());
            try {
                Files.createLink(to, from);
            } catch (IOException | UnsupportedOperationException e) {
                Files.copy(from, to, StandardCopyOption.COPY_ATTRIBUTES, LinkOption.NOFOLLOW_LINKS);
            }
        }
    }

    /** Finishes a swap that was cut short between its renames, and removes a leftover staging folder. */
    private static void recover(Path dir) throws IOException {
        Path backup = dir.resolveSibling("." + dir.getFileName() + ".rungtone-old");
        if (Files.isDirectory(backup)) {
            if (Files.exists(dir, LinkOption.NOFOLLOW_LINKS)) {
                deleteTree(backup);
            } else {
                Files.move(backup, dir, StandardCopyOption.ATOMIC_MOVE);
            }
        }
    }

    private static Set<String> readManifest(Path file) throws IOException {
        Set<String> out = new TreeSet<>();
        try {
            for (String line : Files.readAllLines(file, StandardCharsets.UTF_8)) {
                if (!line.isBlank() && !line.startsWith("#")) {
                    out.add(line);
                }
            }
        } catch (NoSuchFileException e) {
            return out;
        }
        return out;
    }

    private static String manifestText(Set<String> files) {
        StringBuilder b = new StringBuilder("# Files the last Rungtone run wrote here; a new run replaces them."
                + " Files not listed are yours and are kept.\n");
        for (String f : files) {
            b.append(f).append('\n');
        }
        return b.toString();
    }

    /** Every regular file below {@code root}, as relative paths with forward slashes, sorted. */
    private static Set<String> list(Path root) throws IOException {
        Set<String> out = new TreeSet<>();
        if (!Files.isDirectory(root)) {
            return out;
        }
        try (Stream<Path> s = Files.walk(root)) {
            s.filter(p -> !Files.isDirectory(p, LinkOption.NOFOLLOW_LINKS))
                    .forEach(p -> out.add(root.relativize(p).toString().replace('\\', '/')));
        }
        return out;
    }

    static void deleteTree(Path root) throws IOException {
        if (!Files.exists(root, LinkOption.NOFOLLOW_LINKS)) {
            return;
        }
        Files.walkFileTree(root, new SimpleFileVisitor<>() {
            @Override
            public FileVisitResult visitFile(Path file, BasicFileAttributes attrs) throws IOException {
                Files.deleteIfExists(file);
                return FileVisitResult.CONTINUE;
            }

            @Override
            public FileVisitResult postVisitDirectory(Path d, IOException e) throws IOException {
                try {
                    Files.deleteIfExists(d);
                } catch (DirectoryNotEmptyException ignored) {
                    // a file appeared meanwhile; leave the folder
                }
                return FileVisitResult.CONTINUE;
            }
        });
    }
}
