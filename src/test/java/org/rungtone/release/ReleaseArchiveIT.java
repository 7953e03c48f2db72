package org.rungtone.release;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Enumeration;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import java.util.zip.ZipEntry;
import java.util.zip.ZipFile;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.testing.CToolchain;

/**
 * The release archive that {@code mvn package} built, used as a user would: unpacked with tar into an empty
 * folder, its launcher linked into a bin folder on a PATH that holds a Java runtime, bash and a few core
 * utilities but no Maven, then run by name for {@code --version} and a small build.
 */
class ReleaseArchiveIT {
    /** What the POSIX launcher of a release runs besides java. */
    private static final List<String> TOOLS = List.of("bash", "dirname", "readlink", "mktemp", "rm", "touch");

    @TempDir
    Path dir;

    private Path home;
    private Path bin;

    private static Path archive(String extension) {
        return Path.of(System.getProperty("rungtone.archive", "target/rungtone-0.1.0") + extension);
    }

    @BeforeEach
    void unpackAndLink() throws IOException {
        Path unpacked = Files.createDirectory(dir.resolve("opt"));
        CToolchain.run(unpacked, List.of("tar", "-xzf", archive(".tar.gz").toAbsolutePath().toString()));
        try (Stream<Path> s = Files.list(unpacked)) {
            home = s.findFirst().orElseThrow();
        }
        assertTrue(home.getFileName().toString().startsWith("rungtone-"), home.toString());
        bin = Files.createDirectory(dir.resolve("bin"));
        Files.createSymbolicLink(bin.resolve("java"), Path.of(System.getProperty("java.home"), "bin", "java"));
        for (String tool : TOOLS) {
            Files.createSymbolicLink(bin.resolve(tool), onPath(tool).orElseThrow(() -> new AssertionError(tool)));
        }
        // the documented install step: a link to the launcher in a folder on the PATH
        Files.createSymbolicLink(bin.resolve("rungtone"), home.resolve("rungtone"));
    }

    @Test
    void holdsTheJarBothLaunchersDocsExamplesAndLicences() throws IOException {
        assertTrue(Files.isExecutable(home.resolve("rungtone")), "the POSIX launcher is executable");
        for (String f : List.of("lib/rungtone.jar", "rungtone.cmd", "LICENSE", "README.md", "CHANGELOG.md",
                "licenses/README.txt", "licenses/TarsosDSP/LICENSE.txt", "licenses/picocli/NOTICE.txt",
                "docs/commands.md", "docs/firmware.md", "templates/avr/player.c.mustache",
                "examples/greenhouse/greenhouse.toml", "examples/firmware/README.md")) {
            assertTrue(Files.isRegularFile(home.resolve(f)), f + " missing");
        }
        String cmd = Files.readString(home.resolve("rungtone.cmd"), StandardCharsets.UTF_8);
        assertTrue(cmd.contains("\r\n") && !cmd.replace("\r\n", "").contains("\n"), "rungtone.cmd has CRLF lines");
        assertEquals(Files.size(Path.of(System.getProperty("rungtone.jar", "target/rungtone.jar"))),
                Files.size(home.resolve("lib/rungtone.jar")));
        assertEquals(files(home), zipEntries(), "the zip and the tar.gz hold the same files");
    }

    @Test
    void runsWithAJavaRuntimeAloneThroughTheLauncherOnThePath() throws IOException {
        assertFalse(Files.exists(bin.resolve("mvn")));
        CToolchain.Result version = launch("--version");
        assertEquals(0, version.exitCode(), version.output());
        assertTrue(version.output().startsWith("rungtone "), version.output());
        Path out = dir.resolve("chime");
        CToolchain.Result build = launch("build", home.resolve("examples/greenhouse/door-chime.wav").toString(),
                "--bits", "6", "--rate", "8k", "--target", "avr", "--pins", "PD2-PD7", "--cpu-clock", "16MHz",
                "--out", out.toString());
        assertEquals(0, build.exitCode(), build.output());
        assertTrue(build.output().contains("6 bits at 8kHz"), build.output());
        for (String f : List.of("door_chime.h", "door_chime.c", "door_chime_data.c", "report.txt", "preview.wav")) {
            assertTrue(Files.isRegularFile(out.resolve(f)), f + " missing");
        }
        assertFalse(Files.exists(home.resolve("target")), "a release never builds");
    }

    /** Runs the launcher by name with only {@link #bin} on the PATH, from {@link #dir}. */
    private CToolchain.Result launch(String... args) throws IOException {
        // ProcessBuilder looks a bare name up on this process's PATH: name the link in bin/ itself
        ProcessBuilder pb = new ProcessBuilder(Stream.concat(Stream.of(bin.resolve("rungtone").toString()),
                Stream.of(args)).toList()).directory(dir.toFile()).redirectErrorStream(true);
        Map<String, String> env = pb.environment();
        env.remove("JAVA_HOME");
        env.remove("RUNGTONE_JAVA_OPTS");
        env.put("PATH", bin.toString());
        Path log = Files.createTempFile(dir, "launch", ".log");
        pb.redirectOutput(log.toFile());
        try {
            int code = pb.start().waitFor();
            return new CToolchain.Result(code, Files.readString(log, StandardCharsets.UTF_8));
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(e);
        }
    }

    private static Optional<Path> onPath(String program) {
        for (String d : System.getenv("PATH").split(File.pathSeparator)) {
            Path p = Path.of(d, program);
            if (Files.isExecutable(p)) {
                return Optional.of(p);
            }
        }
        return Optional.empty();
    }

    /** Every file below the unpacked release, relative to the folder that holds it. */
    private Set<String> files(Path root) throws IOException {
        try (Stream<Path> s = Files.walk(root)) {
            return s.filter(Files::isRegularFile).filter(p -> !p.getFileName().toString().startsWith("rungtone.jsa"))
                    .map(p -> root.getParent().relativize(p).toString().replace(File.separatorChar, '/'))
                    .collect(Collectors.toCollection(TreeSet::new));
        }
    }

    private static Set<String> zipEntries() throws IOException {
        Set<String> names = new TreeSet<>();
        try (ZipFile zip = new ZipFile(archive(".zip").toFile())) {
            for (Enumeration<? extends ZipEntry> e = zip.entries(); e.hasMoreElements();) {
                ZipEntry entry = e.nextElement();
                if (!entry.isDirectory()) {
                    names.add(entry.getName());
                }
            }
        }
        return names;
    }
}
