package org.rungtone.examples;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.testing.CToolchain;
import org.rungtone.testing.Cli;

/**
 * The kits in {@code examples/firmware/}: each README's {@code rungtone build} command (run as written, its
 * output folders moved into a temporary folder) emits the C files, which the kit then builds with its own
 * make or CMake files outside the source tree. The host kit's program must play every code of the sample table
 * through its mock port. A missing tool skips with a printed reason unless RUNGTONE_REQUIRE_CROSS is set.
 */
class FirmwareKitsTest {
    private static final Path KITS = Path.of("examples/firmware").toAbsolutePath();

    @TempDir
    Path dir;

    /** Runs the build command of {@code kit}'s README, writing into {@code dir}; returns the C folder. */
    private Path emit(String kit) throws IOException {
        Path kitDir = KITS.resolve(kit);
        Matcher m = Pattern.compile("(?m)^rungtone (build .*?)(?<!\\\\)$", Pattern.DOTALL)
                .matcher(Files.readString(kitDir.resolve("README.md")));
        assertTrue(m.find(), kit + "/README.md has no rungtone build command");
        List<String> args = new ArrayList<>(Arrays.asList(m.group(1).replace("\\\n", " ").trim().split("\\s+")));
        Path c = dir.resolve("emitted");
        args.set(1, kitDir.resolve(args.get(1)).normalize().toString());
        args.set(args.indexOf("--out") + 1, dir.resolve("report").toString());
        args.set(args.indexOf("--c-out") + 1, c.toString());
        Cli.Run r = Cli.run(args.toArray(new String[0]));
        assertEquals(0, r.exitCode(), r.err());
        return c;
    }

    @Test
    void everyFileOfTheKitsStatesItsPermissiveLicence() throws IOException {
        try (Stream<Path> s = Files.walk(KITS)) {
            List<Path> files = s.filter(Files::isRegularFile).toList();
            assertTrue(files.size() >= 13, files.toString());
            for (Path f : files) {
                assertTrue(Files.readString(f).contains("Licence of this file: MIT."), f + " has no licence header");
            }
        }
    }

    @Test
    void theHostKitPlaysEveryCodeOfTheTableThroughItsMockPort() throws IOException {
        CToolchain.require("make");
        CToolchain.require("cc");
        Path c = emit("host");
        Path build = dir.resolve("build");
        String out = CToolchain.run(KITS.resolve("host"), List.of("make", "-s", "run", "EMITTED=" + c,
                "BUILD=" + build));
        assertTrue(out.contains("ok: 12800 samples at 8000 Hz played through the port hook"), out);
        List<Integer> played = Files.readAllLines(build.resolve("codes.txt")).stream().map(Integer::parseInt)
                .toList();
        assertEquals(table(c.resolve("chime_data.c")), played, "one tick, one code of the table, in order");
    }

    @Test
    void theAvrKitBuildsWithMake() throws IOException {
        CToolchain.require("make");
        CToolchain.require("avr-gcc");
        Path c = emit("avr");
        Path build = dir.resolve("build");
        String out = CToolchain.run(KITS.resolve("avr"), List.of("make", "EMITTED=" + c, "BUILD=" + build));
        assertTrue(Files.size(build.resolve("player.hex")) > 0, out);
        // text + data of the program fit the ATmega328P's 32 KiB of flash (datasheet)
        Matcher size = Pattern.compile("(?m)^\\s*(\\d+)\\s+(\\d+)\\s+\\d+\\s+\\d+\\s+\\p{XDigit}+\\s+\\S*player\\.elf")
                .matcher(out);
        assertTrue(size.find(), out);
        assertTrue(Long.parseLong(size.group(1)) + Long.parseLong(size.group(2)) <= 32 * 1024, out);
    }

    @Test
    void theCortexmKitBuildsWithCmakeAndItsToolchainFile() throws IOException {
        CToolchain.require("cmake");
        CToolchain.require("arm-none-eabi-gcc");
        Path c = emit("cortexm");
        Path build = dir.resolve("cmake");
        Path kit = KITS.resolve("cortexm");
        CToolchain.run(dir, List.of("cmake", "-S", kit.toString(), "-B", build.toString(),
                "-DCMAKE_TOOLCHAIN_FILE=" + kit.resolve("arm-none-eabi.cmake"), "-DRUNGTONE_C_DIR=" + c));
        CToolchain.run(dir, List.of("cmake", "--build", build.toString()));
        assertTrue(Files.size(build.resolve("player.bin")) > 0);
        // the player's SysTick handler, not the start-up file's default, takes the SysTick entry
        String symbols = CToolchain.run(dir, List.of("arm-none-eabi-nm", build.resolve("player.elf").toString()));
        assertNotEquals(address(symbols, "Default_Handler"), address(symbols, "SysTick_Handler"), symbols);
    }

    private static String address(String nm, String symbol) {
        Matcher m = Pattern.compile("(?m)^(\\p{XDigit}+) [A-Za-z] " + symbol + "$").matcher(nm);
        assertTrue(m.find(), symbol + " missing:\n" + nm);
        return m.group(1);
    }

    /** The codes of the emitted {@code chime_samples} table, in order. */
    private static List<Integer> table(Path data) throws IOException {
        String text = Files.readString(data);
        int start = text.indexOf("{", text.indexOf("chime_samples["));
        String body = text.substring(start + 1, text.indexOf("};", start));
        return Stream.of(body.split(",")).map(String::trim).filter(s -> !s.isEmpty())
                .map(s -> Integer.decode(s.replaceAll("[uU]$", ""))).toList();
    }
}
