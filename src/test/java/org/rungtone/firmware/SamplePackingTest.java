package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class SamplePackingTest {
    @Test
    void fourBitCodesGoTwoPerByteLowNibbleFirst() {
        assertArrayEquals(new byte[] {0x21, 0x43, 0x05}, SamplePacking.pack(new int[] {1, 2, 3, 4, 5}, 4));
    }

    @Test
    void sixBitCodesGoFourPerThreeBytes() {
        // a = 0x3F in bits 0-5, b = 0x00 in 6-11, c = 0x15 in 12-17, d = 0x2A in 18-23:
        // byte 0 = a | b << 6 = 0x3F; byte 1 = b >> 2 | (c & 0xF) << 4 = 0x50; byte 2 = c >> 4 | d << 2 = 0xA9
        assertArrayEquals(new byte[] {0x3F, 0x50, (byte) 0xA9},
                SamplePacking.pack(new int[] {0x3F, 0x00, 0x15, 0x2A}, 6));
    }

    @Test
    void sizeIsCeilingOfBitsOverEight() {
        assertEquals(9188, SamplePacking.packedBytes(12250, 6));
        assertEquals(13, SamplePacking.packedBytes(10, 10));
        assertEquals(2, SamplePacking.packedBytes(1, 16));
        assertEquals(9188, SampleStorage.PACKED.bytes(12250, 6));
        assertEquals(12250, SampleStorage.UNPACKED.bytes(12250, 6));
        assertEquals(24500, SampleStorage.UNPACKED.bytes(12250, 9));
    }

    @Test
    void everyBitDepthRoundTrips() {
        SplittableRandom r = new SplittableRandom(7);
        for (int bits = 1; bits <= 16; bits++) {
            for (int n : new int[] {0, 1, 7, 8, 9, 1001}) {
                int[] codes = new int[n];
                for (int i = 0; i < n; i++) {
                    codes[i] = r.nextInt(1 << bits);
                }
                byte[] packed = SamplePacking.pack(codes, bits);
                assertEquals(SamplePacking.packedBytes(n, bits), packed.length);
                assertArrayEquals(codes, SamplePacking.unpack(packed, bits, n), bits + " bits, " + n);
                for (int i = 0; i < n; i++) {
                    assertEquals(codes[i], SamplePacking.read(packed, bits, i), bits + " bits, sample " + i);
                }
            }
        }
    }
}
