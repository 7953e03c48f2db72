package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * The timer interrupt of the AVR clip and loop players written in assembler, for the common case of whole-byte
 * codes (N &lt;= 8, unpacked) put out by shift or table. The compiled C interrupt of avr-gcc 5.4 always saves
 * r0, r1 and SREG and the registers its body uses; this one saves SREG through a register it needs anyway and
 * uses only Z, r24, r25 and one register per further port, which takes 9 to 11 cycles off every tick. It does
 * exactly what the C tick does (same reads and writes, same order, the pins written at the same cycle after
 * the interrupt in every tick), and the simulator test checks it code by code.
 *
 * <p>Register use: Z (r31:r30) the sample pointer, r24 the code and then the last port's value, r25 a
 * scratch register (and 0 as the high byte of a table index), r18.. the values of the other ports. State and
 * tables are reached through asm operands, so link-time optimisation may rename the variables.
 */
final class AvrFastTick {
    static final String[] VALUE_REGISTERS = {"r18", "r19", "r20", "r21", "r22", "r23"};
    /** Ports of a pointer-walking player whose end-of-sound branch still reaches its target (BREQ: 63 words). */
    private static final int MAX_BRANCHED_PORTS = 3;

    private AvrFastTick() {
    }

    /** True when the plan's interrupt is written in assembler (see the class comment for the cases). */
    static boolean applies(EmitPlan p) {
        return p.family == TargetFamily.AVR && p.isClip() && p.timer.isPresent()
                && (p.strategy == PinStrategy.SHIFT || p.strategy == PinStrategy.TABLE)
                && (wholeBytes(p) && p.pins.ports().size() <= MAX_BRANCHED_PORTS
                        || packed(p) && p.pins.ports().size() <= VALUE_REGISTERS.length);
    }

    /** Codes of one byte each (unpacked, or packed 8-bit codes, the same bytes): the player walks a pointer. */
    private static boolean wholeBytes(EmitPlan p) {
        return p.bits <= 8 && p.storage == SampleStorage.UNPACKED || p.bits == 8 && p.storage == SampleStorage.PACKED;
    }

    /** Packed codes of 1..7 bits and 16-bit indices: the player reads a bit stream (see fetch.c). */
    static boolean packed(EmitPlan p) {
        return p.bits < 8 && p.storage == SampleStorage.PACKED && !p.wideIndex;
    }

    /** The whole interrupt: {@code ISR(vector, ISR_NAKED) { __asm__ ... }}, or empty when it does not apply. */
    static Optional<String> isr(EmitPlan p) {
        if (!applies(p)) {
            return Optional.empty();
        }
        if (packed(p)) {
            return Optional.of(render(p, AvrPackedTick.body(p), p.engine == PlaybackEngine.LOOP));
        }
        List<String> ports = p.pins.ports();
        List<String> saved = new ArrayList<>(List.of("r25", "r30", "r31"));
        for (int i = 0; i < ports.size() - 1; i++) {
            saved.add(VALUE_REGISTERS[i]);
        }
        Asm a = new Asm();
        a.op("push r24").op("in r24, __SREG__").op("push r24");
        for (String r : saved) {
            a.op("push " + r);
        }
        a.op("lds r30, %[at]").op("lds r31, %[at]+1");
        boolean loop = p.engine == PlaybackEngine.LOOP;
        a.op("lds r25, %[stop]").op("cp r30, r25").op("lds r25, %[stop]+1").op("cpc r31, r25")
                .op("breq 9f");
        a.op("lpm r24, Z+");
        if (loop) {
            wrap(a);
        }
        a.op("sts %[at]+1, r31").op("sts %[at], r30");
        output(a, p, 0);
        a.label("8");
        for (int i = saved.size() - 1; i >= 0; i--) {
            a.op("pop " + saved.get(i));
        }
        a.op("pop r24").op("out __SREG__, r24").op("pop r24").op("reti");
        a.label("9");
        a.comment("the sound has ended: the compare-match interrupt goes off until the next play");
        a.op("lds r25, %[timsk]").op("andi r25, lo8(~(1 << %[ocie]))").op("sts %[timsk], r25").op("rjmp 8b");
        if (loop) {
            wrapTail(a);
        }
        return Optional.of(render(p, a, loop));
    }

    /**
     * Past the loop end, back to the loop start. Both paths take 5 cycles (the other one jumps to a nop out of
     * line and back), so the pins still change at the same cycle after the interrupt in every tick.
     */
    private static void wrap(Asm a) {
        a.op("lds r25, %[wrap_at]").op("cp r30, r25").op("lds r25, %[wrap_at]+1").op("cpc r31, r25")
                .op("brne 1f");
        a.op("lds r30, %[wrap_to]").op("lds r31, %[wrap_to]+1");
        a.label("2");
    }

    /** The out-of-line half of {@link #wrap}: no wrap, the same 5 cycles. */
    private static void wrapTail(Asm a) {
        a.label("1");
        a.op("nop").op("rjmp 2b");
    }

    /**
     * Every port's value into a register (the code is in r24; the first further port's value goes into
     * {@code VALUE_REGISTERS[first]}), then the writes back to back. Uses r25, and Z for tables.
     */
    static void output(Asm a, EmitPlan p, int first) {
        List<String> ports = p.pins.ports();
        int last = ports.size() - 1;
        if (p.strategy == PinStrategy.TABLE) {
            a.op("ldi r25, 0");
            for (int i = 0; i <= last; i++) {
                String port = ports.get(i);
                a.op("movw r30, r24").op("subi r30, lo8(-(%[pins_" + lower(port) + "]))")
                        .op("sbci r31, hi8(-(%[pins_" + lower(port) + "]))")
                        .op("lpm " + valueRegister(i + first, last + first) + ", Z");
            }
        } else {
            for (int i = 0; i <= last; i++) {
                shift(a, p, ports.get(i), valueRegister(i + first, last + first), i == last);
            }
        }
        for (int i = 0; i <= last; i++) {
            String port = ports.get(i);
            if (p.pins.mask(port) != 0xFF) {
                a.op("in r25, %[port_" + lower(port) + "]")
                        .op("andi r25, " + String.format(Locale.ROOT, "0x%02x", ~p.pins.mask(port) & 0xFF))
                        .op("or " + valueRegister(i + first, last + first) + ", r25");
            }
        }
        for (int i = 0; i <= last; i++) {
            a.op("out %[port_" + lower(ports.get(i)) + "], " + valueRegister(i + first, last + first));
        }
    }

    /** The port's value, {@code (code & m) << d} of its one shift group, into {@code to}. */
    static void shift(Asm a, EmitPlan p, String port, String to, boolean inPlace) {
        Map.Entry<Integer, Long> g = p.pins.shiftGroups(port).entrySet().iterator().next();
        int d = g.getKey();
        long m = g.getValue();
        if (!inPlace) {
            a.op("mov " + to + ", r24");
        }
        boolean swapped = Math.abs(d) >= 4;
        if (swapped) {
            a.op("swap " + to);
        }
        for (int i = swapped ? 4 : 0; i < Math.abs(d); i++) {
            a.op((d > 0 ? "lsl " : "lsr ") + to);
        }
        long codeBits = (1L << p.bits) - 1;
        long kept = (d >= 0 ? codeBits << d : codeBits >> -d) & 0xFF;
        long wanted = (d >= 0 ? m << d : m >> -d) & 0xFF;
        if (swapped || kept != wanted) {
            a.op("andi " + to + ", " + String.format(Locale.ROOT, "0x%02x", wanted));
        }
    }

    /** The register of the i-th port's value: r24 (the code, no longer needed) for the last, else r18.. */
    static String valueRegister(int i, int last) {
        return i == last ? "r24" : VALUE_REGISTERS[i];
    }

    static String lower(String port) {
        return port.toLowerCase(Locale.ROOT);
    }

    /** The C text: a naked interrupt holding the instructions, with the symbols and registers as operands. */
    private static String render(EmitPlan p, Asm a, boolean loop) {
        boolean bitStream = packed(p);
        char n = p.timer.orElseThrow().kind().optionName().charAt(5);
        String vector = "TIMER" + n + "_COMPA_vect";
        List<String> operands = new ArrayList<>();
        if (bitStream) {
            for (String v : List.of("left", "next", "reader")) {
                operands.add("[" + v + "] \"i\" (&" + p.symbol + "_" + v + ")");
            }
            if (loop) {
                for (String v : List.of("looping", "loop_code", "loop_reader", "loop_length", "after_loop")) {
                    operands.add("[" + v + "] \"i\" (&" + p.symbol + "_" + v + ")");
                }
            }
        } else {
            operands.add("[at] \"i\" (&" + p.symbol + "_at)");
            operands.add("[stop] \"i\" (&" + p.symbol + "_stop_at)");
            if (loop) {
                operands.add("[wrap_at] \"i\" (&" + p.symbol + "_wrap_at)");
                operands.add("[wrap_to] \"i\" (&" + p.symbol + "_wrap_to)");
            }
        }
        for (String port : p.pins.ports()) {
            operands.add("[port_" + lower(port) + "] \"I\" (_SFR_IO_ADDR(PORT" + port + "))");
            if (p.strategy == PinStrategy.TABLE) {
                operands.add("[pins_" + lower(port) + "] \"i\" (" + p.symbol + "_pins_" + port + ")");
            }
        }
        operands.add("[timsk] \"n\" (_SFR_MEM_ADDR(TIMSK" + n + "))");
        operands.add("[ocie] \"n\" (OCIE" + n + "A)");
        StringBuilder b = new StringBuilder();
        b.append("/* The tick in assembler (see ").append(p.symbol).append("_tick() for the same steps in C): it saves")
                .append(" only the\n * registers it uses, SREG through r24")
                .append(bitStream ? " (r1:r0 hold the product that places a new byte above the bits left)" : "")
                .append(". Worst case ")
                .append(TickCost.of(p).map(c -> c.worstCycles() + " cycles").orElse("measured in simulation"))
                .append(" including the interrupt response. */\n");
        b.append("ISR(").append(vector).append(", ISR_NAKED)\n{\n    __asm__ __volatile__ (\n");
        b.append(a.text());
        b.append("        :\n        : ").append(String.join(",\n          ", operands)).append(");\n}\n");
        return b.toString();
    }

    /** Instruction lines as C string literals. */
    static final class Asm {
        private final StringBuilder text = new StringBuilder();

        Asm op(String instruction) {
            text.append("        \"").append(instruction).append("\\n\\t\"\n");
            return this;
        }

        void label(String name) {
            text.append("        \"").append(name).append(":\\n\\t\"\n");
        }

        void comment(String words) {
            text.append("        /* ").append(words).append(" */\n");
        }

        String text() {
            return text.toString();
        }
    }
}
