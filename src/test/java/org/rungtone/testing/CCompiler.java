package org.rungtone.testing;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;

/** Runs a C compiler and programs built with it, for tests of the emitted code. */
public final class CCompiler {
    private CCompiler() {
    }

    /**
     * The outcome of a process.
     *
     * @param exitCode exit code
     * @param output stdout and stderr together
     */
    public record Result(int exitCode, String output) {
    }

    /** Runs a command in {@code dir}, waiting at most two minutes. */
    public static Result run(Path dir, List<String> command) throws IOException, InterruptedException {
        ProcessBuilder pb = new ProcessBuilder(command).directory(dir.toFile()).redirectErrorStream(true);
        Process p = pb.start();
        byte[] out = p.getInputStream().readAllBytes();
        if (!p.waitFor(2, TimeUnit.MINUTES)) {
            p.destroyForcibly();
            throw new IOException("timed out: " + command);
        }
        return new Result(p.exitValue(), new String(out, StandardCharsets.UTF_8));
    }

    /** True when {@code tool} can be started. */
    public static boolean available(String tool) {
        try {
            Process p = new ProcessBuilder(tool, "--version").redirectErrorStream(true).start();
            p.getInputStream().readAllBytes();
            return p.waitFor(30, TimeUnit.SECONDS) && p.exitValue() == 0;
        } catch (IOException | InterruptedException e) {
            return false;
        }
    }

    /** Host gcc with the strict C99 flags the emitted code must pass. */
    public static List<String> strictGcc(String... files) {
        List<String> cmd = new ArrayList<>(List.of("gcc", "-std=c99", "-Wall", "-Wextra", "-Werror", "-pedantic",
                "-O1"));
        cmd.addAll(List.of(files));
        return cmd;
    }
}
