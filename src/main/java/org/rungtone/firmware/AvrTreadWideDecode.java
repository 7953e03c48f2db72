package org.rungtone.firmware;

import org.rungtone.codec.TreadFormat;

/**
 * The read-ahead half of {@link AvrTreadTick} for codes of 9 to 12 bits, with the C tick's state and tables
 * (docs/tread.md): the previous code in 16 bits, the step index k, STEP[0 .. kmax] in 16 bits and ADAPT[m].
 * The difference (STEP[k]·(2m + 1)) &gt;&gt; 4 is taken as the high bytes of STEP[k]·16(2m + 1), two 8 × 8-bit
 * products, so no shift follows; the clamps compare the high byte only, as 2^N has a zero low byte.
 *
 * <p>Registers: r25:r24 the code put out (y1), r18 and r19 scratch, Z, and r1:r0 the products and then the
 * difference. Each way through ends with its own return.
 */
final class AvrTreadWideDecode {
    private AvrTreadWideDecode() {
    }

    /** The instructions after the port writes. */
    static void next(AvrFastTick.Asm a, EmitPlan p) {
        TreadFormat f = p.tread.format();
        int kmax = f.maxIndex(p.bits);
        String code = AvrTreadReader.read(a, p, "r18", true);
        a.comment("the sign into T, the magnitude m into r19, k into r18; ADAPT[m] into r0");
        a.op("bst " + code + ", " + (f.codeBits() - 1)).op("mov r19, " + code)
                .op("andi r19, " + AvrTreadReader.hex(f.magnitudes() - 1)).op("lds r18, %[decoder]+2")
                .op("mov r30, r19").op("ldi r31, 0").op("subi r30, lo8(-(%[adapt]))")
                .op("sbci r31, hi8(-(%[adapt]))").op("lpm r0, Z");
        a.comment("Z to STEP[k]; the next k, kept within 0 .. kmax, stored");
        a.op("mov r30, r18").op("ldi r31, 0").op("lsl r30").op("subi r30, lo8(-(%[steps]))")
                .op("sbci r31, hi8(-(%[steps]))").op("add r18, r0").op("brpl 1f").op("ldi r18, 0");
        a.label("1");
        a.op("cpi r18, " + (kmax + 1)).op("brlo 2f").op("ldi r18, " + kmax);
        a.label("2");
        a.op("sts %[decoder]+2, r18");
        a.comment("STEP[k] into r31:r30, 16(2m + 1) into r19; the difference, their product over 256, into r1:r0");
        a.op("lpm r0, Z+").op("lpm r31, Z").op("mov r30, r0").op("swap r19").op("lsl r19").op("ori r19, 0x10")
                .op("mul r30, r19").op("mov r18, r1").op("mul r31, r19").op("add r0, r18").op("brcc 3f")
                .op("inc r1");
        a.label("3");
        a.comment("q = 2·y1 − y2 in Z (at most 13 bits and a sign); y1 stored as the code before the next");
        a.op("movw r30, r24").op("lsl r30").op("rol r31").op("lds r18, %[decoder]").op("sub r30, r18")
                .op("lds r18, %[decoder]+1").op("sbc r31, r18").op("sts %[decoder], r24")
                .op("sts %[decoder]+1, r25").op("brmi 4f");
        String top = Integer.toString(1 << (p.bits - 8));
        String maxHigh = Integer.toString((1 << (p.bits - 8)) - 1);
        a.op("cpi r31, " + top).op("brlo 5f").op("ldi r30, 0xff").op("ldi r31, " + maxHigh);
        a.label("5");
        a.op("brts 6f").op("add r30, r0").op("adc r31, r1").op("cpi r31, " + top).op("brlo 7f")
                .op("ldi r30, 0xff").op("ldi r31, " + maxHigh);
        store(a, p);
        a.label("6");
        a.op("sub r30, r0").op("sbc r31, r1").op("brcc 7f").op("ldi r30, 0").op("ldi r31, 0");
        store(a, p);
        a.label("4");
        a.comment("the prediction is below the ladder: y is the difference, or 0");
        a.op("brts 6f").op("sts %[next], r0").op("sts %[next]+1, r1");
        AvrTreadTick.exit(a, p);
        a.label("6");
        a.op("ldi r30, 0").op("sts %[next], r30").op("sts %[next]+1, r30");
        AvrTreadTick.exit(a, p);
    }

    /** Label 7 and the decoded code from Z into {@code next}, then the return. */
    private static void store(AvrFastTick.Asm a, EmitPlan p) {
        a.label("7");
        a.op("sts %[next], r30").op("sts %[next]+1, r31");
        AvrTreadTick.exit(a, p);
    }
}
