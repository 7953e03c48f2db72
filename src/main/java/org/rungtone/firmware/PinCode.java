package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * The C statement that computes one port's levels from a code, for each {@link PinStrategy}: one
 * mask-and-shift term per group of equally displaced bits (SHIFT has one per port, SCATTER several), or a
 * table read. The statement declares {@code const SYMBOL_port_t v_port}.
 */
final class PinCode {
    private PinCode() {
    }

    /** Variable-name part for a port: {@code B} gives {@code b}, {@code 1} gives {@code 1}. */
    static String lower(String port) {
        return port.toLowerCase(Locale.ROOT);
    }

    /** The statement for {@code port}, indented by four spaces, possibly several lines. */
    static String compute(PinMap map, PinStrategy strategy, String port, String symbol, String macro) {
        String type = symbol + "_port_t";
        String head = "    const " + type + " v_" + lower(port) + " = (" + type + ")";
        if (strategy == PinStrategy.TABLE) {
            return head + macro + "_READ_PORT(&" + symbol + "_pins_" + port + "[code]);";
        }
        String operand = map.portWidth() > 16 ? "(uint32_t)code" : "code";
        List<String> terms = new ArrayList<>();
        for (Map.Entry<Integer, Long> g : map.shiftGroups(port).entrySet()) {
            int delta = g.getKey();
            String masked = "(" + operand + " & " + CLiterals.hex(g.getValue(), 4) + "u)";
            if (delta > 0) {
                terms.add("(" + masked + " << " + delta + ")");
            } else if (delta < 0) {
                terms.add("(" + masked + " >> " + -delta + ")");
            } else {
                terms.add(masked);
            }
        }
        if (terms.size() == 1) {
            return head + terms.get(0) + ";";
        }
        if (terms.size() == 2) {
            return head + "(" + terms.get(0) + " | " + terms.get(1) + ");";
        }
        StringBuilder b = new StringBuilder(head).append("(\n        ").append(terms.get(0));
        for (int i = 1; i < terms.size(); i++) {
            b.append("\n        | ").append(terms.get(i));
        }
        return b.append(");").toString();
    }

    /**
     * The statement for {@code port} of an 8-bit port for a core with 8-bit registers: like {@link #compute},
     * but each shift group is split by the code byte its bits come from, and the terms work on those bytes
     * held in {@code uint8_t} locals ({@code d_lo}, {@code d_hi}), which avr-gcc shifts one register at a time
     * instead of as 16-bit values.
     */
    static String computeBytewise(PinMap map, PinStrategy strategy, String port, String symbol, String macro) {
        if (strategy == PinStrategy.TABLE) {
            return compute(map, strategy, port, symbol, macro);
        }
        String lower = lower(port);
        String[] names = {lower + "_lo", lower + "_hi"};
        boolean[] used = new boolean[2];
        List<String> terms = new ArrayList<>();
        for (Map.Entry<Integer, Long> g : map.shiftGroups(port).entrySet()) {
            for (int b = 0; b < 2; b++) {
                long m = g.getValue() >> (8 * b) & 0xFF;
                if (m == 0) {
                    continue;
                }
                used[b] = true;
                int delta = g.getKey() + 8 * b;
                String masked = "(" + names[b] + " & " + CLiterals.hex(m, 2) + "u)";
                terms.add(delta > 0 ? "(uint8_t)(" + masked + " << " + delta + ")"
                        : delta < 0 ? "(uint8_t)(" + masked + " >> " + -delta + ")" : masked);
            }
        }
        StringBuilder b = new StringBuilder();
        if (used[0]) {
            b.append("    const uint8_t ").append(names[0]).append(" = (uint8_t)code;\n");
        }
        if (used[1]) {
            b.append("    const uint8_t ").append(names[1]).append(" = (uint8_t)(code >> 8);\n");
        }
        String type = symbol + "_port_t";
        b.append("    const ").append(type).append(" v_").append(lower).append(" = (").append(type).append(")");
        if (terms.size() == 1) {
            return b.append(terms.get(0)).append(";").toString();
        }
        b.append("(").append(terms.get(0));
        for (int i = 1; i < terms.size(); i++) {
            b.append(i % 2 == 0 ? "\n        | " : " | ").append(terms.get(i));
        }
        return b.append(");").toString();
    }

    /** Number of mask-and-shift terms over all ports (the instruction cost of SHIFT and SCATTER). */
    static int termCount(PinMap map) {
        int n = 0;
        for (String port : map.ports()) {
            n += map.shiftGroups(port).size();
        }
        return n;
    }

    /** The lookup table of {@code port}: its levels for every code 0 .. 2^N − 1. */
    static int[] table(PinMap map, String port) {
        int bits = map.bits();
        int[] pinOfBit = new int[bits];
        for (int bit = 0; bit < bits; bit++) {
            Pin p = map.pin(bit);
            pinOfBit[bit] = p.port().equals(port) ? p.pin() : -1;
        }
        int[] t = new int[1 << bits];
        for (int code = 0; code < t.length; code++) {
            int v = 0;
            for (int bit = 0; bit < bits; bit++) {
                if (pinOfBit[bit] >= 0 && (code >> bit & 1) != 0) {
                    v |= 1 << pinOfBit[bit];
                }
            }
            t[code] = v;
        }
        return t;
    }
}
