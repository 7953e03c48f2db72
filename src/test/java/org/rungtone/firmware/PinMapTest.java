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
        PinMap m = PinMap.parse("PB0-PB5", 8);
        assertEquals(List.of("PB0", "PB1", "PB2", "PB3", "PB4", "PB5"), names(m));
        assertEquals(6, m.bits());
        assertEquals(List.of("B"), m.ports());
        assertEquals(0x3F, m.mask("B"));
    }

    @Test
    void readsListsDescendingRangesShortRangesAndNumberedPorts() {
        assertEquals(List.of("PA3", "PA7", "PC0", "PC1"), names(PinMap.parse("PA3,PA7,PC0,PC1", 8)));
        assertEquals(List.of("PB5", "PB4", "PB3"), names(PinMap.parse("PB5-PB3", 8)));
        assertEquals(List.of("PD2", "PD3", "PD4"), names(PinMap.parse("PD2-4", 8)));
        assertEquals(List.of("PB0", "PB1", "PC7"), names(PinMap.parse(" PB0 - pb1 , Pc7 ", 8)));
        assertEquals(List.of("P1.0", "P1.1", "P1.2", "P2.7"), names(PinMap.parse("P1.0-P1.2,2.7", 8)));
        assertEquals(List.of("PP10", "PP11"), names(PinMap.parse("PP10,PP11", 16)));
    }

    @Test
    void readsTheGpioBankAsTheRp2040DatasheetNamesIt() {
        PinMap m = PinMap.parse("GPIO2-GPIO7,gpio29,GPIO10-8", 32);
        assertEquals(List.of("GPIO2", "GPIO3", "GPIO4", "GPIO5", "GPIO6", "GPIO7", "GPIO29", "GPIO10", "GPIO9",
                "GPIO8"), names(m));
        assertEquals(List.of(Pin.GPIO_BANK), m.ports());
        assertEquals(0x200007FCL, m.mask(Pin.GPIO_BANK));
        assertEquals("GPIO2-GPIO7,GPIO29,GPIO10-GPIO8", m.notation());
        assertEquals("target.pins 'GPIO2-GPIO40': pin GPIO40 at column 7 is beyond the 32-bit port (pins 0-31)",
                assertThrows(InputError.class, () -> PinMap.parse("GPIO2-GPIO40", 32)).getMessage());
    }

    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "D2-D7|PD2-PD7",
        "b0 - b5, PD2|PB0 - PB5, PD2",
        "PB0-B5|PB0-PB5",
        "D7-5,1.0,P2.3,C1|PD7-5,1.0,P2.3,PC1",
        "P3|PP3",
    })
    void refusesPortLettersWithoutTheirP(String text, String datasheet) {
        assertEquals("target.pins '" + text + "': write port pins the way the datasheet names them: " + datasheet,
                assertThrows(InputError.class, () -> PinMap.parse(text, 8)).getMessage());
        assertEquals(PinMap.parse(datasheet, 8).pins(), parsedWithHint(text));
    }

    /** The pins of the hint in the refusal: the list the user meant. */
    private static List<Pin> parsedWithHint(String text) {
        String m = assertThrows(InputError.class, () -> PinMap.parse(text, 8)).getMessage();
        return PinMap.parse(m.substring(m.lastIndexOf(": ") + 2), 8).pins();
    }

    @Test
    void writesCanonicalNotation() {
        assertEquals("PB0-PB5", PinMap.parse("PB0,PB1,PB2,PB3,PB4,PB5", 8).notation());
        assertEquals("PA3,PA7,PC0,PC1", PinMap.parse("PA3,PA7,PC0-PC1", 8).notation());
        assertEquals("PD7-PD5,PB0", PinMap.parse("PD7-5,PB0", 8).notation());
        assertEquals("P1.0-P1.3", PinMap.parse("1.0-3", 8).notation());
    }

    @Test
    void updatesPortsInAFixedOrder() {
        assertEquals(List.of("A", "C", "D", "1"), PinMap.parse("PD0,1.0,PC1,PA4", 8).ports());
    }

    @ParameterizedTest
    @CsvSource(delimiter = '|', value = {
        "PA3,PA3|target.pins 'PA3,PA3': pin PA3 at column 5 is already bit 0; each pin may appear once",
        "PB0-PB3,PB2|target.pins 'PB0-PB3,PB2': pin PB2 at column 9 is already bit 2; each pin may appear once",
        "PB0-PB9|target.pins 'PB0-PB9': pin PB9 at column 5 is beyond the 8-bit port (pins 0-7)",
        "PC0,PC8|target.pins 'PC0,PC8': pin PC8 at column 5 is beyond the 8-bit port (pins 0-7)",
        "P1.0,1.8|target.pins 'P1.0,1.8': pin P1.8 at column 6 is beyond the 8-bit port (pins 0-7)",
        "PB0-PC3|target.pins 'PB0-PC3': range at column 1 runs from port B to port C; a range stays on one port,"
                + " e.g. PB0-PB7,PC0-PC3",
        "PA0,PB0,PC0,PD0,PE0|target.pins 'PA0,PB0,PC0,PD0,PE0': port E at column 17 would be a fifth port; at most"
                + " 4 ports",
        "PB0;PB1|target.pins 'PB0;PB1': unexpected ';' at column 4; write pins like PB3, ranges like PB0-PB5,"
                + " separated by commas",
        "PB|target.pins 'PB': expected a pin number after port B at column 3",
        "B|target.pins 'B': expected a pin such as PB3 or P1.3 at column 1, found 'B'",
        "PB0,|target.pins 'PB0,': a pin is missing at the end; write pins like PB3, ranges like PB0-PB5",
        "#3|target.pins '#3': expected a pin such as PB3 or P1.3 at column 1, found '#'",
    })
    void rejectsBadMapsNamingTheColumn(String text, String message) {
        assertEquals(message, assertThrows(InputError.class, () -> PinMap.parse(text, 8)).getMessage());
    }

    @Test
    void rejectsMoreThanSixteenPinsAnEmptyMapAndOddWidths() {
        assertEquals("target.pins 'PA0-PA15,PB0': pin PB0 at column 10 is pin 17; codes have at most 16 bits, one"
                + " pin each", assertThrows(InputError.class, () -> PinMap.parse("PA0-PA15,PB0", 16)).getMessage());
        assertEquals("target.pins is empty; list one pin per code bit, bit 0 first, e.g. PB0-PB5 or"
                + " PA3,PA7,PC0,PC1",
                assertThrows(InputError.class, () -> PinMap.parse("  ", 8)).getMessage());
        assertEquals("target.port_width must be 8, 16 or 32: 12",
                assertThrows(InputError.class, () -> PinMap.parse("PB0", 12)).getMessage());
    }

    @Test
    void rejectsMoreBitsThanPins() {
        PinMap m = PinMap.parse("PB0-PB5", 8);
        m.requireBits(6);
        assertEquals("target.pins PB0-PB5 lists 6 pins but the codes have 8 bits; list exactly one pin per bit, bit 0"
                + " first", assertThrows(InputError.class, () -> m.requireBits(8)).getMessage());
    }

    @Test
    void encodesEachPortWithItsMask() {
        PinMap m = PinMap.parse("PA3,PA7,PC0,PC1", 8);
        // code 0b1011: bit 0 -> PA3 high, bit 1 -> PA7 high, bit 2 -> PC0 low, bit 3 -> PC1 high
        List<PortWrite> w = m.encode(0b1011);
        assertEquals(List.of(new PortWrite("A", 0x88, 0x88), new PortWrite("C", 0x02, 0x03)), w);
        assertEquals(0x02, w.get(1).setBits());
        assertEquals(0x01, w.get(1).clearBits());
        // a BSRR-style word: set bits in the low half, reset bits in the high half
        assertEquals(0x00010002L, w.get(1).setBits() | w.get(1).clearBits() << 16);
    }

    @Test
    void decodeInvertsEncodeForEveryCode() {
        for (String text : List.of("PB0-PB5", "PA3,PA7,PC0,PC1,PB2,PB1", "PD7-PD0,PB0,PB3", "PA31,PA0,PB16-PB20")) {
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
        assertEquals(PinStrategy.SHIFT, PinMap.parse("PB0-PB5", 8).resolve(PinStrategy.AUTO));
        assertEquals(PinStrategy.SHIFT, PinMap.parse("PB2-PB5,PD6,PD7", 8).resolve(PinStrategy.AUTO));
        assertEquals(PinStrategy.TABLE, PinMap.parse("PA3,PA7,PC0,PC1", 8).resolve(PinStrategy.AUTO));
        assertEquals(PinStrategy.TABLE, PinMap.parse("PB5-PB0", 8).resolve(PinStrategy.AUTO));
        PinMap wide = PinMap.parse("PA0-PA5,PB7,PB5,PB3,PB1,PC4,PC0", 8);
        assertEquals(PinStrategy.SCATTER, wide.resolve(PinStrategy.AUTO));
        assertEquals(PinStrategy.SCATTER, PinMap.parse("PB0-PB5", 8).resolve(PinStrategy.SCATTER));
        assertEquals(PinStrategy.TABLE, wide.resolve(PinStrategy.TABLE));
    }

    @Test
    void groupsBitsByDisplacement() {
        PinMap m = PinMap.parse("PA3,PA7,PC0,PC1", 8);
        assertEquals(Map.of(3, 0b01L, 6, 0b10L), m.shiftGroups("A"));
        assertEquals(Map.of(-2, 0b1100L), m.shiftGroups("C"));
        assertFalse(m.shiftable());
        assertTrue(PinMap.parse("PB2-PB5,PD6,PD7", 8).shiftable());
    }

    @Test
    void refusesForcedStrategiesThatCannotWork() {
        assertEquals("target.pin_strategy shift needs the pins of each port in the order and spacing of their code"
                + " bits (e.g. PB0-PB5); PA3,PA7,PC0,PC1 needs table or scatter", assertThrows(InputError.class,
                        () -> PinMap.parse("PA3,PA7,PC0,PC1", 8).resolve(PinStrategy.SHIFT)).getMessage());
        assertEquals("target.pin_strategy table for 13 bits needs 8192 entries per port; tables stop at 12 bits,"
                + " use scatter", assertThrows(InputError.class,
                        () -> PinMap.parse("PA0-PA12", 16).resolve(PinStrategy.TABLE)).getMessage());
    }

    @Test
    void reportsTableSize() {
        // 3 ports x 2^6 entries x 1 byte
        assertEquals(192, PinMap.parse("PA3,PA7,PC0,PC1,PB2,PB1", 8).tableBytes());
        // 1 port x 2^4 entries x 4 bytes
        assertEquals(64, PinMap.parse("PA31,PA0,PA5,PA9", 32).tableBytes());
    }

    @Test
    void describesEveryBit() {
        assertEquals(List.of("bit 0 (LSB) -> PC1", "bit 1 -> PC0", "bit 2 (MSB) -> PD4"),
                PinMap.parse("PC1,PC0,PD4", 8).describeBits());
    }
}
