package org.rungtone.firmware;

import java.util.Locale;
import org.rungtone.codec.TreadFormat;

/**
 * The read-ahead half of {@link AvrTreadTick}: the next stored code from the stream and its ladder code from
 * the byte table (docs/tread.md, "In the player"), stored for the next tick; each way through ends with its
 * own return. The reader is the C tick's: for 2- and 4-bit codes the codes of one byte under a marker bit,
 * for 3-bit codes the bits left and their weight 2^count, where a code that needs the next byte (count 0, 1
 * or 2) takes a way of its own with fixed shifts instead of a multiply, which would need r1:r0 as well.
 *
 * <p>The decoder keeps its state as the C tick does: the code before the last one and the table row of the
 * step index. The prediction 2·y1 − y2 and both clamps use the carry and the borrow of 8-bit arithmetic; below
 * 8-bit codes 2·y1 fits a byte, so only an 8-bit ladder needs the doubling's carry.
 */
final class AvrTreadDecode {
    private AvrTreadDecode() {
    }

    /** True for the stores read a byte at a time under a marker bit (2 and 4 bits per code). */
    static boolean sentinel(EmitPlan p) {
        return 8 % p.tread.format().codeBits() == 0;
    }

    /**
     * The instructions after the port writes; r24 holds the code put out unless {@code reload} (then the
     * variable {@code next} still does).
     */
    static void next(AvrFastTick.Asm a, EmitPlan p, boolean reload) {
        TreadFormat f = p.tread.format();
        int b = f.codeBits();
        if (sentinel(p)) {
            readByteCodes(a, b);
        } else {
            readThreeBitCode(a);
        }
        a.comment("the sign into T; Z to the table entry of the row and the magnitude");
        if (sentinel(p)) {
            a.op("bst r25, " + (b - 1)).op("mov r30, r25");
        } else {
            a.op("bst r30, " + (b - 1));
        }
        int entries = (f.maxIndex(p.bits) + 1) * f.magnitudes();
        a.op("andi r30, " + hex(f.magnitudes() - 1)).op("lds r31, %[decoder]+1").op("add r30, r31")
                .op("ldi r31, 0").op("lsl r30");
        if (2 * entries - 2 > 0xFF) {
            a.op("rol r31");
        }
        a.op("subi r30, lo8(-(%[table]))").op("sbci r31, hi8(-(%[table]))");
        a.comment("the difference into r25, the next row stored; y2 into r31, y1 stored in its place");
        a.op("lpm r25, Z+").op("lpm r30, Z").op("sts %[decoder]+1, r30").op("lds r31, %[decoder]");
        if (reload) {
            a.op("lds r24, %[next]");
        }
        a.op("sts %[decoder], r24").op("mov r30, r24").op("lsl r30");
        Runnable notRead = sentinel(p) ? () -> {
            a.label("3");
            a.comment("codes left in the byte: the next one down");
            a.op("mov r30, r25");
            shiftCodes(a, b);
            a.op("rjmp 4b");
        } : () -> { };
        if (p.bits == 8) {
            predictEightBits(a, notRead);
        } else {
            predict(a, p.bits, notRead);
        }
    }

    /** 2- and 4-bit codes: the code into r25 (with the codes above it), the byte's rest stored. */
    private static void readByteCodes(AvrFastTick.Asm a, int b) {
        a.op("lds r25, %[reader]+2").op("cpi r25, 2").op("brsh 3f");
        a.comment("only the marker is left: the next byte's first code, its others under a new marker");
        a.op("lds r30, %[reader]").op("lds r31, %[reader]+1").op("lpm r25, Z+").op("sts %[reader]+1, r31")
                .op("sts %[reader], r30").op("mov r30, r25");
        shiftCodes(a, b);
        a.op("ori r30, " + hex(1 << (8 - b)));
        a.label("4");
        a.op("sts %[reader]+2, r30");
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
     * 3-bit codes: the code into r30 (bits above the third are not cleared); the bits left and their weight
     * stored. A code that needs the next byte B has count bits left (weight 2^count, count 0..2): it is
     * those bits below B &lt;&lt; count, and B &gt;&gt; (3 − count) is left, count + 5 bits.
     */
    private static void readThreeBitCode(AvrFastTick.Asm a) {
        a.op("lds r25, %[reader]+3").op("cpi r25, 8").op("brsh 3f");
        a.op("lds r30, %[reader]").op("lds r31, %[reader]+1").op("sbrc r25, 1").op("rjmp 1f").op("sbrc r25, 2")
                .op("rjmp 2f");
        a.comment("no bits left: the code is the byte's low three");
        takeByte(a);
        a.op("mov r30, r25").op("lsr r25").op("lsr r25").op("lsr r25").op("ldi r31, 32").op("rjmp 4f");
        a.label("3");
        a.comment("bits left for a whole code: it is the low three; the bits and the weight move down by 3");
        a.op("lds r30, %[reader]+2").op("mov r31, r25").op("lsr r31").op("lsr r31").op("lsr r31")
                .op("mov r25, r30").op("lsr r25").op("lsr r25").op("lsr r25").op("rjmp 4f");
        a.label("1");
        a.comment("one bit left, below the byte's low two");
        takeByte(a);
        a.op("lds r31, %[reader]+2").op("mov r30, r25").op("lsl r30").op("or r30, r31").op("lsr r25")
                .op("lsr r25").op("ldi r31, 64").op("rjmp 4f");
        a.label("2");
        a.comment("two bits left, below the byte's low one");
        takeByte(a);
        a.op("lds r31, %[reader]+2").op("mov r30, r25").op("lsl r30").op("lsl r30").op("or r30, r31")
                .op("lsr r25").op("ldi r31, 128");
        a.label("4");
        a.op("sts %[reader]+2, r25").op("sts %[reader]+3, r31");
    }

    /** The byte at the reader's address into r25; the address moves on. */
    private static void takeByte(AvrFastTick.Asm a) {
        a.op("lpm r25, Z+").op("sts %[reader]+1, r31").op("sts %[reader], r30");
    }

    /**
     * Codes below 8 bits: q = 2·y1 − y2 (r30, y2 in r31) kept on the ladder, then y = q ± d (d in r25). Below
     * zero q is 0, so y is d or 0 at once.
     */
    private static void predict(AvrFastTick.Asm a, int bits, Runnable afterFirstReturn) {
        String top = Integer.toString(1 << bits);
        String max = Integer.toString((1 << bits) - 1);
        a.op("sub r30, r31").op("brcs 2f").op("cpi r30, " + top).op("brlo 5f").op("ldi r30, " + max);
        a.label("5");
        a.op("brts 6f").op("add r30, r25").op("cpi r30, " + top).op("brlo 7f").op("ldi r30, " + max);
        store(a, "r30");
        afterFirstReturn.run();
        a.label("6");
        a.op("sub r30, r25").op("brcc 7f").op("ldi r30, 0");
        store(a, "r30");
        a.label("2");
        a.comment("the prediction is below the ladder: y is the difference, or 0");
        a.op("brts 6f");
        a.op("sts %[next], r25");
        AvrTreadTick.exit(a);
        a.label("6");
        a.op("ldi r30, 0").op("sts %[next], r30");
        AvrTreadTick.exit(a);
    }

    /** 8-bit codes: the same, with the doubling's carry (2·y1 ≥ 256) and the addition's carry as the top. */
    private static void predictEightBits(AvrFastTick.Asm a, Runnable afterFirstReturn) {
        a.op("brcs 1f").op("sub r30, r31").op("brcs 2f");
        a.label("5");
        a.op("brts 6f").op("add r30, r25").op("brcc 7f").op("ldi r30, 255");
        store(a, "r30");
        afterFirstReturn.run();
        a.label("6");
        a.op("sub r30, r25").op("brcc 7f").op("ldi r30, 0");
        store(a, "r30");
        a.label("1");
        a.comment("2·y1 is 256 or more: q is on the ladder when y2 borrows, else above it");
        a.op("sub r30, r31").op("brcs 5b").op("ldi r30, 255").op("rjmp 5b");
        a.label("2");
        a.comment("the prediction is below the ladder: y is the difference, or 0");
        a.op("brts 6f");
        a.op("sts %[next], r25");
        AvrTreadTick.exit(a);
        a.label("6");
        a.op("ldi r30, 0").op("sts %[next], r30");
        AvrTreadTick.exit(a);
    }

    /** Label 7 and the decoded code from {@code register} into {@code next}, then the return. */
    private static void store(AvrFastTick.Asm a, String register) {
        a.label("7");
        a.op("sts %[next], " + register);
        AvrTreadTick.exit(a);
    }

    private static String hex(int value) {
        return String.format(Locale.ROOT, "0x%02x", value);
    }
}
