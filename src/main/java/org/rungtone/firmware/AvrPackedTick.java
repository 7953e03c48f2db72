package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * The assembler interrupt of the AVR clip and loop players of packed codes of 1..7 bits ({@link AvrFastTick}):
 * the same steps as the C tick over fetch.c's bit reader. The reader holds the next byte's address, the bits
 * taken but not used yet (least significant first) and their weight 2^count; a code needs a new byte when
 * fewer than N bits are left, and the byte goes above them with one MUL by the weight.
 *
 * <p>Registers: Z the count of codes left (then the reader's address), r24 the code and the last port's value,
 * r25 scratch and the window's high byte, r18 "codes remain" and then the weight, r1:r0 the product and the
 * bits left, r19.. the values of further ports.
 */
final class AvrPackedTick {
    private AvrPackedTick() {
    }

    /** The instructions, from the first push to the last jump. */
    static AvrFastTick.Asm body(EmitPlan p) {
        boolean loop = p.engine == PlaybackEngine.LOOP;
        List<String> saved = new ArrayList<>(List.of("r25", "r30", "r31", "r18", "r0", "r1"));
        for (int i = 0; i < p.pins.ports().size() - 1; i++) {
            saved.add(AvrFastTick.VALUE_REGISTERS[i + 1]);
        }
        AvrFastTick.Asm a = new AvrFastTick.Asm();
        a.op("push r24").op("in r24, __SREG__").op("push r24");
        for (String r : saved) {
            a.op("push " + r);
        }
        a.comment("nothing left to play: carry set by the decrement (9 may be out of a branch's reach)");
        a.op("lds r30, %[left]").op("lds r31, %[left]+1").op("sbiw r30, 1").op("brcc 7f").op("rjmp 9f");
        a.label("7");
        a.op("sts %[left]+1, r31").op("sts %[left], r30").op("mov r18, r30").op("or r18, r31");
        a.comment("the code read ahead goes out first, at the same cycle in every tick");
        a.op("lds r24, %[next]");
        AvrFastTick.output(a, p, 1);
        a.op("tst r18");
        if (loop) {
            a.op("brne 5f");
            loopEnd(a);
        } else {
            a.op("breq 8f");
        }
        a.label("5");
        read(a, p.bits);
        a.label("8");
        for (int i = saved.size() - 1; i >= 0; i--) {
            a.op("pop " + saved.get(i));
        }
        a.op("pop r24").op("out __SREG__, r24").op("pop r24").op("reti");
        a.label("9");
        a.comment("the sound has ended: the compare-match interrupt goes off until the next play");
        a.op("lds r25, %[timsk]").op("andi r25, lo8(~(1 << %[ocie]))").op("sts %[timsk], r25").op("rjmp 8b");
        return a;
    }

    /**
     * The last code of a stretch went out: while looping, back to the loop start (its code and reader were set
     * up at play); else on to the part after the loop, if any.
     */
    private static void loopEnd(AvrFastTick.Asm a) {
        a.op("lds r25, %[looping]").op("tst r25").op("breq 6f");
        a.op("lds r24, %[loop_code]").op("sts %[next], r24");
        for (int i = 0; i < 4; i++) {
            String off = i == 0 ? "" : "+" + i;
            a.op("lds r24, %[loop_reader]" + off).op("sts %[reader]" + off + ", r24");
        }
        a.op("lds r24, %[loop_length]").op("sts %[left], r24").op("lds r24, %[loop_length]+1")
                .op("sts %[left]+1, r24").op("rjmp 8f");
        a.label("6");
        a.op("lds r30, %[after_loop]").op("lds r31, %[after_loop]+1").op("clr r25").op("sts %[after_loop], r25")
                .op("sts %[after_loop]+1, r25").op("sts %[left]+1, r31").op("sts %[left], r30").op("mov r18, r30")
                .op("or r18, r31").op("breq 8f");
    }

    /** The next code of the stream into the read-ahead code; the reader moves on. */
    private static void read(AvrFastTick.Asm a, int bits) {
        a.op("lds r18, %[reader]+3").op("lds r24, %[reader]+2").op("cpi r18, " + (1 << bits)).op("brsh 3f");
        a.comment("fewer than N bits left: the next byte goes above them");
        a.op("lds r30, %[reader]").op("lds r31, %[reader]+1").op("lpm r25, Z+").op("sts %[reader]+1, r31")
                .op("sts %[reader], r30").op("mul r25, r18").op("or r24, r0").op("mov r25, r1");
        shiftWeight(a, 8 - bits, "lsl");
        a.op("rjmp 4f");
        a.label("3");
        a.op("clr r25");
        shiftWeight(a, bits, "lsr");
        a.label("4");
        a.comment("the bits left: the window shifted down by N, one byte");
        a.op("movw r0, r24");
        if (bits <= 8 - bits) {
            for (int i = 0; i < bits; i++) {
                a.op("lsr r1").op("ror r0");
            }
            a.op("sts %[reader]+2, r0");
        } else {
            for (int i = 0; i < 8 - bits; i++) {
                a.op("lsl r0").op("rol r1");
            }
            a.op("sts %[reader]+2, r1");
        }
        a.op("sts %[reader]+3, r18").op("andi r24, " + String.format(Locale.ROOT, "0x%02x", (1 << bits) - 1))
                .op("sts %[next], r24");
    }

    /**
     * The one-hot weight in r18 moved by {@code n} bits; a swap moves four at once (the weight's set bit is in
     * the nibble the swap moves the right way: below 16 before a left move of 4 or more, at 16 or above before
     * a right one).
     */
    private static void shiftWeight(AvrFastTick.Asm a, int n, String op) {
        int left = n;
        if (n >= 4) {
            a.op("swap r18");
            left -= 4;
        }
        for (int i = 0; i < left; i++) {
            a.op(op + " r18");
        }
    }
}
