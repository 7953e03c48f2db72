package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.fail;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.rungtone.testing.AvrTrace;
import org.rungtone.testing.AvrTrace.Interrupt;
import org.rungtone.testing.AvrTrace.Write;

/**
 * An {@link AvrSimulatorTest} trace cut into ticks and checked write by write: the code init parks the ladder at; the
 * interrupts that wrote the ports (one write per ladder port, in the map's port order) and the code each
 * left on the pins; the interrupts after the last of those.
 */
final class AvrTicks {
    int initCode;
    final List<Integer> codes = new ArrayList<>();
    final List<Interrupt> playing = new ArrayList<>();
    final List<Interrupt> after = new ArrayList<>();
    long window;

    static AvrTicks of(AvrTrace trace, PinMap map) {
        AvrTicks t = new AvrTicks();
        long setupDone = trace.marker("GPIOR0", 1);
        long initDone = trace.marker("GPIOR0", 2);
        Map<String, Integer> image = new HashMap<>();
        List<Write> pending = new ArrayList<>();
        int w = 0;
        List<Write> writes = trace.writes();
        for (Interrupt i : trace.interrupts()) {
            pending.clear();
            for (; w < writes.size() && writes.get(w).cycle() < i.exitCycle(); w++) {
                Write x = writes.get(w);
                checkOtherPins(x, map, setupDone);
                image.put(x.register(), x.value());
                if (x.cycle() > initDone && !x.register().equals("GPIOR0")) {
                    if (!i.contains(x)) {
                        fail("port write outside the timer interrupt: " + x);
                    }
                    pending.add(x);
                }
                if (x.register().equals("GPIOR0") && x.value() == 2) {
                    t.initCode = decode(image, map);
                    checkOutputs(image, map);
                }
            }
            t.tick(i, pending, image, map);
        }
        return t;
    }

    private void tick(Interrupt i, List<Write> writes, Map<String, Integer> image, PinMap map) {
        if (writes.isEmpty()) {
            if (!playing.isEmpty()) {
                after.add(i);
            }
            return;
        }
        if (!after.isEmpty()) {
            fail("the interrupt at cycle " + after.get(0).entryCycle() + " wrote no code, but later ones did");
        }
        List<String> order = writes.stream().map(Write::register).toList();
        assertEquals(map.ports().stream().map(p -> "PORT" + p).toList(), order, "port writes at tick "
                + playing.size());
        playing.add(i);
        window = Math.max(window, writes.get(writes.size() - 1).cycle() - writes.get(0).cycle());
        codes.add(decode(image, map));
    }

    /** Pins outside the map keep main()'s pattern; PINx (toggle) is never written. */
    private static void checkOtherPins(Write x, PinMap map, long setupDone) {
        String r = x.register();
        if (x.cycle() < setupDone || r.equals("GPIOR0")) {
            return;
        }
        if (r.startsWith("PIN")) {
            fail("write to " + r + " toggles pins: " + x);
        }
        String port = r.substring(r.length() - 1);
        int free = AvrSimulatorTest.PORT_PINS.get(port) & ~(int) map.mask(port);
        int pattern = (r.startsWith("DDR") ? AvrSimulatorTest.DDR_PATTERN : AvrSimulatorTest.PORT_PATTERN) & free;
        assertEquals(pattern, x.value() & free, "pins outside the map changed by " + x);
    }

    /** After init, every ladder pin is an output. */
    private static void checkOutputs(Map<String, Integer> image, PinMap map) {
        for (String port : map.ports()) {
            int mask = (int) map.mask(port);
            assertEquals(mask, image.getOrDefault("DDR" + port, 0) & mask, "DDR" + port + " after init");
        }
    }

    private static int decode(Map<String, Integer> image, PinMap map) {
        int code = 0;
        for (int bit = 0; bit < map.bits(); bit++) {
            Pin p = map.pin(bit);
            code |= ((image.getOrDefault("PORT" + p.port(), 0) >> p.pin()) & 1) << bit;
        }
        return code;
    }
}
