package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.testing.CToolchain;

/**
 * Every family's output for the {@link TemplateMatrix}: contiguous, scattered, multi-port and wide scattered
 * pin maps (plus forced strategies), packed and unpacked storage, and every engine, compiles warning-free with
 * {@code -std=c99 -Wall -Wextra -Werror -pedantic}: generic with the host gcc, avr with avr-gcc for the
 * ATmega328P, cortexm with arm-none-eabi-gcc for the Cortex-M3 and rp2040 for the Cortex-M0+ (both
 * freestanding). Each family's combinations compile in one compiler run (distinct symbol prefixes); one player
 * per family is also linked. The Cortex-M objects are disassembled to check that nothing the tick runs divides.
 */
class CompileMatrixTest {
    /** A function's first line in objdump's listing: {@code 00000040 <c000_tick>:}. */
    private static final Pattern FUNCTION = Pattern.compile("^[0-9a-f]+ <(\\w+)>:");

    @TempDir
    Path dir;

    /** Renders every combination of {@link TemplateMatrix} into {@code dir}; returns the C files. */
    private List<String> renderAll(TargetFamily family) {
        List<String> sources = new ArrayList<>();
        for (TemplateMatrix.Case c : TemplateMatrix.cases(family)) {
            FirmwareEmitter.emit(c.request(), dir);
            sources.add(c.name() + ".c");
            sources.add(c.name() + "_data.c");
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
                    (void)c002_set_frequency_millihz(440000u);
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
        assertNoDivisionOutsideTuning(sources);
        // Link a DDS player without any C library: only libgcc (64-bit division) is needed.
        AtomicFiles.writeString(dir.resolve("main.c"), """
                #include "c002.h"
                void entry(void);
                void entry(void)
                {
                    c002_init();
                    (void)c002_set_frequency_hz(1000u);
                    (void)c002_set_frequency_millihz(440000u);
                    c002_start();
                    for (;;) {
                    }
                }
                """);
        CToolchain.compileClean(dir, CToolchain.cmd(base, List.of("-nostdlib", "-nostartfiles",
                "-Wl,--entry=entry", "-o", "player.elf", "main.c", "c002.c", "c002_data.c", "-lgcc")));
        assertTrue(Files.isRegularFile(dir.resolve("player.elf")));
    }

    @Test
    void rp2040CompilesWithArmGccForTheCortexM0Plus() {
        CToolchain.require("arm-none-eabi-gcc");
        List<String> sources = renderAll(TargetFamily.RP2040);
        List<String> base = CToolchain.cmd(List.of("arm-none-eabi-gcc", "-mcpu=cortex-m0plus", "-mthumb",
                "-ffreestanding", "-Os"), CToolchain.STRICT);
        CToolchain.compileClean(dir, CToolchain.cmd(base, List.of("-c")), sources);
        assertObjects(sources);
        assertNoDivisionOutsideTuning(sources);
        // Link a DDS player (the interrupt handler isr_irq0 included) without any C library: libgcc only.
        AtomicFiles.writeString(dir.resolve("main.c"), """
                #include "c002.h"
                void entry(void);
                void entry(void)
                {
                    c002_init();
                    (void)c002_set_frequency_hz(1000u);
                    (void)c002_set_frequency_millihz(440000u);
                    c002_start();
                    for (;;) {
                    }
                }
                """);
        CToolchain.compileClean(dir, CToolchain.cmd(base, List.of("-nostdlib", "-nostartfiles",
                "-Wl,--entry=entry", "-o", "player.elf", "main.c", "c002.c", "c002_data.c", "-lgcc")));
        assertTrue(Files.isRegularFile(dir.resolve("player.elf")));
    }

    /**
     * No function of the players divides (UDIV/SDIV or a libgcc division) except the DDS frequency setters and
     * the tuning-word helper only they call, which run outside the interrupt: the tick and everything it calls
     * stays division-free.
     */
    private void assertNoDivisionOutsideTuning(List<String> sources) {
        Pattern division = Pattern.compile("\\s(u|s)div\\s|__aeabi_\\w*div");
        for (String s : sources) {
            String listing = CToolchain.run(dir, List.of("arm-none-eabi-objdump", "-d", s.replace(".c", ".o")));
            String function = "";
            for (String line : listing.split("\n")) {
                Matcher head = FUNCTION.matcher(line);
                if (head.find()) {
                    function = head.group(1);
                } else if (division.matcher(line).find()) {
                    boolean setter = function.contains("_set_frequency_") || function.endsWith("_tuning_for");
                    assertTrue(setter, s + ": " + function + " divides: " + line);
                }
            }
        }
    }

    private void assertObjects(List<String> sources) {
        for (String s : sources) {
            assertTrue(Files.isRegularFile(dir.resolve(s.replace(".c", ".o"))), s + " made no object");
        }
        assertEquals(0, sources.size() % (2 * TemplateMatrix.CASES_PER_PIN_MAP), "eleven engine and storage"
                + " combinations per pin case");
    }
}
