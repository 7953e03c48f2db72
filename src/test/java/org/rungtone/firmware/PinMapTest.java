package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.rungtone.internal.InputError;

class PinMapTest {
    private static List<String> names(PinMap m) {
        return m.pins().stream().map(Pin::name).toList();
    }

    @Test
    void readsARangeBitZeroFirst() {
        PinMap m = PinMap.parse("B0-B5", 8);
        assertEquals(List.of("B0", "B1", "B2", "B3", "B4", "B5"), names(m));
        assertEquals(6, m.bits());
        assertEquals(List.of("B"), m.ports());
        assertEquals(0x3F, m.mask("B"));
    }

    @Test
    void readsListsDescendingRangesShortRangesAndThePPrefix() {
        assertEquals(List.of("A3", "A7", "C0", "C1"), names(PinMap.parse("A3,A7,C0,C1", 8)));
        assertEquals(List.of("B5", "B4", "B3"), names(PinMap.parse("B5-B3", 8)));
        assertEquals(List.of("D2", "D3", "D4"), names(PinMap.parse("D2-4", 8)));
        assertEquals(List.of("B0", "B1", "C7"), names(PinMap.parse(" PB0 - pb1 , c7 ", 8)));
        assertEquals(List.of("1.0", "1.1", "1.2", "2.7"), names(PinMap.parse("P1.0-P1.2,2.7", 8)));
        assertEquals(List.of("P10", "P11"), names(PinMap.parse("P10,P11", 16)));
    }

    @Test
    void writesCanonicalNotation() {
        assertEquals("B0-B5", PinMap.parse("B0,B1,B2,B3,B4,B5", 8).notation());
        assertEquals("A3,A7,C0,C1", PinMap.parse("A3,A7,C0-C1", 8).notation());
        assertEquals("D7-D5,B0", PinMap.parse("D7-5,PB0", 8).notation());
        assertEquals("1.0-1.3", PinMap.parse("P1.0-3", 8).notation());
    }

    @Test
    void updatesPortsInAFixedOrder() {
        assertEquals(List.of("A", "C", "D", "1"), PinMap.parse("D0,1.0,C1,A4", 8).ports());
    }

    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "A3,A3|target.pins 'A3,A3': pin A3 at column 4 is already bit 0; each pin may appear once",
        "B0-B3,B2|target.pins 'B0-B3,B2': pin B2 at column 7 is already bit 2; each pin may appear once",
        "B0-B9|target.pins 'B0-B9': pin B9 at column 4 is beyond the 8-bit port (pins 0-7)",
        "C0,C8|target.pins 'C0,C8': pin C8 at column 4 is beyond the 8-bit port (pins 0-7)",
        "B0-C3|target.pins 'B0-C3': range at column 1 runs from port B to port C; a range stays on one port,"
                + " e.g. B0-B7,C0-C3",
        "A0,B0,C0,D0,E0|target.pins 'A0,B0,C0,D0,E0': port E at column 13 would be a fifth port; at most 4 ports",
        "B0;B1|target.pins 'B0;B1': unexpected ';' at column 3; write pins like B3, ranges like B0-B5, separated"
                + " by commas",
        "B|target.pins 'B': expected a pin number after port B at column 2",
        "B0,|target.pins 'B0,': a pin is missing at the end; write pins like B3, ranges like B0-B5",
        "#3|target.pins '#3': expected a pin such as B3 or 1.3 at column 1, found '#'",
    })
    void rejectsBadMapsNamingTheColumn(String text, String message) {
        assertEquals(message, assertThrows(InputError.class, () -> PinMap.parse(text, 8)).getMessage());
    }

    @Test
    void rejectsMoreThanSixteenPinsAnEmptyMapAndOddWidths() {
        assertEquals("target.pins 'A0-A15,B0': pin B0 at column 8 is pin 17; codes have at most 16 bits, one pin each",
                assertThrows(InputError.class, () -> PinMap.parse("A0-A15,B0", 16)).getMessage());
        assertEquals("target.pins is empty; list one pin per code bit, bit 0 first, e.g. B0-B5 or A3,A7,C0,C1",
                assertThrows(InputError.class, () -> PinMap.parse("  ", 8)).getMessage());
        assertEquals("target.port_width must be 8, 16 or 32: 12",
                assertThrows(InputError.class, () -> PinMap.parse("B0", 12)).getMessage());
    }

    @Test
    void rejectsMoreBitsThanPins() {
        PinMap m = PinMap.parse("B0-B5", 8);
        m.requireBits(6);
        assertEquals("target.pins B0-B5 lists 6 pins but the codes have 8 bits; list exactly one pin per bit, bit 0"
                + " first", assertThrows(InputError.class, () -> m.requireBits(8)).getMessage());
    }

    @Test
    void encodesEachPortWithItsMask() {
        PinMap m = PinMap.parse("A3,A7,C0,C1", 8);
        // code 0b1011: bit 0 -> A3 high, bit 1 -> A7 high, bit 2 -> C0 low, bit 3 -> C1 high
        List<PortWrite> w = m.encode(0b1011);
        assertEquals(List.of(new PortWrite("A", 0x88, 0x88), new PortWrite("C", 0x02, 0x03)), w);
        assertEquals(0x02, w.get(1).setBits());
        assertEquals(0x01, w.get(1).clearBits());
        // a BSRR-style word: set bits in the low half, reset bits in the high half
        assertEquals(0x00010002L, w.get(1).setBits() | w.get(1).clearBits() << 16);
    }

    @Test
    void decodeInvertsEncodeForEveryCode() {
        for (String text : List.of("B0-B5", "A3,A7,C0,C1,B2,B1", "D7-D0,B0,B3", "A31,A0,B16-B20")) {
            PinMap m = PinMap.parse(text, 32);
            for (int code = 0; code < 1 << m.bits(); code++) {
                Map<String, Long> levels = new LinkedHashMap<>();
                for (PortWrite w : m.encode(code)) {
                    assertEquals(0, w.value() & ~w.mask(), "no level outside the mask");
                    assertEquals(m.mask(w.port()), w.mask());
                    levels.put(w.port(), w.value() | ~w.mask() & 0x5A5A5A5AL);
                }
                assertEquals(code, m.decode(levels), text + " code " + code);
            }
        }
    }

    @Test
    void choosesShiftTableOrScatter() {
        assertEquals(PinStrategy.SHIFT, PinMap.parse("B0-B5", 8).resolve(PinStrategy.AUTO));
        assertEquals(PinStrategy.SHIFT, PinMap.parse("B2-B5,D6,D7", 8).resolve(PinStrategy.AUTO));
        assertEquals(PinStrategy.TABLE, PinMap.parse("A3,A7,C0,C1", 8).resolve(PinStrategy.AUTO));
        assertEquals(PinStrategy.TABLE, PinMap.parse("B5-B0", 8).resolve(PinStrategy.AUTO));
        PinMap wide = PinMap.parse("A0-A5,B7,B5,B3,B1,C4,C0", 8);
        assertEquals(PinStrategy.SCATTER, wide.resolve(PinStrategy.AUTO));
        assertEquals(PinStrategy.SCATTER, PinMap.parse("B0-B5", 8).resolve(PinStrategy.SCATTER));
        assertEquals(PinStrategy.TABLE, wide.resolve(PinStrategy.TABLE));
    }

    @Test
    void groupsBitsByDisplacement() {
        PinMap m = PinMap.parse("A3,A7,C0,C1", 8);
        assertEquals(Map.of(3, 0b01L, 6, 0b10L), m.shiftGroups("A"));
        assertEquals(Map.of(-2, 0b1100L), m.shiftGroups("C"));
        assertFalse(m.shiftable());
        assertTrue(PinMap.parse("B2-B5,D6,D7", 8).shiftable());
    }

    @Test
    void refusesForcedStrategiesThatCannotWork() {
        assertEquals("target.pin_strategy shift needs the pins of each port in the order and spacing of their code"
                + " bits (e.g. B0-B5); A3,A7,C0,C1 needs table or scatter", assertThrows(InputError.class,
                        () -> PinMap.parse("A3,A7,C0,C1", 8).resolve(PinStrategy.SHIFT)).getMessage());
        assertEquals("target.pin_strategy table for 13 bits needs 8192 entries per port; tables stop at 12 bits,"
                + " use scatter", assertThrows(InputError.class,
                        () -> PinMap.parse("A0-A12", 16).resolve(PinStrategy.TABLE)).getMessage());
    }

    @Test
    void reportsTableSize() {
        // 3 ports x 2^6 entries x 1 byte
        assertEquals(192, PinMap.parse("A3,A7,C0,C1,B2,B1", 8).tableBytes());
        // 1 port x 2^4 entries x 4 bytes
        assertEquals(64, PinMap.parse("A31,A0,A5,A9", 32).tableBytes());
    }

    @Test
    void describesEveryBit() {
        assertEquals(List.of("bit 0 (LSB) -> C1", "bit 1 -> C0", "bit 2 (MSB) -> D4"),
                PinMap.parse("C1,C0,D4", 8).describeBits());
    }
}
