package org.rungtone.firmware;

import java.util.Locale;

/**
 * The stream readers of {@link AvrTreadTick}, the C tick's: for 2- and 4-bit codes the codes of one byte under
 * a marker bit; for 3-bit codes the bits left and their weight 2^count, where a code that needs the next byte
 * (count 0, 1 or 2) takes a way of its own with fixed shifts instead of a multiply. They use Z and one upper
 * register {@code t} besides, and leave the code in {@code t} (2 and 4 bits) or in r30 (3 bits), its bits
 * above the code's own not cleared.
 */
final class AvrTreadReader {
    private AvrTreadReader() {
    }

    /** True for the stores read a byte at a time under a marker bit (2 and 4 bits per code). */
    static boolean byteCodes(EmitPlan p) {
        return 8 % p.tread.format().codeBits() == 0;
    }

    /**
     * The reading instructions.
     *
     * @param notReadInline for 2 and 4 bits: true to put the way without a new byte in line (the way with one
     *     then costs a cycle more); false to leave label 3 to {@link #notRead}, which the caller places within
     *     a branch's reach
     * @return the register holding the code
     */
    static String read(AvrFastTick.Asm a, EmitPlan p, String t, boolean notReadInline) {
        if (!byteCodes(p)) {
            threeBitCode(a, t);
            return "r30";
        }
        int b = p.tread.format().codeBits();
        a.op("lds " + t + ", %[reader]+2").op("cpi " + t + ", 2");
        if (notReadInline) {
            a.op("brlo 3f").op("mov r30, " + t);
            shiftCodes(a, b);
            a.op("rjmp 4f");
            a.label("3");
        } else {
            a.op("brsh 3f");
        }
        a.comment("only the marker is left: the next byte's first code, its others under a new marker");
        a.op("lds r30, %[reader]").op("lds r31, %[reader]+1").op("lpm " + t + ", Z+").op("sts %[reader]+1, r31")
                .op("sts %[reader], r30").op("mov r30, " + t);
        shiftCodes(a, b);
        a.op("ori r30, " + hex(1 << (8 - b)));
        a.label("4");
        a.op("sts %[reader]+2, r30");
        return t;
    }

    /** Label 3 of a 2- or 4-bit reader without the way in line: the next code of the byte, back to 4. */
    static void notRead(AvrFastTick.Asm a, EmitPlan p, String t) {
        a.label("3");
        a.comment("codes left in the byte: the next one down");
        a.op("mov r30, " + t);
        shiftCodes(a, p.tread.format().codeBits());
        a.op("rjmp 4b");
    }

    /** r30 moved down by one code of {@code b} bits (a swap and a mask for four). */
    private static void shiftCodes(AvrFastTick.Asm a, int b) {
        if (b == 4) {
            a.op("swap r30").op("andi r30, 0x0f");
        } else {
            for (int i = 0; i < b; i++) {
                a.op("lsr r30");
            }
        }
    }

    /**
     * 3-bit codes; the bits left and their weight stored. A code that needs the next byte B has count bits
     * left (weight 2^count, count 0..2): it is those bits below B &lt;&lt; count, and B &gt;&gt; (3 − count)
     * is left, count + 5 bits.
     */
    private static void threeBitCode(AvrFastTick.Asm a, String t) {
        a.op("lds " + t + ", %[reader]+3").op("cpi " + t + ", 8").op("brsh 3f");
        a.op("lds r30, %[reader]").op("lds r31, %[reader]+1").op("sbrc " + t + ", 1").op("rjmp 1f")
                .op("sbrc " + t + ", 2").op("rjmp 2f");
        a.comment("no bits left: the code is the byte's low three");
        takeByte(a, t);
        a.op("mov r30, " + t).op("lsr " + t).op("lsr " + t).op("lsr " + t).op("ldi r31, 32").op("rjmp 4f");
        a.label("3");
        a.comment("bits left for a whole code: it is the low three; the bits and the weight move down by 3");
        a.op("lds r30, %[reader]+2").op("mov r31, " + t).op("lsr r31").op("lsr r31").op("lsr r31")
                .op("mov " + t + ", r30").op("lsr " + t).op("lsr " + t).op("lsr " + t).op("rjmp 4f");
        a.label("1");
        a.comment("one bit left, below the byte's low two");
        takeByte(a, t);
        a.op("lds r31, %[reader]+2").op("mov r30, " + t).op("lsl r30").op("or r30, r31").op("lsr " + t)
                .op("lsr " + t).op("ldi r31, 64").op("rjmp 4f");
        a.label("2");
        a.comment("two bits left, below the byte's low one");
        takeByte(a, t);
        a.op("lds r31, %[reader]+2").op("mov r30, " + t).op("lsl r30").op("lsl r30").op("or r30, r31")
                .op("lsr " + t).op("ldi r31, 128");
        a.label("4");
        a.op("sts %[reader]+2, " + t).op("sts %[reader]+3, r31");
    }

    /** The byte at the reader's address into {@code t}; the address moves on. */
    private static void takeByte(AvrFastTick.Asm a, String t) {
        a.op("lpm " + t + ", Z+").op("sts %[reader]+1, r31").op("sts %[reader], r30");
    }

    static String hex(int value) {
        return String.format(Locale.ROOT, "0x%02x", value);
    }
}
