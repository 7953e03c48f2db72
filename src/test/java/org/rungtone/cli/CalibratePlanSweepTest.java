package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.calibrate.MeasurementCsv;
import org.rungtone.calibrate.Measurements;
import org.rungtone.firmware.PinMap;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.testing.CToolchain;
import org.rungtone.testing.Cli;

/**
 * The plan's sweep program, as the firmware tests check players: built on the host with a harness whose
 * port hook prints every write, run, and replayed against port images in Java, it must put exactly the
 * planned codes on the pins, in plan.csv's order, each for its hold time or until the next button press.
 * The avr and cortexm versions must compile warning-free with their cross compilers (skipped when absent,
 * unless RUNGTONE_REQUIRE_CROSS is set).
 */
class CalibratePlanSweepTest {
    private static final String HARNESS = """
            #include <stdio.h>
            #include <stdlib.h>
            #include <stdint.h>
            #include "sweep.h"

            static long tick_no = -1;
            static long period = 0;
            static long width = 0;

            void sweep_port_write(uint8_t port, sweep_port_t value, sweep_port_t mask)
            {
                printf("W %u %lx %lx\\n", (unsigned)port, (unsigned long)value, (unsigned long)mask);
            }

            #ifdef SWEEP_DEBOUNCE_TICKS
            uint8_t sweep_button_pressed(void)
            {
                /* pressed for `width` ticks at the start of every `period` ticks, from tick `period` on */
                return (uint8_t)(tick_no >= period && tick_no % period < width);
            }
            #endif

            int main(int argc, char **argv)
            {
                long cap = 2000000L;
                if (argc > 2) {
                    period = atol(argv[1]);
                    width = atol(argv[2]);
                }
                sweep_init();
                sweep_start();
                printf("S\\n");
                while (!sweep_is_done() && cap-- > 0) {
                    tick_no++;
                    sweep_tick();
                    printf("T\\n");
                }
                return 0;
            }
            """;

    @TempDir
    Path dir;

    private Path plan(String... extra) {
        List<String> args = new ArrayList<>(List.of("calibrate", "plan", "--topology", "weighted", "--bits", "8",
                "--tolerance", "5%", "--out", dir.toString(), "--quiet"));
        args.addAll(List.of(extra));
        Cli.Run r = Cli.run(args.toArray(new String[0]));
        assertEquals(0, r.exitCode(), r.err());
        return dir.resolve("plan.csv");
    }

    private static List<Integer> plannedCodes(Path csv) {
        Measurements m = MeasurementCsv.read(csv, 8);
        // the template has no readings: every planned code is listed as not measured, in file order
        List<Integer> codes = new ArrayList<>();
        for (String line : read(csv).split("\n")) {
            if (!line.startsWith("#") && !line.startsWith("code") && !line.isBlank()) {
                codes.add(Integer.parseInt(line.substring(0, line.indexOf(','))));
            }
        }
        assertEquals(m.unmeasured().size(), codes.size());
        return codes;
    }

    @Test
    void hostSweepHoldsExactlyThePlannedCodesInOrder() {
        String pins = "PA3,PA7,PC0,PC1,PB2,PB1,PB5,PB6";
        List<Integer> codes = plannedCodes(plan("--target", "generic", "--pins", pins, "--hold", "3ms"));
        assertEquals(8 + 2 + 16, codes.size(), "basis (0, all ones, 8 single bits) and 2N check codes");
        List<Integer> states = run(pins, "0", "0");
        int hold = 3;
        assertEquals(codes.size() * hold + 1, states.size(), "start plus one state per tick until done");
        for (int i = 0; i < states.size(); i++) {
            // the code of step k goes out in tick k*hold - 1 (0-based) and stays for hold ticks
            int step = Math.min(codes.size() - 1, i / hold);
            assertEquals(codes.get(step), states.get(i), "state " + i);
        }
    }

    @Test
    void hostSweepStepsOnEachButtonPress() {
        String pins = "PB0-PB7";
        List<Integer> codes = plannedCodes(plan("--target", "generic", "--pins", pins, "--button", "PD2"));
        List<Integer> states = run(pins, "100", "40");
        List<Integer> distinct = new ArrayList<>();
        for (int s : states) {
            if (distinct.isEmpty() || distinct.get(distinct.size() - 1) != s) {
                distinct.add(s);
            }
        }
        assertEquals(codes, distinct);
        // one press per code, the press after the last one ends the sweep; each is taken once debounced
        int debounce = 20;
        assertEquals(codes.size() * 100L + debounce, states.size() - 1L);
    }

    @Test
    void avrSweepCompilesWithAvrGcc() {
        CToolchain.require("avr-gcc");
        plan("--target", "avr", "--pins", "PD2-PD7,PB0,PB1", "--cpu-clock", "16MHz", "--button", "PC5");
        compile(List.of("avr-gcc", "-mmcu=atmega328p", "-Os", "-c"), "sweep.c", "sweep_data.c");
    }

    @Test
    void cortexmSweepCompilesWithArmGcc() {
        CToolchain.require("arm-none-eabi-gcc");
        plan("--target", "cortexm", "--pins", "PB8-PB15", "--cpu-clock", "72MHz", "--hold", "2s");
        compile(List.of("arm-none-eabi-gcc", "-mcpu=cortex-m3", "-mthumb", "-ffreestanding", "-Os", "-c"),
                "sweep.c", "sweep_data.c");
    }

    /** Runs the generic sweep in the harness; returns the code on the pins after start and each tick. */
    private List<Integer> run(String pins, String period, String width) {
        CToolchain.require("gcc");
        AtomicFiles.writeString(dir.resolve("harness.c"), HARNESS);
        List<String> cc = new ArrayList<>(List.of("gcc"));
        cc.addAll(CToolchain.STRICT);
        cc.addAll(List.of("-O1", "-o", "replay", "harness.c", "sweep.c", "sweep_data.c"));
        String diag = CToolchain.run(dir, cc);
        assertEquals("", diag.strip(), "compiler printed diagnostics");
        String out = CToolchain.run(dir, List.of(dir.resolve("replay").toString(), period, width));
        return replay(out, PinMap.parse(pins, 8));
    }

    private static List<Integer> replay(String out, PinMap map) {
        Map<String, Long> images = new LinkedHashMap<>();
        for (String p : map.ports()) {
            images.put(p, 0L);
        }
        List<Integer> states = new ArrayList<>();
        int writes = 0;
        for (String line : out.split("\n")) {
            String[] f = line.split(" ");
            if (f[0].equals("W")) {
                String port = map.ports().get(Integer.parseInt(f[1]));
                long value = Long.parseLong(f[2], 16);
                long mask = Long.parseLong(f[3], 16);
                assertEquals(map.mask(port), mask, "mask of a write to port " + port);
                images.put(port, (images.get(port) & ~mask) | value);
                writes++;
            } else if (f[0].equals("S") || f[0].equals("T")) {
                assertTrue(f[0].equals("T") || writes > 0, "start puts the first code on the pins");
                states.add(map.decode(images));
            }
        }
        return states;
    }

    private void compile(List<String> base, String... sources) {
        List<String> cmd = new ArrayList<>(base);
        cmd.addAll(CToolchain.STRICT);
        cmd.addAll(List.of(sources));
        assertEquals("", CToolchain.run(dir, cmd).strip(), "compiler printed diagnostics");
        for (String s : sources) {
            assertTrue(Files.isRegularFile(dir.resolve(s.replace(".c", ".o"))), s + " made no object");
        }
    }

    private static String read(Path p) {
        try {
            return Files.readString(p);
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
    }
}
