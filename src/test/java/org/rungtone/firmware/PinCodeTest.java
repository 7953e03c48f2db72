package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class PinCodeTest {
    @Test
    void pinCodeUsesOneTermPerDisplacementGroup() {
        PinMap m = PinMap.parse("PA3,PA7,PC0,PC1", 8);
        assertEquals("    const x_port_t v_a = (x_port_t)(((code & 0x0001u) << 3) | ((code & 0x0002u) << 6));",
                PinCode.compute(m, PinStrategy.SCATTER, "A", "x", "X"));
        assertEquals("    const x_port_t v_c = (x_port_t)((code & 0x000Cu) >> 2);",
                PinCode.compute(m, PinStrategy.SCATTER, "C", "x", "X"));
        assertEquals("    const x_port_t v_c = (x_port_t)X_READ_PORT(&x_pins_C[code]);",
                PinCode.compute(m, PinStrategy.TABLE, "C", "x", "X"));
        assertEquals("    const x_port_t v_b = (x_port_t)(((uint32_t)code & 0x003Fu) << 26);",
                PinCode.compute(PinMap.parse("PB26-PB31", 32), PinStrategy.SHIFT, "B", "x", "X"));
    }

    @Test
    void bytewiseTermsSplitAGroupByTheCodeByteItsBitsComeFrom() {
        // bits 6..9 go to PB0..PB3: bits 6, 7 from the low byte (down by 6), bits 8, 9 from the high (up by 2)
        PinMap m = PinMap.parse("PD2-PD7,PB0-PB3", 8);
        assertEquals("    const uint8_t b_lo = (uint8_t)code;\n    const uint8_t b_hi = (uint8_t)(code >> 8);\n"
                + "    const x_port_t v_b = (x_port_t)((uint8_t)((b_lo & 0xC0u) >> 6) | (uint8_t)((b_hi & 0x03u)"
                + " << 2));", PinCode.computeBytewise(m, PinStrategy.SHIFT, "B", "x", "X"));
        assertEquals("    const uint8_t d_lo = (uint8_t)code;\n    const x_port_t v_d = (x_port_t)(uint8_t)((d_lo"
                + " & 0x3Fu) << 2);", PinCode.computeBytewise(m, PinStrategy.SHIFT, "D", "x", "X"));
        assertEquals(PinCode.compute(m, PinStrategy.TABLE, "D", "x", "X"),
                PinCode.computeBytewise(m, PinStrategy.TABLE, "D", "x", "X"));
    }

    @Test
    void pinTablesHoldThePortLevelsOfEveryCode() {
        PinMap m = PinMap.parse("PA3,PA7,PC0,PC1", 8);
        int[] a = PinCode.table(m, "A");
        int[] c = PinCode.table(m, "C");
        for (int code = 0; code < 16; code++) {
            assertEquals(m.encode(code).get(0).value(), a[code]);
            assertEquals(m.encode(code).get(1).value(), c[code]);
        }
    }
}
