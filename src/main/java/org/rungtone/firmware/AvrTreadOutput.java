package org.rungtone.firmware;

import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The port writes of {@link AvrTreadTick}: every port's value of the code into a register (by shift or from
 * the port's table), the masked ports' other pins merged in, then one OUT per port back to back. A code of up
 * to 8 bits is in r24, and the writes use only r25 and Z besides, keeping r24 unless three ports need it as a
 * value register; a wider one is in r25:r24, which stays, and the values go into r18, r19 and r30.
 */
final class AvrTreadOutput {
    private AvrTreadOutput() {
    }

    /**
     * The instructions; the code is in r24.
     *
     * @return true when r24 no longer holds the code afterwards (three ports)
     */
    static boolean write(AvrFastTick.Asm a, EmitPlan p) {
        if (!p.tread.compact()) {
            writeWide(a, p);
            return false;
        }
        a.op("lds r24, %[next]");
        List<String> ports = p.pins.ports();
        int n = ports.size();
        boolean table = p.strategy == PinStrategy.TABLE;
        // three ports: the last shift works on the code in place; the second table read replaces the code
        String[] values = n == 1 ? new String[] {"r25"} : n == 2 ? new String[] {"r25", "r30"}
                : table ? new String[] {"r25", "r24", "r30"} : new String[] {"r25", "r30", "r24"};
        String scratch = n == 1 ? "r30" : "r31";
        if (table) {
            table(a, ports, values);
        } else {
            for (int i = 0; i < n; i++) {
                AvrFastTick.shift(a, p, ports.get(i), values[i], "r24".equals(values[i]));
            }
        }
        mergeAndWrite(a, p, values, scratch);
        return n == 3;
    }

    /** The masked ports' other pins merged into their values through {@code scratch}, then one OUT each. */
    private static void mergeAndWrite(AvrFastTick.Asm a, EmitPlan p, String[] values, String scratch) {
        List<String> ports = p.pins.ports();
        for (int i = 0; i < ports.size(); i++) {
            long mask = p.pins.mask(ports.get(i));
            if (mask != 0xFF) {
                a.op("in " + scratch + ", %[port_" + AvrFastTick.lower(ports.get(i)) + "]")
                        .op("andi " + scratch + ", " + String.format(Locale.ROOT, "0x%02x", ~mask & 0xFF))
                        .op("or " + values[i] + ", " + scratch);
            }
        }
        for (int i = 0; i < ports.size(); i++) {
            a.op("out %[port_" + AvrFastTick.lower(ports.get(i)) + "], " + values[i]);
        }
    }

    /**
     * Codes of 9 to 12 bits in r25:r24, which stay: the ports' values into r18, r19 and r30, by a table read
     * through Z each or by shifts (a shift right by 5 to 7 is one by 8 less a shift left of the pair).
     */
    private static void writeWide(AvrFastTick.Asm a, EmitPlan p) {
        a.op("lds r24, %[next]").op("lds r25, %[next]+1");
        List<String> ports = p.pins.ports();
        String[] values = {"r18", "r19", "r30"};
        for (int i = 0; i < ports.size(); i++) {
            String port = ports.get(i);
            if (p.strategy == PinStrategy.TABLE) {
                String table = "%[pins_" + AvrFastTick.lower(port) + "]";
                a.op("movw r30, r24").op("subi r30, lo8(-(" + table + "))").op("sbci r31, hi8(-(" + table + "))")
                        .op("lpm " + values[i] + ", Z");
            } else {
                shiftWide(a, p, port, values[i]);
            }
        }
        mergeAndWrite(a, p, Arrays.copyOf(values, ports.size()), "r31");
    }

    /** The port's value, {@code (code & m) << d} of its one shift group, into {@code to}. */
    private static void shiftWide(AvrFastTick.Asm a, EmitPlan p, String port, String to) {
        Map.Entry<Integer, Long> g = p.pins.shiftGroups(port).entrySet().iterator().next();
        int d = g.getKey();
        if (d >= 0) {
            // only the low byte reaches the port
            AvrFastTick.shift(a, p, port, to, false);
            return;
        }
        int r = -d;
        long kept = ((1L << p.bits) - 1) >> r & 0xFF;
        long wanted = g.getValue() >> r & 0xFF;
        String at;
        boolean mask = kept != wanted;
        if (r >= 8) {
            at = to;
            a.op("mov " + to + ", r25");
            int left = r - 8;
            if (left >= 4) {
                a.op("swap " + to);
                left -= 4;
                mask = true;
            }
            for (int i = 0; i < left; i++) {
                a.op("lsr " + to);
            }
        } else if (r <= 4) {
            at = "r30";
            a.op("movw r30, r24");
            for (int i = 0; i < r; i++) {
                a.op("lsr r31").op("ror r30");
            }
        } else {
            at = "r31";
            a.op("movw r30, r24");
            for (int i = 0; i < 8 - r; i++) {
                a.op("lsl r30").op("rol r31");
            }
        }
        if (mask) {
            a.op("andi " + at + ", " + String.format(Locale.ROOT, "0x%02x", wanted));
        }
        if (!at.equals(to)) {
            a.op("mov " + to + ", " + at);
        }
    }

    /**
     * The table reads: the first through r25 = 0 and one MOVW, the second from the code again; the third, the
     * code gone into r24, by moving Z from the second table to the third.
     */
    private static void table(AvrFastTick.Asm a, List<String> ports, String[] values) {
        a.op("ldi r25, 0").op("movw r30, r24");
        for (int i = 0; i < ports.size(); i++) {
            String table = "%[pins_" + AvrFastTick.lower(ports.get(i)) + "]";
            if (i == 1) {
                a.op("mov r30, r24").op("ldi r31, 0");
            } else if (i == 2) {
                String before = "%[pins_" + AvrFastTick.lower(ports.get(1)) + "]";
                a.op("subi r30, lo8(" + before + ")").op("sbci r31, hi8(" + before + ")");
            }
            a.op("subi r30, lo8(-(" + table + "))").op("sbci r31, hi8(-(" + table + "))")
                    .op("lpm " + values[i] + ", Z");
        }
    }
}
