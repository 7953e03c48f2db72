package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.quantize.Codes;
import org.rungtone.testing.CToolchain;

/**
 * Every family's output for contiguous, scattered, multi-port and wide scattered pin maps (plus forced
 * strategies), packed and unpacked storage, and every engine compiles warning-free with
 * {@code -std=c99 -Wall -Wextra -Werror -pedantic}: generic with the host gcc, avr with avr-gcc for the
 * ATmega328P, cortexm with arm-none-eabi-gcc for the Cortex-M3 (freestanding). Each family's combinations
 * compile in one compiler run (distinct symbol prefixes); one player per family is also linked.
 */
class CompileMatrixTest {
    @TempDir
    Path dir;

    /** A pin case: map, port width, forced strategy. */
    private record PinCase(String pins, int width, PinStrategy strategy) {
    }

    private static List<PinCase> pinCases(TargetFamily family) {
        List<PinCase> out = new ArrayList<>();
        if (family == TargetFamily.CORTEXM) {
            out.add(new PinCase("B0-B5", 16, PinStrategy.AUTO));
            out.add(new PinCase("A3,A7,C0,C1,B2,B1", 16, PinStrategy.AUTO));
            out.add(new PinCase("B10-B15,C0,C1", 16, PinStrategy.AUTO));
            out.add(new PinCase("A0-A5,B15,B13,B3,B1,C4,C0", 16, PinStrategy.AUTO));
        } else if (family == TargetFamily.AVR) {
            // ports B, C and D, as on the ATmega328P
            out.add(new PinCase("B0-B5", 8, PinStrategy.AUTO));
            out.add(new PinCase("D2,D7,C0,C1,B2,B1", 8, PinStrategy.AUTO));
            out.add(new PinCase("B2-B5,D6,D7", 8, PinStrategy.AUTO));
            out.add(new PinCase("D0-D5,B7,B5,B3,B1,C4,C0", 8, PinStrategy.AUTO));
            out.add(new PinCase("D0-D7", 8, PinStrategy.AUTO));
        } else {
            out.add(new PinCase("B0-B5", 8, PinStrategy.AUTO));
            out.add(new PinCase("A3,A7,C0,C1,B2,B1", 8, PinStrategy.AUTO));
            out.add(new PinCase("B2-B5,D6,D7", 8, PinStrategy.AUTO));
            out.add(new PinCase("A0-A5,B7,B5,B3,B1,C4,C0", 8, PinStrategy.AUTO));
        }
        out.add(new PinCase(out.get(0).pins(), out.get(0).width(), PinStrategy.TABLE));
        out.add(new PinCase(out.get(1).pins(), out.get(1).width(), PinStrategy.SCATTER));
        if (family == TargetFamily.GENERIC) {
            out.add(new PinCase("A26-A31,B0,B31", 32, PinStrategy.AUTO));
            out.add(new PinCase("A26-A31,B0,B31", 32, PinStrategy.TABLE));
            out.add(new PinCase("1.0-1.3,2.7,2.6", 16, PinStrategy.AUTO));
        }
        return out;
    }

    private static List<TimerKind> timers(TargetFamily family) {
        return family.timers().isEmpty() ? List.of(TimerKind.TIM16) : family.timers();
    }

    private static String buttonPin(TargetFamily family, PinCase pc) {
        if (family == TargetFamily.AVR) {
            return "C5";
        }
        return pc.pins().startsWith("1.") ? "3.0" : "E5";
    }

    /** Renders every combination into {@code dir}; returns the C files. */
    private List<String> renderAll(TargetFamily family) {
        List<String> sources = new ArrayList<>();
        int n = 0;
        for (PinCase pc : pinCases(family)) {
            int bits = PinMap.parse(pc.pins(), pc.width()).bits();
            for (SampleStorage storage : SampleStorage.values()) {
                // the sweep stores no samples: its code does not depend on the storage
                List<String> engines = storage == SampleStorage.UNPACKED
                        ? List.of("clip", "loop", "dds", "sweep", "button") : List.of("clip", "loop", "dds");
                for (String engine : engines) {
                    String name = String.format(Locale.ROOT, "c%03d", n);
                    TimerKind timer = timers(family).get(n % timers(family).size());
                    FirmwareRequest.Builder b = FirmwareRequest.builder().family(family.folder()).name(name)
                            .toolVersion("test").pins(pc.pins()).portWidth(pc.width()).pinStrategy(pc.strategy())
                            .storage(storage).cpuClockHz(16e6);
                    if (family != TargetFamily.GENERIC) {
                        b.timer(timer);
                    }
                    switch (engine) {
                        case "clip":
                            b.sound("door", HostReplayTest.chime(bits, 200))
                                    .sound("bell", HostReplayTest.chime(bits, 120));
                            break;
                        case "loop":
                            b.engine(PlaybackEngine.LOOP).sound("warble", HostReplayTest.chime(bits, 300), 50,
                                    250);
                            break;
                        case "dds":
                            b.engine(PlaybackEngine.DDS).sound("sine", Codes.of(bits, 8000,
                                    Dds.sineTable(6, bits))).dds(DdsSpec.of(440));
                            break;
                        case "sweep":
                            b.sweep(SweepSpec.holding(bits, new int[] {0, (1 << bits) - 1, 1}, 500));
                            break;
                        default:
                            b.sweep(SweepSpec.onButton(bits, new int[] {0, 3, 1 << (bits - 1)},
                                    buttonPin(family, pc)));
                    }
                    FirmwareEmitter.emit(b.build(), dir);
                    sources.add(name + ".c");
                    sources.add(name + "_data.c");
                    n++;
                }
            }
        }
        return sources;
    }

    @Test
    void genericCompilesWithHostGcc() {
        CToolchain.require("gcc");
        List<String> sources = renderAll(TargetFamily.GENERIC);
        CToolchain.compileClean(dir, CToolchain.cmd(List.of("gcc", "-O2", "-c"), CToolchain.STRICT), sources);
        assertObjects(sources);
    }

    @Test
    void avrCompilesAndLinksWithAvrGcc() {
        CToolchain.require("avr-gcc");
        List<String> sources = renderAll(TargetFamily.AVR);
        List<String> base = CToolchain.cmd(List.of("avr-gcc", "-mmcu=atmega328p", "-Os"), CToolchain.STRICT);
        CToolchain.compileClean(dir, CToolchain.cmd(base, List.of("-c")), sources);
        assertObjects(sources);
        // c002 is a DDS player (64-bit tuning arithmetic from libgcc): link it into a program.
        AtomicFiles.writeString(dir.resolve("main.c"), """
                #include "c002.h"
                int main(void)
                {
                    c002_init();
                    (void)c002_set_frequency_hz(1000u);
                    c002_start();
                    for (;;) {
                    }
                }
                """);
        CToolchain.compileClean(dir, CToolchain.cmd(base, List.of("-o", "player.elf", "main.c", "c002.c",
                "c002_data.c")));
        assertTrue(Files.isRegularFile(dir.resolve("player.elf")));
    }

    @Test
    void cortexmCompilesWithArmGccFreestanding() {
        CToolchain.require("arm-none-eabi-gcc");
        List<String> sources = renderAll(TargetFamily.CORTEXM);
        List<String> base = CToolchain.cmd(List.of("arm-none-eabi-gcc", "-mcpu=cortex-m3", "-mthumb",
                "-ffreestanding", "-Os"), CToolchain.STRICT);
        CToolchain.compileClean(dir, CToolchain.cmd(base, List.of("-c")), sources);
        assertObjects(sources);
        // Link a DDS player without any C library: only libgcc (64-bit division) is needed.
        AtomicFiles.writeString(dir.resolve("main.c"), """
                #include "c002.h"
                void entry(void);
                void entry(void)
                {
                    c002_init();
                    (void)c002_set_frequency_hz(1000u);
                    c002_start();
                    for (;;) {
                    }
                }
                """);
        CToolchain.compileClean(dir, CToolchain.cmd(base, List.of("-nostdlib", "-nostartfiles",
                "-Wl,--entry=entry", "-o", "player.elf", "main.c", "c002.c", "c002_data.c", "-lgcc")));
        assertTrue(Files.isRegularFile(dir.resolve("player.elf")));
    }

    private void assertObjects(List<String> sources) {
        for (String s : sources) {
            assertTrue(Files.isRegularFile(dir.resolve(s.replace(".c", ".o"))), s + " made no object");
        }
        assertEquals(0, sources.size() % 16, "eight engine and storage combinations per pin case");
    }
}
