package org.rungtone.firmware;

import java.math.BigInteger;
import org.rungtone.internal.Checks;

/**
 * Reference model of the emitted direct digital synthesis (DDS) oscillator: an n-bit phase accumulator
 * advanced by a tuning word M at every tick of the sample clock f_s, whose top k bits index a wavetable of
 * 2^k codes.
 *
 * <p>Per Analog Devices tutorial MT-085 ("Fundamentals of Direct Digital Synthesis"): the output frequency
 * is f_out = M · f_s / 2^n, so the tuning word for a wanted f is M = round(f · 2^n / f_s), and the frequency
 * resolution is f_s / 2^n. Each tick first outputs {@code table[phase >> (n − k)]} and then sets
 * {@code phase = (phase + M) mod 2^n}, as the C tick function does.
 *
 * <p>Immutable; {@link #run} starts from phase 0 each time.
 */
public final class Dds {
    private final int phaseBits;
    private final int tableBits;
    private final int[] table;

    /**
     * A model with an n-bit accumulator over a table of 2^k codes.
     *
     * @throws IllegalArgumentException when the table length is not a power of two, or n is not in k..32
     */
    public Dds(int phaseBits, int[] table) {
        Checks.checkArgument(table.length >= 2 && Integer.bitCount(table.length) == 1,
                "the wavetable length must be a power of two >= 2: %d", table.length);
        this.tableBits = Integer.numberOfTrailingZeros(table.length);
        Checks.checkArgument(phaseBits >= tableBits && phaseBits <= 32,
                "phase bits must be %d..32 for a %d-entry table: %d", tableBits, table.length, phaseBits);
        this.phaseBits = phaseBits;
        this.table = table.clone();
    }

    /** Accumulator width n. */
    public int phaseBits() {
        return phaseBits;
    }

    /** Table index width k. */
    public int tableBits() {
        return tableBits;
    }

    /**
     * The tuning word M = round(f · 2^n / f_s) (MT-085).
     *
     * @throws IllegalArgumentException when f is negative or not below f_s, or the rate is not positive
     */
    public static long tuningWord(double frequencyHz, double sampleRateHz, int phaseBits) {
        Checks.checkArgument(sampleRateHz > 0, "sample rate must be positive: %s", sampleRateHz);
        Checks.checkArgument(frequencyHz >= 0 && frequencyHz < sampleRateHz,
                "frequency must be in 0 .. sample rate: %s", frequencyHz);
        Checks.checkArgument(phaseBits >= 1 && phaseBits <= 32, "phase bits must be 1..32: %d", phaseBits);
        return Math.round(frequencyHz * Math.pow(2, phaseBits) / sampleRateHz) & ((1L << phaseBits) - 1);
    }

    /**
     * The tuning word M = round(f · 2^n / f_s) mod 2^n (MT-085) in exact integers, for f in millihertz and a
     * tick rate of exactly {@code rateNumerator / rateDenominator} hertz; a tie rounds up. The emitted
     * {@code NAME_set_frequency_millihz()} computes the same word, and so does the build for the initial
     * one: M = floor((2 · f · den · 2^n + 1000 · num) / (2 · 1000 · num)) mod 2^n.
     *
     * @throws IllegalArgumentException when f is negative, the rate is not positive, or n is not 1..32
     */
    public static long tuningWord(long milliHz, long rateNumerator, long rateDenominator, int phaseBits) {
        Checks.checkArgument(milliHz >= 0, "frequency must not be negative: %d mHz", milliHz);
        Checks.checkArgument(rateNumerator > 0 && rateDenominator > 0, "rate must be positive: %d / %d",
                rateNumerator, rateDenominator);
        Checks.checkArgument(phaseBits >= 1 && phaseBits <= 32, "phase bits must be 1..32: %d", phaseBits);
        BigInteger divisor = BigInteger.valueOf(rateNumerator).multiply(BigInteger.valueOf(1000));
        BigInteger twice = BigInteger.valueOf(milliHz).multiply(BigInteger.valueOf(rateDenominator))
                .shiftLeft(phaseBits + 1).add(divisor);
        return twice.divide(divisor.shiftLeft(1)).longValue() & ((1L << phaseBits) - 1);
    }

    /** The frequency a tuning word gives: f_out = M · f_s / 2^n (MT-085). */
    public static double actualHz(long tuningWord, double sampleRateHz, int phaseBits) {
        return tuningWord * sampleRateHz / Math.pow(2, phaseBits);
    }

    /** The frequency step of one tuning-word unit: f_s / 2^n (MT-085). */
    public static double resolutionHz(double sampleRateHz, int phaseBits) {
        return sampleRateHz / Math.pow(2, phaseBits);
    }

    /** The first {@code count} codes output with tuning word {@code m}, starting from phase 0. */
    public int[] run(long m, int count) {
        long mod = (1L << phaseBits) - 1;
        int shift = phaseBits - tableBits;
        long phase = 0;
        int[] out = new int[count];
        for (int i = 0; i < count; i++) {
            out[i] = table[(int) (phase >>> shift)];
            phase = (phase + m) & mod;
        }
        return out;
    }

    /**
     * One period of a sine as 2^k codes of an ideal N-bit DAC: code = round(c + a · sin(2πi / 2^k)) with
     * centre c = (2^N − 1) / 2 and amplitude a = (2^N − 1) / 2, so the table spans 0 .. 2^N − 1.
     */
    public static int[] sineTable(int tableBits, int bits) {
        Checks.checkArgument(tableBits >= 1 && tableBits <= 16, "table bits must be 1..16: %d", tableBits);
        Checks.checkArgument(bits >= 1 && bits <= 16, "bits must be 1..16: %d", bits);
        int n = 1 << tableBits;
        double half = ((1 << bits) - 1) / 2.0;
        int[] t = new int[n];
        for (int i = 0; i < n; i++) {
            t[i] = (int) Math.round(half + half * Math.sin(2 * Math.PI * i / n));
        }
        return t;
    }
}
