package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.quantize.Codes;
import org.rungtone.testing.AvrSimulator;
import org.rungtone.testing.AvrTrace;
import org.rungtone.testing.AvrTrace.Interrupt;
import org.rungtone.testing.AvrTrace.Write;
import org.rungtone.testing.CToolchain;

/**
 * Sample tables larger than the 32,767 bytes avr-gcc allows one C object: the emitted files compile
 * warning-free for the ATmega328P, link for the ATmega644P (64 KiB of flash; a 328P cannot hold them), and
 * in simavr every code of the sound reaches the pins, across the whole table.
 */
class AvrLargeTableTest {
    private static final int RATE_HZ = 16000;

    @TempDir
    Path dir;

    static Stream<Arguments> layouts() {
        // 2.1 s of 8-bit codes at 16 kHz: 33,600 bytes, the case that used to fail in avr-gcc
        return Stream.of(Arguments.of("PD0-PD7", SampleStorage.UNPACKED, 33_600),
                Arguments.of("PD2-PD7,PB0-PB3", SampleStorage.UNPACKED, 17_000),
                Arguments.of("PD2-PD7,PB0-PB3", SampleStorage.PACKED, 27_000),
                Arguments.of("PD2-PD7", SampleStorage.PACKED, 45_000));
    }

    @ParameterizedTest(name = "{0} {1} {2} samples")
    @MethodSource("layouts")
    void aTableOver32KiBCompilesAndPlaysEveryCode(String pins, SampleStorage storage, int samples)
            throws IOException {
        CToolchain.require("avr-gcc");
        PinMap map = PinMap.parse(pins, 8);
        int[] codes = AvrSimulatorTest.codes(map.bits(), samples, 3);
        EmitResult r = FirmwareEmitter.emit(FirmwareRequest.builder().family("avr").name("big").toolVersion("test")
                .pins(pins).storage(storage).cpuClockHz(16e6).sound("speech", Codes.of(map.bits(), RATE_HZ, codes))
                .build(), dir);
        assertTrue(r.flashBytes() > AssemblerTable.MAX_C_OBJECT_BYTES, "table bytes: " + r.flashBytes());
        assertTrue(Files.readString(dir.resolve("big_data.c")).contains("__asm__("), "defined in assembler");
        CToolchain.compileClean(dir, CToolchain.cmd(CToolchain.cmd(AvrSimulator.AVR_GCC, CToolchain.STRICT),
                List.of("-c")), List.of("big.c", "big_data.c"));
        AtomicFiles.writeString(dir.resolve("main.c"), """
                #include <avr/io.h>
                #include "big.h"
                int main(void)
                {
                    big_init();
                    big_play(BIG_SOUND_SPEECH);
                    GPIOR0 = 3u;
                    for (;;) {
                    }
                }
                """);
        String mcu = "atmega644p";
        CToolchain.compileClean(dir, CToolchain.cmd(CToolchain.cmd(AvrSimulator.avrGcc(mcu), CToolchain.STRICT),
                List.of("-o", "big.elf", "main.c", "big.c", "big_data.c")));
        long period = r.timer().orElseThrow().cyclesPerTick();
        AvrTrace trace = AvrSimulator.get().run(dir.resolve("big.elf"), (samples + 8L) * period + 50_000, mcu);
        assertEquals(toList(codes), played(trace, map), "codes at the pins, tick by tick");
    }

    /** The code the port writes of each interrupt after main()'s marker left on the ladder. */
    private static List<Integer> played(AvrTrace trace, PinMap map) {
        long started = trace.marker("GPIOR0", 3);
        Map<String, Integer> image = new HashMap<>();
        List<Integer> out = new ArrayList<>();
        int w = 0;
        List<Write> writes = trace.writes();
        for (Interrupt i : trace.interrupts()) {
            boolean wrote = false;
            for (; w < writes.size() && writes.get(w).cycle() < i.exitCycle(); w++) {
                image.put(writes.get(w).register(), writes.get(w).value());
                wrote |= i.contains(writes.get(w)) && writes.get(w).register().startsWith("PORT");
            }
            if (wrote && i.entryCycle() > started) {
                int code = 0;
                for (int bit = 0; bit < map.bits(); bit++) {
                    Pin p = map.pin(bit);
                    code |= ((image.getOrDefault("PORT" + p.port(), 0) >> p.pin()) & 1) << bit;
                }
                out.add(code);
            }
        }
        return out;
    }

    private static List<Integer> toList(int[] a) {
        List<Integer> out = new ArrayList<>(a.length);
        for (int v : a) {
            out.add(v);
        }
        return out;
    }
}
