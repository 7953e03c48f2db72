package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;

/**
 * Random valid pin maps (1..16 distinct pins on up to four ports of 8, 16 or 32 bits): the port writes for a
 * code, applied over whatever the ports held before, show that code again, and touch only the ladder's pins.
 */
class PinMapPropertiesTest {
    private static final List<String> LETTERS = List.of("A", "B", "C", "D", "E");
    private static final List<String> NUMBERS = List.of("0", "1", "2", "3", "4");

    /** A map with a code to put on it and what every port held before. */
    record Case(PinMap map, int code, Map<String, Long> before) {
    }

    @Provide
    Arbitrary<Case> cases() {
        Arbitrary<Integer> width = Arbitraries.of(8, 16, 32);
        return Arbitraries.lazy(() -> width.flatMap(w -> Arbitraries.of(LETTERS, NUMBERS)
                .flatMap(names -> Arbitraries.of(names).list().ofMinSize(1).ofMaxSize(PinMap.MAX_PORTS)
                        .uniqueElements().flatMap(ports -> pins(w, ports)))
                .flatMap(pins -> {
                    PinMap map = PinMap.of(w, pins);
                    Arbitrary<Integer> code = Arbitraries.integers().between(0, (1 << map.bits()) - 1);
                    Arbitrary<Long> junk = Arbitraries.longs().between(0, w == 32 ? 0xFFFF_FFFFL : (1L << w) - 1);
                    return code.flatMap(c -> junk.list().ofSize(map.ports().size()).map(levels -> {
                        Map<String, Long> before = new HashMap<>();
                        for (int i = 0; i < levels.size(); i++) {
                            before.put(map.ports().get(i), levels.get(i));
                        }
                        return new Case(map, c, before);
                    }));
                })));
    }

    /** 1..16 distinct pins, in random order, on the given ports, each below the port width. */
    private static Arbitrary<List<Pin>> pins(int width, List<String> ports) {
        Arbitrary<Pin> pin = Arbitraries.of(ports).flatMap(p -> Arbitraries.integers().between(0, width - 1)
                .map(n -> new Pin(p, n)));
        return pin.list().ofMinSize(1).ofMaxSize(PinMap.MAX_PINS).uniqueElements();
    }

    @Property(tries = 500)
    void portValuesDecodeBackToTheCode(@ForAll("cases") Case c) {
        Map<String, Long> levels = new HashMap<>(c.before());
        Set<String> written = new LinkedHashSet<>();
        for (PortWrite w : c.map().encode(c.code())) {
            assertEquals(0, w.value() & ~w.mask(), "value outside the mask on port " + w.port());
            assertEquals(c.map().mask(w.port()), w.mask());
            assertTrue(written.add(w.port()), "port " + w.port() + " written twice");
            levels.put(w.port(), levels.get(w.port()) & ~w.mask() | w.value());
        }
        assertEquals(new LinkedHashSet<>(c.map().ports()), written, "every port of the map is written");
        assertEquals(c.code(), c.map().decode(levels), () -> c.map() + " code " + c.code());
        for (String port : c.map().ports()) {
            long outside = ~c.map().mask(port);
            assertEquals(c.before().get(port) & outside, levels.get(port) & outside,
                    "pins outside the ladder keep their levels on port " + port);
        }
    }

    /** The shift-and-mask groups the emitted code uses give the same port values as {@link PinMap#encode}. */
    @Property(tries = 300)
    void shiftGroupsRebuildThePortValues(@ForAll("cases") Case c) {
        for (PortWrite w : c.map().encode(c.code())) {
            long value = 0;
            for (Map.Entry<Integer, Long> g : c.map().shiftGroups(w.port()).entrySet()) {
                long bits = c.code() & g.getValue();
                value |= g.getKey() >= 0 ? bits << g.getKey() : bits >>> -g.getKey();
            }
            assertEquals(w.value(), value, "port " + w.port() + " of " + c.map());
        }
    }

    @Property(tries = 300)
    void notationParsesBackToTheSameMap(@ForAll("cases") Case c) {
        PinMap again = PinMap.parse(c.map().notation(), c.map().portWidth());
        assertEquals(c.map(), again, c.map().notation());
        List<Pin> order = new ArrayList<>();
        for (int b = 0; b < again.bits(); b++) {
            order.add(again.pin(b));
        }
        assertEquals(c.map().pins(), order, "bit order survives the notation");
    }
}
