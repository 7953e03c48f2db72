package org.rungtone.project;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.testing.Cli;

/**
 * The emitted C depends on what was built, never on where: the same sound built from two copies of its
 * source in different folders, through differently written paths, with two copies of the templates, into two
 * different output folders, gives byte-identical {@code .h} and {@code .c} files, and none of them names a
 * folder of this machine; so does a project file copied to two places and built into two folders.
 */
class ReproducibleFirmwareTest {
    @TempDir
    Path dir;

    @Test
    void aSoundBuiltFromTwoFoldersIntoTwoFoldersGivesTheSameC() throws IOException {
        Path first = Files.createDirectories(dir.resolve("alice").resolve("sounds"));
        Path second = Files.createDirectories(dir.resolve("bob").resolve("work").resolve("deep"));
        Files.copy(Path.of("examples", "greenhouse", "door-chime.wav"), first.resolve("door-chime.wav"));
        Files.copy(Path.of("examples", "greenhouse", "door-chime.wav"), second.resolve("door-chime.wav"));
        Path templatesA = copyTree(Path.of("templates"), dir.resolve("alice").resolve("templates"));
        Path templatesB = copyTree(Path.of("templates"), second.resolve("my templates"));
        Path outA = dir.resolve("out-a");
        Path outB = second.resolve("..").resolve("build").resolve("out-b");
        build(first.resolve("door-chime.wav").toString(), outA, templatesA);
        // the second through a path with a ".." in it, relative to nothing the first used
        build(second.resolve("..").resolve("deep").resolve("door-chime.wav").toString(), outB, templatesB);
        assertSameC(outA, outB, "door_chime");
    }

    @Test
    void aProjectCopiedToTwoFoldersGivesTheSameC() throws IOException {
        Path a = copyTree(Path.of("examples", "greenhouse"), dir.resolve("one").resolve("greenhouse"));
        Path b = copyTree(Path.of("examples", "greenhouse"), dir.resolve("two").resolve("x").resolve("greenhouse"));
        Path outA = dir.resolve("one-out");
        Path outB = dir.resolve("two").resolve("elsewhere");
        for (Path[] p : new Path[][] {{a, outA}, {b, outB}}) {
            Cli.Run r = Cli.run("build", p[0].resolve("greenhouse.toml").toString(), "--out", p[1].toString(),
                    "--quiet");
            assertEquals(0, r.exitCode(), r.err());
        }
        assertSameC(outA, outB, "greenhouse");
    }

    private void build(String source, Path out, Path templates) {
        Cli.Run r = Cli.run("build", source, "--target", "avr", "--cpu-clock", "16MHz", "--pins", "PD2-PD7",
                "--bits", "6", "--rate", "8k", "--storage", "packed", "--templates", templates.toString(),
                "--out", out.toString(), "--quiet");
        assertEquals(0, r.exitCode(), r.err());
    }

    /** The three C files of {@code name} are the same bytes in both folders and name no folder of the test. */
    private void assertSameC(Path a, Path b, String name) throws IOException {
        Map<String, byte[]> first = cFiles(a);
        Map<String, byte[]> second = cFiles(b);
        assertEquals(List.of(name + ".c", name + ".h", name + "_data.c"), List.copyOf(first.keySet()));
        assertEquals(first.keySet(), second.keySet());
        for (String f : first.keySet()) {
            assertArrayEquals(first.get(f), second.get(f), f + " differs between the two builds");
            String text = new String(first.get(f), StandardCharsets.UTF_8);
            assertFalse(text.contains(dir.toString()), f + " names a folder of this machine");
            assertFalse(text.contains(System.getProperty("user.dir")), f + " names the working folder");
            assertFalse(text.contains("\r"), f + " has a carriage return");
        }
    }

    private static Map<String, byte[]> cFiles(Path folder) throws IOException {
        Map<String, byte[]> m = new TreeMap<>();
        try (Stream<Path> s = Files.list(folder)) {
            for (Path p : s.toList()) {
                String n = p.getFileName().toString();
                if (n.endsWith(".c") || n.endsWith(".h")) {
                    m.put(n, Files.readAllBytes(p));
                }
            }
        }
        return m;
    }

    private static Path copyTree(Path from, Path to) throws IOException {
        try (Stream<Path> s = Files.walk(from)) {
            for (Path p : s.toList()) {
                Path target = to.resolve(from.relativize(p).toString());
                if (Files.isDirectory(p)) {
                    Files.createDirectories(target);
                } else {
                    Files.copy(p, target);
                }
            }
        }
        return to;
    }
}
