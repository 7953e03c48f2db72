package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;

/** Packed samples read back exactly, for every code width 1..16, sequentially and by random access. */
class SamplePackingPropertiesTest {
    /** Codes of one width 1..16, from empty to a few hundred samples (odd counts leave partial bytes). */
    record Case(int bits, int[] codes) {
    }

    @Provide
    Arbitrary<Case> cases() {
        return Arbitraries.integers().between(1, 16).flatMap(bits -> Arbitraries.integers()
                .between(0, (1 << bits) - 1).array(int[].class).ofMaxSize(300).map(c -> new Case(bits, c)));
    }

    @Property(tries = 400)
    void unpackInvertsPack(@ForAll("cases") Case c) {
        byte[] packed = SamplePacking.pack(c.codes(), c.bits());
        // ceil(samples * N / 8) bytes: the stream has no padding between samples
        assertEquals((c.codes().length * (long) c.bits() + 7) / 8, packed.length);
        assertArrayEquals(c.codes(), SamplePacking.unpack(packed, c.bits(), c.codes().length));
    }

    @Property(tries = 400)
    void randomAccessReadsEverySample(@ForAll("cases") Case c) {
        byte[] packed = SamplePacking.pack(c.codes(), c.bits());
        for (int i = 0; i < c.codes().length; i++) {
            assertEquals(c.codes()[i], SamplePacking.read(packed, c.bits(), i), "sample " + i);
        }
    }

    /** Every width on its own, with all-ones codes, so each N from 1 to 16 is certainly exercised. */
    @Property(tries = 16, generation = net.jqwik.api.GenerationMode.EXHAUSTIVE)
    void everyWidthRoundTripsItsLargestCode(@ForAll @IntRange(min = 1, max = 16) int bits) {
        int[] codes = new int[17];
        for (int i = 0; i < codes.length; i++) {
            codes[i] = i % 2 == 0 ? (1 << bits) - 1 : i % (1 << bits);
        }
        byte[] packed = SamplePacking.pack(codes, bits);
        assertArrayEquals(codes, SamplePacking.unpack(packed, bits, codes.length));
        for (int i = 0; i < codes.length; i++) {
            assertEquals(codes[i], SamplePacking.read(packed, bits, i));
        }
    }
}
