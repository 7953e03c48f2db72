package org.rungtone.firmware;

import org.rungtone.codec.TreadFormat;

/**
 * The read-ahead half of {@link AvrTreadTick} for codes of up to 8 bits: the next stored code from the stream
 * ({@link AvrTreadReader}) and its ladder code from the byte table (docs/tread.md, "In the player"), stored
 * for the next tick; each way through ends with its own return.
 *
 * <p>The decoder keeps its state as the C tick does: the code before the last one and the table row of the
 * step index. The prediction 2·y1 − y2 and both clamps use the carry and the borrow of 8-bit arithmetic; below
 * 8-bit codes 2·y1 fits a byte, so only an 8-bit ladder needs the doubling's carry.
 */
final class AvrTreadDecode {
    private AvrTreadDecode() {
    }

    /**
     * The instructions after the port writes; r24 holds the code put out unless {@code reload} (then the
     * variable {@code next} still does).
     */
    static void next(AvrFastTick.Asm a, EmitPlan p, boolean reload) {
        TreadFormat f = p.tread.format();
        String code = AvrTreadReader.read(a, p, "r25", false);
        a.comment("the sign into T; Z to the table entry of the row and the magnitude");
        a.op("bst " + code + ", " + (f.codeBits() - 1));
        if (!"r30".equals(code)) {
            a.op("mov r30, " + code);
        }
        int entries = (f.maxIndex(p.bits) + 1) * f.magnitudes();
        a.op("andi r30, " + AvrTreadReader.hex(f.magnitudes() - 1)).op("lds r31, %[decoder]+1").op("add r30, r31")
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
        Runnable notRead = AvrTreadReader.byteCodes(p) ? () -> AvrTreadReader.notRead(a, p, "r25") : () -> { };
        if (p.bits == 8) {
            predictEightBits(a, p, notRead);
        } else {
            predict(a, p, notRead);
        }
    }

    /**
     * Codes below 8 bits: q = 2·y1 − y2 (r30, y2 in r31) kept on the ladder, then y = q ± d (d in r25). Below
     * zero q is 0, so y is d or 0 at once.
     */
    private static void predict(AvrFastTick.Asm a, EmitPlan p, Runnable afterFirstReturn) {
        int bits = p.bits;
        String top = Integer.toString(1 << bits);
        String max = Integer.toString((1 << bits) - 1);
        a.op("sub r30, r31").op("brcs 2f").op("cpi r30, " + top).op("brlo 5f").op("ldi r30, " + max);
        a.label("5");
        a.op("brts 6f").op("add r30, r25").op("cpi r30, " + top).op("brlo 7f").op("ldi r30, " + max);
        store(a, p, "r30");
        afterFirstReturn.run();
        a.label("6");
        a.op("sub r30, r25").op("brcc 7f").op("ldi r30, 0");
        store(a, p, "r30");
        belowLadder(a, p);
    }

    /** 8-bit codes: the same, with the doubling's carry (2·y1 ≥ 256) and the addition's carry as the top. */
    private static void predictEightBits(AvrFastTick.Asm a, EmitPlan p, Runnable afterFirstReturn) {
        a.op("brcs 1f").op("sub r30, r31").op("brcs 2f");
        a.label("5");
        a.op("brts 6f").op("add r30, r25").op("brcc 7f").op("ldi r30, 255");
        store(a, p, "r30");
        afterFirstReturn.run();
        a.label("6");
        a.op("sub r30, r25").op("brcc 7f").op("ldi r30, 0");
        store(a, p, "r30");
        a.label("1");
        a.comment("2·y1 is 256 or more: q is on the ladder when y2 borrows, else above it");
        a.op("sub r30, r31").op("brcs 5b").op("ldi r30, 255").op("rjmp 5b");
        belowLadder(a, p);
    }

    /** Label 2: the prediction is below the ladder, so the code is the difference (or 0 when it borrows). */
    private static void belowLadder(AvrFastTick.Asm a, EmitPlan p) {
        a.label("2");
        a.comment("the prediction is below the ladder: y is the difference, or 0");
        a.op("brts 6f");
        a.op("sts %[next], r25");
        AvrTreadTick.exit(a, p);
        a.label("6");
        a.op("ldi r30, 0").op("sts %[next], r30");
        AvrTreadTick.exit(a, p);
    }

    /** Label 7 and the decoded code from {@code register} into {@code next}, then the return. */
    private static void store(AvrFastTick.Asm a, EmitPlan p, String register) {
        a.label("7");
        a.op("sts %[next], " + register);
        AvrTreadTick.exit(a, p);
    }
}
