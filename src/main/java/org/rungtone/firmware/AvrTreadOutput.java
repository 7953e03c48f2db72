package org.rungtone.firmware;

import java.util.List;
import java.util.Locale;

/**
 * The port writes of {@link AvrTreadTick}: every port's value of the code in r24 into a register (by shift or
 * from the port's table), the masked ports' other pins merged in, then one OUT per port back to back. It uses
 * only r25 and Z besides r24, which it keeps unless three ports need it as a value register.
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
        for (int i = 0; i < n; i++) {
            long mask = p.pins.mask(ports.get(i));
            if (mask != 0xFF) {
                a.op("in " + scratch + ", %[port_" + AvrFastTick.lower(ports.get(i)) + "]")
                        .op("andi " + scratch + ", " + String.format(Locale.ROOT, "0x%02x", ~mask & 0xFF))
                        .op("or " + values[i] + ", " + scratch);
            }
        }
        for (int i = 0; i < n; i++) {
            a.op("out %[port_" + AvrFastTick.lower(ports.get(i)) + "], " + values[i]);
        }
        return n == 3;
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
