package org.rungtone.firmware;

/**
 * Template values of the DAC code: its width and the C type that holds one code.
 *
 * @param bits code width N
 * @param maxCode 2^N − 1 in fixed-width hex, e.g. {@code 0x3F}
 * @param midCode 2^(N−1), the code the pins are parked at
 * @param type {@code uint8_t} up to 8 bits, else {@code uint16_t}
 */
record CodeView(int bits, String maxCode, String midCode, String type) {
    /** The values for {@code bits}-bit codes. */
    static CodeView of(int bits) {
        int digits = CLiterals.hexDigits(bits);
        return new CodeView(bits, CLiterals.hex((1L << bits) - 1, digits), CLiterals.hex(1L << (bits - 1), digits),
                bits <= 8 ? "uint8_t" : "uint16_t");
    }
}
