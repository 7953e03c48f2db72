package org.rungtone.testing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.File;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Assumptions;

/**
 * The one helper through which tests run C compilers (host gcc, avr-gcc, arm-none-eabi-gcc) and the programs
 * built with them. A missing compiler skips its tests with a printed reason, unless the environment variable
 * RUNGTONE_REQUIRE_CROSS is set (CI), in which case it fails them.
 */
public final class CToolchain {
    /** Warning flags every emitted file must pass without a warning. */
    public static final List<String> STRICT = List.of("-std=c99", "-Wall", "-Wextra", "-Werror", "-pedantic");

    private CToolchain() {
    }

    /** Skips (or, with RUNGTONE_REQUIRE_CROSS, fails) the calling test when {@code compiler} is absent. */
    public static void require(String compiler) {
        if (available(compiler)) {
            return;
        }
        String required = System.getenv("RUNGTONE_REQUIRE_CROSS");
        if (required != null && !required.isEmpty()) {
            fail(compiler + " is not installed but RUNGTONE_REQUIRE_CROSS is set");
        }
        String reason = compiler + " not found on PATH; skipping (set RUNGTONE_REQUIRE_CROSS to make this fail)";
        System.err.println("[rungtone firmware tests] " + reason);
        Assumptions.assumeTrue(false, reason);
    }

    /** True when {@code program} is an executable on the PATH. */
    public static boolean available(String program) {
        String path = System.getenv("PATH");
        if (path == null) {
            return false;
        }
        for (String dir : path.split(File.pathSeparator)) {
            if (Files.isExecutable(Path.of(dir, program))) {
                return true;
            }
        }
        return false;
    }

    /** Runs a command in {@code dir}; fails the test with the command's output when it exits non-zero. */
    public static String run(Path dir, List<String> command) {
        Result r = exec(dir, command);
        if (r.exitCode() != 0) {
            fail(String.join(" ", command) + " exited " + r.exitCode() + ":\n" + r.output());
        }
        return r.output();
    }

    /** Compiles, failing on any diagnostic at all (warnings are errors, and nothing else may be printed). */
    public static void compileClean(Path dir, List<String> command) {
        String out = run(dir, command);
        assertEquals("", out.strip(), "compiler printed diagnostics");
    }

    /**
     * Compiles {@code sources} with {@code base} in two compiler runs side by side (the files are
     * independent), failing on any diagnostic.
     */
    public static void compileClean(Path dir, List<String> base, List<String> sources) {
        int half = sources.size() / 2;
        List<List<String>> parts = List.of(sources.subList(0, half), sources.subList(half, sources.size()));
        List<Result> results = parts.parallelStream().map(p -> exec(dir, cmd(base, p))).toList();
        for (int i = 0; i < results.size(); i++) {
            Result r = results.get(i);
            if (r.exitCode() != 0 || !r.output().isBlank()) {
                fail(String.join(" ", cmd(base, parts.get(i))) + " exited " + r.exitCode() + ":\n" + r.output());
            }
        }
    }

    /**
     * Runs a command in {@code dir}, waiting at most two minutes, and returns its exit code and output
     * (stdout and stderr together) whatever the exit code.
     */
    public static Result exec(Path dir, List<String> command) {
        try {
            Path log = Files.createTempFile(dir, "run", ".log");
            Process p = new ProcessBuilder(command).directory(dir.toFile()).redirectErrorStream(true)
                    .redirectOutput(log.toFile()).start();
            if (!p.waitFor(120, TimeUnit.SECONDS)) {
                p.destroyForcibly();
                fail(String.join(" ", command) + " timed out");
            }
            String out = Files.readString(log, StandardCharsets.UTF_8);
            Files.delete(log);
            return new Result(p.exitValue(), out);
        } catch (IOException e) {
            throw new IllegalStateException("cannot run " + command.get(0), e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(e);
        }
    }

    /** {@code base} followed by {@code more}. */
    public static List<String> cmd(List<String> base, List<String> more) {
        List<String> all = new ArrayList<>(base);
        all.addAll(more);
        return all;
    }

    /**
     * The outcome of a process.
     *
     * @param exitCode exit code
     * @param output stdout and stderr together
     */
    public record Result(int exitCode, String output) {
    }
}
