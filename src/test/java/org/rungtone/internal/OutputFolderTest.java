package org.rungtone.internal;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class OutputFolderTest {
    @TempDir
    Path tmp;

    /** Every file below {@code root} (relative path to its text), and nothing hidden beside it. */
    private static TreeMap<String, String> contents(Path root) throws IOException {
        TreeMap<String, String> m = new TreeMap<>();
        try (Stream<Path> s = Files.walk(root)) {
            for (Path p : s.filter(Files::isRegularFile).toList()) {
                m.put(root.relativize(p).toString(), Files.readString(p));
            }
        }
        return m;
    }

    private static void build(Path dir, List<String> files, String text) {
        try (OutputFolder f = OutputFolder.open(dir)) {
            for (String name : files) {
                AtomicFiles.writeString(dir.resolve(name), text);
            }
            f.commit();
        }
    }

    @Test
    void writesGoToTheFolderOnlyAtCommit() throws IOException {
        Path dir = tmp.resolve("out");
        try (OutputFolder f = OutputFolder.open(dir)) {
            AtomicFiles.writeString(dir.resolve("a.c"), "one");
            assertFalse(Files.exists(dir), "nothing in place before the commit");
            f.commit();
        }
        assertEquals("one", Files.readString(dir.resolve("a.c")));
        assertEquals("a.c", Files.readAllLines(dir.resolve(OutputFolder.manifestName(OutputFolder.BUILD))).get(1));
        try (Stream<Path> s = Files.list(tmp)) {
            assertEquals(List.of("out"), s.map(p -> p.getFileName().toString()).toList());
        }
    }

    @Test
    void aLaterRunRemovesItsOldFilesAndKeepsTheUsers() throws IOException {
        Path dir = tmp.resolve("out");
        build(dir, List.of("x.h", "x_data.c", "door/preview.wav", "bell/preview.wav"), "v1");
        Files.writeString(dir.resolve("notes.txt"), "mine");
        Files.writeString(dir.resolve("door/listened.txt"), "mine too");
        build(dir, List.of("x.h", "door/preview.wav"), "v2");
        TreeMap<String, String> now = contents(dir);
        now.remove(OutputFolder.manifestName(OutputFolder.BUILD));
        assertEquals("{door/listened.txt=mine too, door/preview.wav=v2, notes.txt=mine, x.h=v2}", now.toString());
        assertFalse(Files.exists(dir.resolve("bell")), "a sound removed from the project loses its folder");
    }

    @Test
    void aFailedRunLeavesTheFolderAsItWas() throws IOException {
        Path dir = tmp.resolve("out");
        build(dir, List.of("a.c", "b.c"), "old");
        TreeMap<String, String> before = contents(dir);
        RuntimeException e = assertThrows(RuntimeException.class, () -> {
            try (OutputFolder f = OutputFolder.open(dir)) {
                AtomicFiles.writeString(dir.resolve("a.c"), "new");
                throw new IllegalStateException("failed halfway");
            }
        });
        assertEquals("failed halfway", e.getMessage());
        assertEquals(before, contents(dir));
        assertFalse(Files.exists(tmp.resolve(".out.rungtone-new")));
    }

    @Test
    void aSecondWriterIsRefusedAndAKilledOnesStagingRemoved() throws Exception {
        Path dir = tmp.resolve("out");
        Path staging = tmp.resolve(".out.rungtone-new");
        Files.createDirectories(staging);
        long alive = ProcessHandle.current().parent().orElseThrow().pid();
        Files.writeString(staging.resolve(".rungtone-owner"), Long.toString(alive));
        InputError e = assertThrows(InputError.class, () -> OutputFolder.open(dir));
        assertEquals("another Rungtone command is writing " + dir + "; wait for it to finish", e.getMessage());

        Process gone = new ProcessBuilder("true").start();
        gone.waitFor();
        Files.writeString(staging.resolve(".rungtone-owner"), Long.toString(gone.pid()));
        Files.writeString(staging.resolve("half.c"), "half-written by a killed run");
        build(dir, List.of("a.c"), "whole");
        TreeMap<String, String> now = contents(dir);
        now.remove(OutputFolder.manifestName(OutputFolder.BUILD));
        assertEquals("{a.c=whole}", now.toString());
        assertFalse(Files.exists(staging));
    }

    @Test
    void aSwapCutShortIsFinishedByTheNextOpen() throws IOException {
        Path dir = tmp.resolve("out");
        build(dir, List.of("a.c"), "kept");
        Files.move(dir, tmp.resolve(".out.rungtone-old"));
        try (OutputFolder f = OutputFolder.open(dir)) {
            assertEquals("kept", Files.readString(dir.resolve("a.c")));
        }
    }

    @Test
    void theCurrentFolderOrAParentIsRefused() {
        Path cwd = Path.of("").toAbsolutePath();
        SettingError e = assertThrows(SettingError.class, () -> OutputFolder.open(cwd.getParent()));
        assertTrue(e.getMessage().contains("holds the current folder; choose a folder of its own"), e.getMessage());
    }
}
