package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.quantize.Codes;
import org.rungtone.testing.CToolchain;

/**
 * Values wider than one byte that the main program shares with the tick are read and written whole, even on
 * an 8-bit part, where a 16- or 32-bit load or store takes one instruction per byte (a step read while it
 * went from 511 to 512 once came back as 767):
 * <ul>
 *   <li>on the host, a lock that lets one tick in as it is taken and one as it is released shows that
 *       {@code NAME_current_step()} reads between the two, and that every call of the API takes it once;</li>
 *   <li>in the AVR assembly of every engine, each load and store of such a value outside the tick lies
 *       between {@code cli} and the {@code out __SREG__} that restores the interrupt flag;</li>
 *   <li>the generic player, whose default lock does nothing, compiled for the AVR: the tuning word is stored
 *       while its one-byte ready flag is clear and taken by the tick only after reading the flag set, and the
 *       step is loaded twice until both loads agree.</li>
 * </ul>
 */
class SharedStateTest {
    /** A function of the assembly: its label up to its {@code .size} directive. */
    private static final Pattern FUNCTION = Pattern.compile("(?ms)^(\\w+):\\n(.*?)^\\s*\\.size\\s+\\1,");
    /** A load or store of a RAM variable, with the byte offset when it is not the first byte. */
    private static final Pattern ACCESS = Pattern.compile("^\\s*(lds|sts)\\s+(?:r\\d+,)?(\\w+)(\\+\\d+)?");
    /** A call in avr-gcc assembly: {@code rcall clip_read} or {@code call clip_read}. */
    private static final Pattern CALL = Pattern.compile("(?m)^\\s*r?call\\s+(\\w+)");

    @TempDir
    Path dir;

    private static FirmwareRequest.Builder generic(String name) {
        return FirmwareRequest.builder().name(name).toolVersion("test").pins("PB0-PB5");
    }

    private static FirmwareRequest.Builder avr(String name) {
        return generic(name).family("avr").cpuClockHz(16e6);
    }

    private static int[] steps(int count) {
        int[] codes = new int[count];
        for (int i = 0; i < count; i++) {
            codes[i] = (i * 7) % 64;
        }
        return codes;
    }

    @Test
    void theStepIsReadInsideTheLockAndEveryCallTakesItOnce() {
        CToolchain.require("gcc");
        // one tick per code (1 ms at the sweep's 1 kHz), so every tick moves the step on by one
        FirmwareEmitter.emit(generic("sw").sweep(SweepSpec.holding(6, steps(10), 1)).build(), dir);
        FirmwareEmitter.emit(generic("osc").engine(PlaybackEngine.DDS)
                .sound("sine", Codes.of(6, 8000, Dds.sineTable(6, 6))).dds(DdsSpec.of(440)).build(), dir);
        AtomicFiles.writeString(dir.resolve("counting_lock.h"), """
                unsigned counting_lock(void);
                void counting_unlock(unsigned saved);
                #define SW_LOCK_STATE unsigned
                #define SW_LOCK() counting_lock()
                #define SW_UNLOCK(saved) counting_unlock(saved)
                #define OSC_LOCK_STATE unsigned
                #define OSC_LOCK() counting_lock()
                #define OSC_UNLOCK(saved) counting_unlock(saved)
                """);
        AtomicFiles.writeString(dir.resolve("main.c"), """
                #include <stdio.h>
                #include "sw.h"
                #include "osc.h"

                static int interrupt_at_edges;
                static unsigned locks;
                static unsigned depth;

                /* An interrupt that comes just as interrupts go off, and one held pending until they are back on. */
                unsigned counting_lock(void)
                {
                    if (interrupt_at_edges) {
                        sw_tick();
                    }
                    locks++;
                    return depth++;
                }

                void counting_unlock(unsigned saved)
                {
                    depth = saved;
                    if (interrupt_at_edges) {
                        sw_tick();
                    }
                }

                void sw_port_write(uint8_t port, sw_port_t value, sw_port_t mask)
                {
                    (void)port;
                    (void)value;
                    (void)mask;
                }

                void osc_port_write(uint8_t port, osc_port_t value, osc_port_t mask)
                {
                    (void)port;
                    (void)value;
                    (void)mask;
                }

                static unsigned taken(void)
                {
                    const unsigned n = locks;
                    locks = 0u;
                    return n;
                }

                int main(void)
                {
                    unsigned before;
                    unsigned during;
                    sw_init();
                    sw_start();
                    printf("start %u\\n", taken());
                    sw_tick();
                    sw_tick();
                    sw_tick();
                    before = sw_current_step();
                    printf("read %u\\n", taken());
                    interrupt_at_edges = 1;
                    during = sw_current_step();
                    interrupt_at_edges = 0;
                    printf("steps %u %u %u\\n", before, during, (unsigned)sw_current_step());
                    (void)taken();
                    osc_init();
                    osc_start();
                    printf("dds start %u\\n", taken());
                    osc_set_tuning_word(12345u);
                    printf("dds word %u\\n", taken());
                    (void)osc_set_frequency_hz(1000u);
                    printf("dds hz %u\\n", taken());
                    (void)osc_set_frequency_millihz(440000u);
                    printf("dds millihz %u\\n", taken());
                    printf("depth %u\\n", depth);
                    return 0;
                }
                """);
        CToolchain.compileClean(dir, CToolchain.cmd(List.of("gcc", "-O2", "-DSW_CONFIG_HEADER=\"counting_lock.h\"",
                "-DOSC_CONFIG_HEADER=\"counting_lock.h\"", "-o", "locks"), CToolchain.cmd(CToolchain.STRICT,
                List.of("main.c", "sw.c", "sw_data.c", "osc.c", "osc_data.c"))));
        String out = CToolchain.run(dir, List.of("./locks"));
        // Step 3 before; the tick let in as the lock is taken makes it 4, which the read must return; the
        // tick let in as it is released makes it 5. A read before the lock would give 3, one after it 5.
        assertEquals("""
                start 1
                read 1
                steps 3 4 5
                dds start 1
                dds word 1
                dds hz 1
                dds millihz 1
                depth 0
                """, out);
    }

    @Test
    void avrTouchesSharedWordsOutsideTheTickOnlyWithInterruptsOff() throws IOException {
        CToolchain.require("avr-gcc");
        Map<String, FirmwareRequest> players = new LinkedHashMap<>();
        // past 65,535 samples the indices are 32-bit (3-bit codes packed: avr-gcc takes no array over 32 KiB)
        players.put("clip", avr("clip").pins("PB0-PB2").storage(SampleStorage.PACKED)
                .sound("a", HostReplayTest.chime(3, 300)).sound("b", HostReplayTest.chime(3, 70000)).build());
        players.put("lp", avr("lp").engine(PlaybackEngine.LOOP).sound("a", HostReplayTest.chime(6, 300), 10, 200)
                .build());
        players.put("osc", avr("osc").engine(PlaybackEngine.DDS).sound("sine", Codes.of(6, 22050,
                Dds.sineTable(8, 6))).dds(DdsSpec.of(440)).build());
        players.put("sw", avr("sw").sweep(SweepSpec.holding(6, steps(300), 500)).build());
        players.put("btn", avr("btn").sweep(SweepSpec.onButton(6, steps(300), "PC5")).build());
        Set<String> checked = new TreeSet<>();
        for (Map.Entry<String, FirmwareRequest> p : players.entrySet()) {
            FirmwareEmitter.emit(p.getValue(), dir);
            Map<String, String> functions = assembly(List.of("avr-gcc", "-mmcu=atmega328p", "-Os"), p.getKey());
            Set<String> wide = wideVariables(functions);
            assertFalse(wide.isEmpty(), p.getKey() + ": no shared multi-byte variable found");
            Set<String> tickSide = calledFromTheTick(functions, p.getKey() + "_tick");
            for (Map.Entry<String, String> f : functions.entrySet()) {
                if (tickSide.contains(f.getKey())) {
                    continue;
                }
                checked.addAll(accessesOutsideTheLock(f.getKey(), f.getValue(), wide));
            }
        }
        // the functions that do touch such values, each checked above
        assertTrue(checked.containsAll(List.of("sw_current_step", "sw_start", "btn_current_step",
                "osc_set_tuning_word", "osc_start")), checked.toString());
    }

    @Test
    void genericWithoutALockStillHandsWordsOverWhole() throws IOException {
        CToolchain.require("avr-gcc");
        FirmwareEmitter.emit(generic("osc").engine(PlaybackEngine.DDS).sound("sine", Codes.of(6, 8000,
                Dds.sineTable(8, 6))).dds(DdsSpec.of(440)).build(), dir);
        FirmwareEmitter.emit(generic("sw").sweep(SweepSpec.holding(6, steps(300), 500)).build(), dir);
        Map<String, String> osc = assembly(List.of("avr-gcc", "-mmcu=atmega328p", "-Os"), "osc");
        // set_tuning_word: flag cleared, the four bytes, flag set - in this order
        assertEquals(List.of("sts osc_tuning_ready", "sts osc_tuning_next", "sts osc_tuning_next+1",
                "sts osc_tuning_next+2", "sts osc_tuning_next+3", "sts osc_tuning_ready"),
                accesses(osc.get("osc_set_tuning_word")));
        // the tick reads the flag before the word
        List<String> tick = accesses(osc.get("osc_tick"));
        int flag = tick.indexOf("lds osc_tuning_ready");
        assertTrue(flag >= 0 && flag < tick.indexOf("lds osc_tuning_next"), tick.toString());
        Map<String, String> sw = assembly(List.of("avr-gcc", "-mmcu=atmega328p", "-Os"), "sw");
        assertEquals(List.of("lds sw_step", "lds sw_step+1", "lds sw_step", "lds sw_step+1"),
                accesses(sw.get("sw_current_step")));
        assertTrue(sw.get("sw_current_step").contains("brne"), "loops until two reads agree");
        List<String> start = accesses(sw.get("sw_start"));
        assertEquals("sts sw_running", start.get(0), "the sweep is stopped before its state is set: " + start);
    }

    /** Compiles {@code name.c} to assembly; returns its functions by name. */
    private Map<String, String> assembly(List<String> compiler, String name) throws IOException {
        CToolchain.compileClean(dir, CToolchain.cmd(compiler, CToolchain.cmd(CToolchain.STRICT, List.of("-S",
                name + ".c", "-o", name + ".s"))));
        Matcher m = FUNCTION.matcher(Files.readString(dir.resolve(name + ".s")));
        Map<String, String> out = new LinkedHashMap<>();
        while (m.find()) {
            out.put(m.group(1), m.group(2));
        }
        assertFalse(out.isEmpty(), "no function found in " + name + ".s");
        return out;
    }

    /**
     * The tick, the interrupt vectors and every function reached only from them or from a locked region
     * ({@code cli} .. {@code out __SREG__}) of another function: these run with interrupts off.
     */
    private static Set<String> calledFromTheTick(Map<String, String> functions, String tick) {
        Set<String> side = new TreeSet<>();
        for (String f : functions.keySet()) {
            if (f.equals(tick) || f.startsWith("__vector_")) {
                side.add(f);
            }
        }
        Set<String> unlocked = new TreeSet<>();
        Set<String> locked = new TreeSet<>();
        for (Map.Entry<String, String> f : functions.entrySet()) {
            boolean off = side.contains(f.getKey());
            for (String line : f.getValue().split("\n")) {
                String t = line.strip();
                if (t.equals("cli")) {
                    off = true;
                } else if (!side.contains(f.getKey()) && (t.startsWith("out __SREG__,") || t.equals("sei"))) {
                    off = false;
                }
                Matcher call = CALL.matcher(line);
                if (call.find()) {
                    (off ? locked : unlocked).add(call.group(1));
                }
            }
        }
        for (String f : locked) {
            if (functions.containsKey(f) && !unlocked.contains(f)) {
                side.add(f);
            }
        }
        return side;
    }

    /** Variables some function loads or stores past their first byte. */
    private static Set<String> wideVariables(Map<String, String> functions) {
        Set<String> wide = new TreeSet<>();
        for (String body : functions.values()) {
            for (String line : body.split("\n")) {
                Matcher a = ACCESS.matcher(line);
                if (a.find() && a.group(3) != null) {
                    wide.add(a.group(2));
                }
            }
        }
        return wide;
    }

    /** The loads and stores of a function, e.g. {@code sts osc_tuning_next+1}. */
    private static List<String> accesses(String body) {
        List<String> out = new ArrayList<>();
        for (String line : body.split("\n")) {
            Matcher a = ACCESS.matcher(line);
            if (a.find()) {
                out.add(a.group(1) + " " + a.group(2) + (a.group(3) == null ? "" : a.group(3)));
            }
        }
        return out;
    }

    /**
     * Fails on a load or store of a wide variable outside {@code cli} .. {@code out __SREG__} (or {@code sei});
     * returns the function's name when it has such accesses, all inside.
     */
    private static List<String> accessesOutsideTheLock(String function, String body, Set<String> wide) {
        boolean locked = false;
        boolean any = false;
        for (String line : body.split("\n")) {
            String t = line.strip();
            if (t.equals("cli")) {
                locked = true;
            } else if (t.startsWith("out __SREG__,") || t.equals("sei")) {
                locked = false;
            }
            Matcher a = ACCESS.matcher(line);
            if (a.find() && wide.contains(a.group(2))) {
                assertTrue(locked, function + ": '" + t + "' with interrupts on:\n" + body);
                any = true;
            }
        }
        return any ? List.of(function) : List.of();
    }
}
