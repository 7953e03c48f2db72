package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * The timer interrupt of the AVR clip and loop players of a Tread store (docs/tread.md) written in assembler,
 * for ladder codes put out by shift or table on up to three ports. It keeps the C tick's state and steps
 * ({@code NAME_tick()}): write the code decoded at the previous tick, count it, then read ({@link
 * AvrTreadReader}) and decode the next one, from the byte table up to 8 bits ({@link AvrTreadDecode}) or from
 * STEP and ADAPT past them ({@link AvrTreadWideDecode}); at the loop end of a looping sound it loads the loop
 * start's code, reader and decoder instead. Two things differ, both out of sight: the sign of the stored code
 * waits in the T flag, and the clip engine decodes one code past a sound's end, which is never put out (the
 * reads stay in flash), rather than spend a branch on every tick.
 *
 * <p>Registers: up to 8 bits r24 the code put out (the last code y1), r25 and Z everything else, so that the
 * interrupt saves four registers (SREG through r24); past 8 bits r25:r24 the code, and r18, r19 and r1:r0 as
 * well. Every path reaches the port writes after the same number of cycles. The count of codes left is 16
 * bits, or 24 of the C type's 32 with wide indices: a stream the reader's 16-bit pointer reaches holds fewer
 * than 2^24 codes.
 */
final class AvrTreadTick {
    /** Ports whose values the free registers hold. */
    static final int MAX_PORTS = 3;

    private AvrTreadTick() {
    }

    /** True when the plan's interrupt is this one (see the class comment for the cases). */
    static boolean applies(EmitPlan p) {
        return p.family == TargetFamily.AVR && p.isClip() && p.timer.isPresent() && p.tread != null
                && (p.strategy == PinStrategy.SHIFT || p.strategy == PinStrategy.TABLE)
                && p.pins.ports().size() <= MAX_PORTS;
    }

    /** The whole interrupt: {@code ISR(vector, ISR_NAKED) { __asm__ ... }}, or empty when it does not apply. */
    static Optional<String> isr(EmitPlan p) {
        if (!applies(p)) {
            return Optional.empty();
        }
        boolean loop = p.engine == PlaybackEngine.LOOP;
        AvrFastTick.Asm a = new AvrFastTick.Asm();
        a.op("push r24").op("in r24, __SREG__").op("push r24");
        for (String r : saved(p)) {
            a.op("push " + r);
        }
        countDown(a, p.wideIndex);
        if (loop) {
            a.comment("the loop end (zero flag): 3 cycles to the store either way, so the pins change at one cycle");
            a.op("breq 6f");
        }
        a.comment("none left: 9 may be out of a branch's reach");
        a.op("brcc 7f").op("rjmp 9f");
        if (loop) {
            a.label("6");
            a.op("nop");
            storeLeft(a, p.wideIndex);
            AvrTreadOutput.write(a, p);
            a.op("rjmp 8f");
        }
        a.label("7");
        storeLeft(a, p.wideIndex);
        boolean reload = AvrTreadOutput.write(a, p);
        if (p.tread.compact()) {
            AvrTreadDecode.next(a, p, reload);
        } else {
            AvrTreadWideDecode.next(a, p);
        }
        if (loop) {
            a.label("8");
            loopEnd(a, p);
        }
        a.label("9");
        a.comment("the sound has ended: the compare-match interrupt goes off until the next play");
        a.op("lds r25, %[timsk]").op("andi r25, lo8(~(1 << %[ocie]))").op("sts %[timsk], r25");
        exit(a, p);
        return Optional.of(render(p, a, loop));
    }

    /**
     * One code fewer left, in Z (and r25 with wide indices): the carry set when none was left, the zero flag
     * when this tick's code is the last before the next event.
     */
    private static void countDown(AvrFastTick.Asm a, boolean wide) {
        a.op("lds r30, %[left]").op("lds r31, %[left]+1");
        if (wide) {
            a.op("lds r25, %[left]+2").op("subi r30, 1").op("sbci r31, 0").op("sbci r25, 0");
        } else {
            a.op("sbiw r30, 1");
        }
    }

    private static void storeLeft(AvrFastTick.Asm a, boolean wide) {
        if (wide) {
            a.op("sts %[left]+2, r25");
        }
        a.op("sts %[left]+1, r31").op("sts %[left], r30");
    }

    /**
     * The last code of a stretch went out: while looping, back to the loop start, whose code, reader and
     * decoder the play call set up; otherwise the sound has ended (a release added the part after the loop to
     * the count, so this is the sound's end).
     */
    private static void loopEnd(AvrFastTick.Asm a, EmitPlan p) {
        a.op("lds r25, %[looping]").op("tst r25").op("brne 5f");
        exit(a, p);
        a.label("5");
        List<String> copies = new ArrayList<>(List.of("next:loop_code"));
        if (!p.tread.compact()) {
            copies.add("next+1:loop_code+1");
        }
        int readerBytes = AvrTreadReader.byteCodes(p) ? 3 : 4;
        for (int i = 0; i < readerBytes; i++) {
            copies.add("reader" + offset(i) + ":loop_reader" + offset(i));
        }
        for (int i = 0; i < (p.tread.compact() ? 2 : 3); i++) {
            copies.add("decoder" + offset(i) + ":loop_decoder" + offset(i));
        }
        for (int i = 0; i < (p.wideIndex ? 3 : 2); i++) {
            copies.add("left" + offset(i) + ":loop_length" + offset(i));
        }
        for (String c : copies) {
            String[] toFrom = c.split(":");
            a.op("lds r25, %[" + bracket(toFrom[1])).op("sts %[" + bracket(toFrom[0]) + ", r25");
        }
        exit(a, p);
    }

    /** {@code name+1} as the operand {@code name]+1}. */
    private static String bracket(String at) {
        int plus = at.indexOf('+');
        return plus < 0 ? at + "]" : at.substring(0, plus) + "]" + at.substring(plus);
    }

    private static String offset(int i) {
        return i == 0 ? "" : "+" + i;
    }

    /** The registers saved besides r24 (which holds SREG): those of the wide decoder too past 8 bits. */
    private static List<String> saved(EmitPlan p) {
        return p.tread.compact() ? List.of("r25", "r30", "r31")
                : List.of("r25", "r30", "r31", "r18", "r19", "r0", "r1");
    }

    /** The registers back and the return: every path has its own copy, which saves a jump. */
    static void exit(AvrFastTick.Asm a, EmitPlan p) {
        List<String> saved = saved(p);
        for (int i = saved.size() - 1; i >= 0; i--) {
            a.op("pop " + saved.get(i));
        }
        a.op("pop r24").op("out __SREG__, r24").op("pop r24").op("reti");
    }

    /** The C text: a naked interrupt holding the instructions, with the symbols and registers as operands. */
    private static String render(EmitPlan p, AvrFastTick.Asm a, boolean loop) {
        char n = p.timer.orElseThrow().kind().optionName().charAt(5);
        List<String> operands = new ArrayList<>();
        List<String> variables = new ArrayList<>(List.of("left", "next", "reader", "decoder"));
        if (loop) {
            variables.addAll(List.of("looping", "loop_code", "loop_reader", "loop_decoder", "loop_length"));
        }
        for (String v : variables) {
            operands.add("[" + v + "] \"i\" (&" + p.symbol + "_" + v + ")");
        }
        for (String table : p.tread.compact() ? List.of("table:decode_table") : List.of("steps:steps", "adapt:adapt")) {
            String[] nameSymbol = table.split(":");
            operands.add("[" + nameSymbol[0] + "] \"i\" (" + p.symbol + "_" + nameSymbol[1] + ")");
        }
        for (String port : p.pins.ports()) {
            String lower = port.toLowerCase(Locale.ROOT);
            operands.add("[port_" + lower + "] \"I\" (_SFR_IO_ADDR(PORT" + port + "))");
            if (p.strategy == PinStrategy.TABLE) {
                operands.add("[pins_" + lower + "] \"i\" (" + p.symbol + "_pins_" + port + ")");
            }
        }
        operands.add("[timsk] \"n\" (_SFR_MEM_ADDR(TIMSK" + n + "))");
        operands.add("[ocie] \"n\" (OCIE" + n + "A)");
        StringBuilder b = new StringBuilder();
        b.append("/* The tick in assembler (see ").append(p.symbol).append("_tick() for the same steps in C): it saves")
                .append(" only the\n * registers it uses, SREG through r24, and keeps the sign of the stored code in")
                .append(" the T flag. Worst case ")
                .append(TickCost.of(p).map(c -> c.worstCycles() + " cycles").orElse("measured in simulation"))
                .append(" including the interrupt response. */\n");
        b.append("ISR(TIMER").append(n).append("_COMPA_vect, ISR_NAKED)\n{\n    __asm__ __volatile__ (\n");
        b.append(a.text());
        b.append("        :\n        : ").append(String.join(",\n          ", operands)).append(");\n}\n");
        return b.toString();
    }
}
