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
 * Builds emitted generic C (symbol prefix {@code mock}) on the host with a harness whose port hook prints
 * every write, runs it, and replays the writes against port images in Java: every write must carry exactly
 * the ladder pins of its port as mask and no level outside it, ports must come in the fixed order, and
 * pins outside the map must keep their starting levels. The result is the list of events with the code
 * each one put on the ladder.
 */
final class MockPortRun {
    /** Starting level of every port: pins outside the map must keep it. */
    static final long START_PATTERN = 0xA5A5A5A5L;

    private static final String HARNESS = """
            #include <stdio.h>
            #include <stdlib.h>
            #include <stdint.h>
            #include "mock.h"

            static long tick_no = -1;
            static long press_from[8];
            static long press_to[8];
            static int presses;

            void mock_port_write(uint8_t port, mock_port_t value, mock_port_t mask)
            {
                printf("W %u %lx %lx\\n", (unsigned)port, (unsigned long)value, (unsigned long)mask);
            }

            #ifdef MOCK_DEBOUNCE_TICKS
            uint8_t mock_button_pressed(void)
            {
                int i;
                for (i = 0; i < presses; i++) {
                    if (tick_no >= press_from[i] && tick_no < press_to[i]) {
                        return 1u;
                    }
                }
                return 0u;
            }
            #endif

            static void tick(void)
            {
                tick_no++;
                mock_tick();
                printf("T\\n");
            }

            int main(int argc, char **argv)
            {
                long cap = 10000000L;
                (void)argc;
                (void)cap;
                (void)press_from;
                (void)press_to;
                (void)presses;
                mock_init();
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

    /** One marker of the run: I (after init), S (after sweep start), T (after a tick), M (tuning word). */
    record Event(char kind, int tick, Integer code, long value) {
    }

    /** Renders, compiles and runs; returns the events. */
    static List<Event> run(FirmwareRequest request, Path dir, boolean looping, String... args) {
        CToolchain.require("gcc");
        FirmwareEmitter.emit(request, dir);
        AtomicFiles.writeString(dir.resolve("harness.c"), HARNESS);
        List<String> cc = new ArrayList<>(List.of("gcc"));
        cc.addAll(CToolchain.STRICT);
        cc.addAll(List.of("-O1", "-o", "replay", "harness.c", "mock.c", "mock_data.c"));
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
        return r.pinMap().orElseGet(() -> PinMap.parse(r.pins().orElseThrow(), r.portWidth().orElse(8)));
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
                    events.add(new Event('M', -1, null, Long.parseLong(f[1])));
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
