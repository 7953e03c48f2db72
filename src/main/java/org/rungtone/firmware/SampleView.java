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
 */
record SampleView(boolean packed, long count, long bytes, Templates.Stream data, List<String> ranges,
        boolean secondByte, boolean thirdByte, String wordType) {
    private static final int PER_LINE = 16;

    /** The values of the plan's samples. */
    static SampleView of(EmitPlan p) {
        boolean packed = p.storage == SampleStorage.PACKED;
        int g = gcd(p.bits, 8);
        boolean second = 8 - g + p.bits > 8;
        boolean third = 8 - g + p.bits > 16;
        List<String> ranges = new ArrayList<>();
        if (p.isClip()) {
            for (int i = 0; i < p.sounds.size(); i++) {
                ranges.add(p.soundSymbols.get(i) + " is samples " + p.soundStarts[i] + " .. "
                        + (p.soundStarts[i] + p.sounds.get(i).codes().length() - 1));
            }
        }
        // Streamed to the file: a long sound's array is never one string.
        Templates.Stream data = Templates.stream(out -> {
            if (packed) {
                CLiterals.writeArrayBody(SamplePacking.pack(p.samples, p.bits), PER_LINE, "    ", out);
            } else {
                CLiterals.writeArrayBody(p.samples, CLiterals.hexDigits(p.bits), PER_LINE, "    ", out);
            }
        });
        return new SampleView(packed, p.samples.length, p.sampleBytes, data, List.copyOf(ranges), second, third,
                third ? "uint32_t" : "uint16_t");
    }

    private static int gcd(int a, int b) {
        return b == 0 ? a : gcd(b, a % b);
    }
}
