package org.rungtone.testing;

import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Assumptions;

/**
 * Runs ATmega328P programs at 16 MHz in simavr through the harness {@code src/test/c/simavr-harness.c},
 * which the first use compiles with the host gcc into {@code target/simavr-harness/}. Without simavr's
 * headers and library (Debian: {@code simavr}, {@code libsimavr-dev}) the calling test is skipped with a
 * printed reason, or fails when the environment variable RUNGTONE_REQUIRE_CROSS is set (CI).
 */
public final class AvrSimulator {
    /** The simulated CPU clock. */
    public static final long CPU_HZ = 16_000_000L;
    /** Cycles of the interrupt response the harness adds to each interrupt (ATmega328P datasheet). */
    public static final long RESPONSE_CYCLES = 4;
    /** The part simulated unless another is named. */
    public static final String DEFAULT_MCU = "atmega328p";
    /** avr-gcc flags of the programs the harness runs. */
    public static final List<String> AVR_GCC = avrGcc(DEFAULT_MCU);

    private static final Path SOURCE = Path.of("src", "test", "c", "simavr-harness.c");
    private static final Path BUILD_DIR = Path.of("target", "simavr-harness");
    private static final List<Path> INCLUDE_DIRS = List.of(Path.of("/usr/include/simavr"),
            Path.of("/usr/local/include/simavr"));
    private static AvrSimulator built;
    private static boolean reasonPrinted;

    private final Path executable;

    private AvrSimulator(Path executable) {
        this.executable = executable;
    }

    /**
     * The harness, compiled on first use. Skips (or, with RUNGTONE_REQUIRE_CROSS, fails) the calling test
     * when gcc or simavr's development files are missing; fails when they are there but the harness does not
     * build.
     */
    public static synchronized AvrSimulator get() {
        if (built != null) {
            return built;
        }
        if (!CToolchain.available("gcc")) {
            missing("gcc is not installed");
        }
        Optional<Path> include = INCLUDE_DIRS.stream().filter(d -> Files.isRegularFile(d.resolve("sim_avr.h")))
                .findFirst();
        if (include.isEmpty()) {
            missing("simavr's headers (sim_avr.h in " + INCLUDE_DIRS + ") are not installed;"
                    + " Debian packages simavr and libsimavr-dev");
        }
        try {
            Files.createDirectories(BUILD_DIR);
            Path exe = BUILD_DIR.resolve("simavr-harness").toAbsolutePath();
            CToolchain.Result r = CToolchain.exec(BUILD_DIR, List.of("gcc", "-std=gnu99", "-O2", "-Wall", "-Wextra",
                    "-Werror", "-I" + include.get(), SOURCE.toAbsolutePath().toString(), "-lsimavr", "-o",
                    exe.toString()));
            if (r.exitCode() != 0 || !r.output().isBlank()) {
                fail("the simavr harness did not build cleanly (exit " + r.exitCode() + "):\n" + r.output());
            }
            built = new AvrSimulator(exe);
            return built;
        } catch (IOException e) {
            throw new IllegalStateException("cannot build the simavr harness", e);
        }
    }

    private static void missing(String what) {
        String required = System.getenv("RUNGTONE_REQUIRE_CROSS");
        if (required != null && !required.isEmpty()) {
            fail(what + " but RUNGTONE_REQUIRE_CROSS is set");
        }
        String reason = what + "; skipping the simulator tests (set RUNGTONE_REQUIRE_CROSS to make this fail)";
        if (!reasonPrinted) {
            System.err.println("[rungtone firmware tests] " + reason);
            reasonPrinted = true;
        }
        Assumptions.abort(reason);
    }

    /** avr-gcc flags of a program for {@code mcu} (a part the harness can simulate, e.g. atmega644p). */
    public static List<String> avrGcc(String mcu) {
        return List.of("avr-gcc", "-Os", "-mmcu=" + mcu, "-DF_CPU=" + CPU_HZ + "UL");
    }

    /**
     * Runs {@code elf} for {@code cycles} CPU cycles from reset on the default part and returns what it did;
     * fails the test when the harness reports a crash, a stop or a bad file.
     */
    public AvrTrace run(Path elf, long cycles) {
        return run(elf, cycles, DEFAULT_MCU);
    }

    /**
     * Runs {@code elf} for {@code cycles} CPU cycles from reset on {@code mcu}, which must have ports B, C and
     * D and GPIOR0 where the ATmega328P has them (atmega644p does).
     */
    public AvrTrace run(Path elf, long cycles, String mcu) {
        try {
            Path dir = elf.toAbsolutePath().getParent();
            Path out = Files.createTempFile(dir, "sim", ".out");
            Path err = Files.createTempFile(dir, "sim", ".err");
            List<String> command = new ArrayList<>(List.of(executable.toString(), elf.toAbsolutePath().toString(),
                    Long.toString(cycles), mcu));
            Process p = new ProcessBuilder(command).directory(dir.toFile()).redirectOutput(out.toFile())
                    .redirectError(err.toFile()).start();
            if (!p.waitFor(60, TimeUnit.SECONDS)) {
                p.destroyForcibly();
                fail("the simulation of " + elf + " timed out");
            }
            String output = Files.readString(out, StandardCharsets.UTF_8);
            if (p.exitValue() != 0) {
                fail("simavr-harness exited " + p.exitValue() + " on " + elf + ":\n"
                        + Files.readString(err, StandardCharsets.UTF_8));
            }
            Files.delete(out);
            Files.delete(err);
            return AvrTrace.parse(output);
        } catch (IOException e) {
            throw new IllegalStateException("cannot run the simavr harness", e);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(e);
        }
    }
}
