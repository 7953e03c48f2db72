package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.quantize.Codes;
import org.rungtone.testing.CToolchain;

/**
 * Every emitted header can be included from C++: each family's headers over the {@link TemplateMatrix}
 * compile warning-free as C++ (host g++ for generic, cortexm and rp2040, avr-g++ for avr), and a C++ program links
 * against players and a sample array compiled as C, which only works when the headers give the
 * declarations C linkage.
 */
class CppHeadersTest {
    /** Warning flags for the C++ side. */
    private static final List<String> STRICT_CPP = List.of("-std=c++11", "-Wall", "-Wextra", "-Werror",
            "-pedantic");

    @TempDir
    Path dir;

    /** Renders the family's matrix and a C++ file that includes every header; returns the file's name. */
    private String includeAll(TargetFamily family) {
        StringBuilder cpp = new StringBuilder();
        for (TemplateMatrix.Case c : TemplateMatrix.cases(family)) {
            FirmwareEmitter.emit(c.request(), dir);
            cpp.append("#include \"").append(c.name()).append(".h\"\n");
        }
        cpp.append("int cpp_headers_included;\n");
        AtomicFiles.writeString(dir.resolve("all.cpp"), cpp.toString());
        return "all.cpp";
    }

    @Test
    void genericCortexmAndRp2040HeadersCompileAsCpp() {
        CToolchain.require("g++");
        for (TargetFamily family : List.of(TargetFamily.GENERIC, TargetFamily.CORTEXM, TargetFamily.RP2040)) {
            String cpp = includeAll(family);
            CToolchain.compileClean(dir, CToolchain.cmd(List.of("g++", "-c"), CToolchain.cmd(STRICT_CPP,
                    List.of(cpp))));
            assertTrue(Files.isRegularFile(dir.resolve("all.o")), family.folder());
        }
    }

    @Test
    void avrHeadersCompileAsCpp() {
        CToolchain.require("avr-g++");
        String cpp = includeAll(TargetFamily.AVR);
        CToolchain.compileClean(dir, CToolchain.cmd(List.of("avr-g++", "-mmcu=atmega328p", "-Os", "-c"),
                CToolchain.cmd(STRICT_CPP, List.of(cpp))));
        assertTrue(Files.isRegularFile(dir.resolve("all.o")));
    }

    @Test
    void aCppProgramLinksAgainstAPlayerAndASampleArrayCompiledAsC() {
        CToolchain.require("gcc");
        CToolchain.require("g++");
        TemplateMatrix.Case clip = TemplateMatrix.cases(TargetFamily.GENERIC).get(0);
        assertEquals("clip", clip.engine());
        FirmwareEmitter.emit(clip.request(), dir);
        new SampleArrayEmitter(Templates.bundled()).emit(new SampleArrayEmitter.Request("bell",
                Codes.of(6, 8000, new int[] {32, 40, 63, 0}), "", "test", List.of()), dir);
        AtomicFiles.writeString(dir.resolve("main.cpp"), """
                #include "c000.h"
                #include "bell.h"

                static unsigned writes;

                void c000_port_write(uint8_t port, c000_port_t value, c000_port_t mask)
                {
                    (void)port;
                    (void)value;
                    (void)mask;
                    writes++;
                }

                int main()
                {
                    c000_init();
                    c000_play(C000_SOUND_DOOR);
                    c000_tick();
                    return (writes == 2u && c000_is_done() == 0u && bell_samples[2] == 63u) ? 0 : 1;
                }
                """);
        for (String c : List.of("c000.c", "c000_data.c", "bell.c")) {
            CToolchain.compileClean(dir, CToolchain.cmd(List.of("gcc", "-c"), CToolchain.cmd(CToolchain.STRICT,
                    List.of(c))));
        }
        CToolchain.compileClean(dir, CToolchain.cmd(List.of("g++"), CToolchain.cmd(STRICT_CPP, List.of("-o",
                "player", "main.cpp", "c000.o", "c000_data.o", "bell.o"))));
        // one write parks the pins at init, the tick writes the first sample
        assertEquals(0, CToolchain.exec(dir, List.of("./player")).exitCode());
    }
}
