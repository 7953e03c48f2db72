package org.rungtone.quantize;

import java.util.Arrays;
import org.rungtone.internal.Checks;

/**
 * N-bit DAC codes at a sample rate: offset binary, every code in [0, 2^N − 1]. The code array is copied in
 * and out; {@link #unsafeCodes()} hands it over without copying for read-only inner loops.
 */
public final class Codes {
    private final int bits;
    private final double sampleRateHz;
    private final int[] codes;

    private Codes(int bits, double sampleRateHz, int[] codes) {
        this.bits = bits;
        this.sampleRateHz = sampleRateHz;
        this.codes = codes;
    }

    /**
     * Creates codes from a copy of {@code codes}.
     *
     * @throws IllegalArgumentException when a code is out of range
     */
    public static Codes of(int bits, double sampleRateHz, int[] codes) {
        return wrap(bits, sampleRateHz, codes.clone());
    }

    static Codes wrap(int bits, double sampleRateHz, int[] codes) {
        Checks.checkBits(bits);
        Checks.checkArgument(sampleRateHz > 0, "sample rate must be positive: %s", sampleRateHz);
        int max = (1 << bits) - 1;
        for (int i = 0; i < codes.length; i++) {
            if (codes[i] < 0 || codes[i] > max) {
                // checked first: formatting arguments would box three values for every sample
                throw new IllegalArgumentException("code " + codes[i] + " at " + i + " is outside 0.." + max);
            }
        }
        return new Codes(bits, sampleRateHz, codes);
    }

    /** Bit depth N. */
    public int bits() {
        return bits;
    }

    /** Sample rate in hertz. */
    public double sampleRateHz() {
        return sampleRateHz;
    }

    /** Number of codes. */
    public int length() {
        return codes.length;
    }

    /** Code {@code i}. */
    public int code(int i) {
        return codes[i];
    }

    /** A copy of the codes. */
    public int[] codes() {
        return codes.clone();
    }

    /** The internal array, not copied: read-only by contract. */
    public int[] unsafeCodes() {
        return codes;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Codes c && c.bits == bits && c.sampleRateHz == sampleRateHz
                && Arrays.equals(c.codes, codes);
    }

    @Override
    public int hashCode() {
        return Arrays.hashCode(codes) * 31 + bits;
    }

    @Override
    public String toString() {
        return "Codes[" + codes.length + " x " + bits + " bits @ " + sampleRateHz + " Hz]";
    }
}
