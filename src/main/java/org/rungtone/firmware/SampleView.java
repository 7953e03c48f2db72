package org.rungtone.firmware;

import java.util.ArrayList;
import java.util.List;

/**
 * Template values of the stored samples (every engine but the sweep).
 *
 * @param packed true for the bit-packed layout
 * @param count how many samples
 * @param bytes flash bytes of the sample array
 * @param data the C array body, written straight to the file
 * @param ranges which samples each sound uses, in words (clip and loop engines; else empty)
 * @param secondByte true when a packed sample can reach into a second byte
 * @param thirdByte true when a packed sample can reach into a third byte
 * @param wordType the C type that holds the bytes one packed sample touches
 * @param stepwise true when every code is whole table elements (unpacked, or packed 8 or 16 bits), so the
 *     player steps a pointer through them
 * @param element the C type of one table element ({@code uint8_t} or {@code uint16_t})
 * @param perCode table elements per code (2 for 16-bit packed codes, else 1)
 * @param placeOf the C expression for the place of code {@code index} in the table
 * @param readAt the C expression for the code at pointer {@code at}
 * @param narrow true for packed codes of fewer than 8 bits
 * @param wide true for packed codes of 9 to 15 bits
 * @param extent the length in the table's declaration ({@code NAME_SAMPLE_COUNT} or {@code NAME_SAMPLE_BYTES}),
 *     or empty when the table is defined in assembler
 * @param assembler true when the table is too big for an avr-gcc array and is defined in assembler
 * @param shiftUp true when the narrow reader finds its leftover bits by shifting its window up by 8 − N
 *     (N of 5 to 7), rather than by shifting its two bytes apart
 * @param width the C name of the bits per stored code: N packed, b for a Tread stream
 * @param mask the C name of the mask of one stored code
 * @param tread the Tread decoder's values, or null for the other stores
 * @param sentinel true for a Tread stream of 2 or 4 bits per code, read a byte at a time with a marker bit
 */
record SampleView(boolean packed, long count, long bytes, Templates.Stream data, List<String> ranges,
        boolean secondByte, boolean thirdByte, String wordType, boolean stepwise, String element, int perCode,
        String placeOf, String readAt, boolean narrow, boolean wide, boolean shiftUp, String extent,
        boolean assembler, String width, String mask, TreadView tread, boolean sentinel) {
    private static final int PER_LINE = 16;

    /** The values of the plan's samples. */
    static SampleView of(EmitPlan p) {
        boolean coded = p.tread != null;
        boolean packed = p.storage == SampleStorage.PACKED || coded;
        // bits per stored code: N packed, b in a Tread stream
        int w = coded ? p.tread.format().codeBits() : p.bits;
        int g = gcd(w, 8);
        boolean second = 8 - g + w > 8;
        boolean third = 8 - g + w > 16;
        List<String> ranges = new ArrayList<>();
        if (p.isClip()) {
            for (int i = 0; i < p.sounds.size(); i++) {
                ranges.add(p.soundSymbols.get(i) + " is samples " + p.soundStarts[i] + " .. "
                        + (p.soundStarts[i] + p.sounds.get(i).codes().length() - 1));
            }
        }
        // Streamed to the file: a long sound's array is never one string.
        Templates.Stream data = Templates.stream(out -> {
            if (p.samplesInAssembler) {
                AssemblerTable.write(p.symbol + "_samples", coded ? p.tread.streamBytes()
                        : AssemblerTable.bytes(p.samples, p.bits, packed), out);
            } else if (coded) {
                CLiterals.writeArrayBody(p.tread.streamBytes(), PER_LINE, "    ", out);
            } else if (packed) {
                CLiterals.writeArrayBody(SamplePacking.pack(p.samples, p.bits), PER_LINE, "    ", out);
            } else {
                CLiterals.writeArrayBody(p.samples, CLiterals.hexDigits(p.bits), PER_LINE, "    ", out);
            }
        });
        boolean stepwise = !packed || w % 8 == 0;
        boolean pairs = packed && w == 16;
        String element = packed || p.bits <= 8 ? "uint8_t" : "uint16_t";
        String table = p.symbol + "_samples";
        String readAt = pairs ? "(" + p.macro + "_READ_U8(at) | (" + p.macro + "_READ_U8(at + 1) << 8))"
                : p.macro + (packed ? "_READ_U8(at)" : "_READ_SAMPLE(at)");
        return new SampleView(packed, p.samples.length, p.sampleBytes, data, List.copyOf(ranges), second, third,
                third ? "uint32_t" : "uint16_t", stepwise, element, pairs ? 2 : 1,
                "&" + table + "[" + (pairs ? "index * 2u" : "index") + "]", readAt, packed && w < 8,
                packed && w > 8 && w < 16, packed && w >= 5 && w < 8,
                p.samplesInAssembler ? "" : p.macro + (packed ? "_SAMPLE_BYTES" : "_SAMPLE_COUNT"),
                p.samplesInAssembler, p.macro + (coded ? "_CODE_BITS" : "_BITS"),
                p.macro + (coded ? "_CODE_MASK" : "_MAX_CODE"), coded ? TreadView.of(p.tread, p.bits) : null,
                coded && 8 % w == 0);
    }

    private static int gcd(int a, int b) {
        return b == 0 ? a : gcd(b, a % b);
    }
}
