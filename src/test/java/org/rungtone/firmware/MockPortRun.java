package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.testing.CToolchain;

/**
 * Builds an emitted player (symbol prefix {@code mock}) on the host with a harness that prints every port
 * write, runs it, and replays the writes against port images in Java: every write must carry exactly the
 * ladder pins of its port as mask and no level outside it, ports must come in the fixed order, and pins
 * outside the map must keep their starting levels. The result is the list of events with the code each one
 * put on the ladder. The generic player's port hook prints its writes; the rp2040 player runs with its
 * register blocks moved into the harness's memory, which prints each GPIO_OUT_XOR write and, per tick (the
 * alarm's interrupt), the microseconds the alarm moved on.
 */
final class MockPortRun {
    /** Starting level of every port: pins outside the map must keep it. */
    static final long START_PATTERN = 0xA5A5A5A5L;

    /** The part of the harness before the family's glue: the button's presses, by tick. */
    private static final String HEAD = """
            #include <stdio.h>
            #include <stdlib.h>
            #include <stdint.h>
            #include "mock.h"

            static long tick_no = -1;
            static long press_from[8];
            static long press_to[8];
            static int presses;

            static int pressed_now(void)
            {
                int i;
                for (i = 0; i < presses; i++) {
                    if (tick_no >= press_from[i] && tick_no < press_to[i]) {
                        return 1;
                    }
                }
                return 0;
            }
            """;

    /** Generic glue: the port hook prints every write, the button hook answers from the presses. */
    private static final String GENERIC_GLUE = """
            void mock_port_write(uint8_t port, mock_port_t value, mock_port_t mask)
            {
                printf("W %u %lx %lx\\n", (unsigned)port, (unsigned long)value, (unsigned long)mask);
            }

            #ifdef MOCK_DEBOUNCE_TICKS
            uint8_t mock_button_pressed(void)
            {
                return (uint8_t)pressed_now();
            }
            #endif

            static void setup(void)
            {
                (void)pressed_now;
            }

            static void flush(void)
            {
            }

            static void tick(void)
            {
                tick_no++;
                mock_tick();
                printf("T\\n");
            }
            """;

    /**
     * RP2040 glue: the register blocks are arrays here (mock_rp2040.h points the player's base addresses at
     * them). A write to GPIO_OUT_XOR is applied to GPIO_OUT and printed as the write of the ladder's port; a
     * tick is the alarm's interrupt with the count at the alarm's time, followed by the microseconds to the
     * next alarm ("A"). After init the pin functions, output enables and interrupt enables are checked ("X"
     * on a fault).
     */
    private static final String RP2040_GLUE = """
            uint32_t mock_sio[16];
            uint32_t mock_io[64];
            uint32_t mock_pads[32];
            uint32_t mock_resets[0x3004 / 4];
            uint32_t mock_timer[0x203C / 4];
            uint32_t mock_ppb[0x288 / 4];
            #define GPIO_IN mock_sio[0x04 / 4]
            #define GPIO_OUT mock_sio[0x10 / 4]
            #define GPIO_OUT_XOR mock_sio[0x1C / 4]
            #define GPIO_OE_SET mock_sio[0x24 / 4]
            #define ALARM0 mock_timer[0x10 / 4]
            #define TIMERAWL mock_timer[0x28 / 4]
            #define XOR_IDLE 0x80000000ul  /* never written: bit 31 is no GPIO */
            void isr_irq0(void);

            static void setup(void)
            {
                GPIO_OUT = 0xA5A5A5A5ul;
                GPIO_OUT_XOR = XOR_IDLE;
                GPIO_IN = 0xFFFFFFFFul;
                mock_resets[0x8 / 4] = 0xFFFFFFFFul;  /* every block out of reset */
                TIMERAWL = 1000ul;
            }

            static void flush(void)
            {
                uint32_t n;
                if (GPIO_OUT_XOR != XOR_IDLE) {
                    GPIO_OUT ^= GPIO_OUT_XOR;
                    GPIO_OUT_XOR = XOR_IDLE;
                    printf("W 0 %lx %lx\\n", (unsigned long)(GPIO_OUT & MOCK_PORT_GPIO_MASK),
                            (unsigned long)MOCK_PORT_GPIO_MASK);
                }
                if (tick_no < 0) {
                    for (n = 0u; n < 30u; n++) {
                        if (((MOCK_PORT_GPIO_MASK >> n) & 1u) != 0u && mock_io[(8u * n + 4u) / 4u] != 5u) {
                            printf("X GPIO%lu is not given to SIO\\n", (unsigned long)n);
                        }
                    }
                    if ((GPIO_OE_SET & MOCK_PORT_GPIO_MASK) != MOCK_PORT_GPIO_MASK) {
                        printf("X the ladder pins are not outputs\\n");
                    }
                    if ((mock_timer[0x2038 / 4] & 1u) == 0u || (mock_ppb[0x100 / 4] & 1u) == 0u) {
                        printf("X the alarm's interrupt is not enabled\\n");
                    }
                }
            }

            static void tick(void)
            {
                const uint32_t at = ALARM0;
                tick_no++;
                GPIO_IN = pressed_now() ? 0ul : 0xFFFFFFFFul;  /* a pressed button reads low */
                TIMERAWL = at;
                isr_irq0();
                flush();
                printf("A %lu\\n", (unsigned long)(ALARM0 - at));
                printf("T\\n");
            }
            """;

    /** Points the RP2040 player's register blocks at the harness's arrays; no interrupts to mask on a PC. */
    private static final String RP2040_CONFIG = """
            #include <stdint.h>
            extern uint32_t mock_sio[], mock_io[], mock_pads[], mock_resets[], mock_timer[], mock_ppb[];
            #define MOCK_SIO_BASE ((uintptr_t)mock_sio)
            #define MOCK_IO_BANK0_BASE ((uintptr_t)mock_io)
            #define MOCK_PADS_BANK0_BASE ((uintptr_t)mock_pads)
            #define MOCK_RESETS_BASE ((uintptr_t)mock_resets)
            #define MOCK_TIMER_BASE ((uintptr_t)mock_timer)
            #define MOCK_PPB_BASE ((uintptr_t)mock_ppb - 0xE000u)
            #define MOCK_LOCK_STATE unsigned
            #define MOCK_LOCK() 0u
            #define MOCK_UNLOCK(saved) ((void)(saved))
            """;

    /** The harness's main: init, then the engine's calls (arguments per engine), each tick printed. */
    private static final String MAIN = """
            int main(int argc, char **argv)
            {
                long cap = 10000000L;
                (void)argc;
                (void)argv;
                (void)cap;
                setup();
                mock_init();
                flush();
                printf("I\\n");
            #if defined(MOCK_SOUND_COUNT)
                {
                    const uint8_t sound = (uint8_t)atoi(argv[1]);
                    const long before_release = atol(argv[3]);
                    long n;
            #ifdef LOOPING
                    if (atoi(argv[2]) != 0) {
                        mock_loop(sound);
                        for (n = 0; n < before_release; n++) {
                            tick();
                        }
                        mock_release();
                    } else {
                        mock_play(sound);
                    }
            #else
                    (void)before_release;
                    (void)n;
                    mock_play(sound);
            #endif
                    while (!mock_is_done() && cap-- > 0) {
                        tick();
                    }
                    tick();
                }
            #elif defined(MOCK_PHASE_BITS)
                {
                    const unsigned long m = (unsigned long)mock_set_frequency_hz((uint32_t)atol(argv[1]));
                    const long count = atol(argv[2]);
                    long n;
                    printf("M %lu\\n", m);
                    mock_start();
                    for (n = 0; n < count; n++) {
                        tick();
                    }
                }
            #elif defined(MOCK_STEP_COUNT)
                {
                    int i;
                    for (i = 1; i + 1 < argc && presses < 8; i += 2) {
                        press_from[presses] = atol(argv[i]);
                        press_to[presses] = atol(argv[i + 1]);
                        presses++;
                    }
                    mock_start();
                    flush();
                    printf("S\\n");
                    cap = 200000L;
                    while (!mock_is_done() && cap-- > 0) {
                        tick();
                    }
                }
            #endif
                return 0;
            }
            """;

    private MockPortRun() {
    }

    /**
     * One marker of the run: I (after init), S (after sweep start), T (after a tick), M (tuning word), A (the
     * microseconds the rp2040 alarm moved on in a tick).
     */
    record Event(char kind, int tick, Integer code, long value) {
    }

    /** Renders, compiles and runs; returns the events. */
    static List<Event> run(FirmwareRequest request, Path dir, boolean looping, String... args) {
        CToolchain.require("gcc");
        FirmwareEmitter.emit(request, dir);
        boolean rp2040 = request.family().equals(TargetFamily.RP2040.folder());
        AtomicFiles.writeString(dir.resolve("harness.c"), HEAD + (rp2040 ? RP2040_GLUE : GENERIC_GLUE) + MAIN);
        List<String> cc = new ArrayList<>(List.of("gcc"));
        cc.addAll(CToolchain.STRICT);
        cc.addAll(List.of("-O1", "-o", "replay", "harness.c", "mock.c", "mock_data.c"));
        if (rp2040) {
            AtomicFiles.writeString(dir.resolve("mock_rp2040.h"), RP2040_CONFIG);
            cc.add("-DMOCK_CONFIG_HEADER=\"mock_rp2040.h\"");
        }
        if (looping) {
            cc.add("-DLOOPING");
        }
        CToolchain.compileClean(dir, cc);
        List<String> exe = new ArrayList<>(List.of(dir.resolve("replay").toString()));
        exe.addAll(List.of(args));
        String out = CToolchain.run(dir, exe);
        return replay(out, pinMap(request));
    }

    private static PinMap pinMap(FirmwareRequest r) {
        return r.pinMap().orElseGet(() -> PinMap.parse(r.pins().orElseThrow(),
                r.portWidth().orElse(TargetFamily.parse(r.family()).defaultPortWidth())));
    }

    private static List<Event> replay(String out, PinMap map) {
        List<String> ports = map.ports();
        long widthMask = map.portWidth() == 32 ? 0xFFFFFFFFL : (1L << map.portWidth()) - 1;
        Map<String, Long> images = new LinkedHashMap<>();
        for (String p : ports) {
            images.put(p, START_PATTERN & widthMask);
        }
        List<Event> events = new ArrayList<>();
        List<Integer> group = new ArrayList<>();
        int tick = 0;
        for (String line : out.split("\n")) {
            if (line.isEmpty()) {
                continue;
            }
            String[] f = line.split(" ");
            switch (f[0]) {
                case "W": {
                    int port = Integer.parseInt(f[1]);
                    long value = Long.parseLong(f[2], 16);
                    long mask = Long.parseLong(f[3], 16);
                    assertTrue(port < ports.size(), "write to unknown port index " + port);
                    String name = ports.get(port);
                    assertEquals(map.mask(name), mask, "mask of the write to port " + name);
                    assertEquals(0, value & ~mask, "levels outside the mask in a write to port " + name);
                    int expectedPort = group.size() % ports.size();
                    assertEquals(expectedPort, port, "ports out of their fixed order");
                    images.put(name, (images.get(name) & ~mask) | value);
                    group.add(port);
                    break;
                }
                case "I":
                case "S":
                case "T": {
                    Integer code = null;
                    if (!group.isEmpty()) {
                        assertEquals(ports.size(), group.size(), "one write per port per update");
                        code = map.decode(images);
                        for (String p : ports) {
                            assertEquals(START_PATTERN & widthMask & ~map.mask(p), images.get(p) & ~map.mask(p),
                                    "a pin outside the map changed on port " + p);
                        }
                    }
                    events.add(new Event(f[0].charAt(0), f[0].equals("T") ? tick++ : -1, code, 0));
                    group.clear();
                    break;
                }
                case "M":
                case "A":
                    events.add(new Event(f[0].charAt(0), -1, null, Long.parseLong(f[1])));
                    break;
                default:
                    fail("unexpected harness output: " + line);
            }
        }
        return events;
    }

    /** The codes put out by ticks, in order. */
    static List<Integer> tickCodes(List<Event> events) {
        List<Integer> out = new ArrayList<>();
        for (Event e : events) {
            if (e.kind() == 'T' && e.code() != null) {
                out.add(e.code());
            }
        }
        return out;
    }
}
