package org.rungtone.ladder;

/**
 * The worst-case current of one GPIO pin over all codes: the most it sources while high and the most it
 * sinks while low. These are model figures for the DC state of each code; GPIO limits per pin and per port
 * differ between parts, and the microcontroller's datasheet is the authority.
 *
 * @param bit the bit the pin drives
 * @param sourceAmps largest current out of the pin while high, amperes (0 if it never sources)
 * @param sourceCode the code at which it occurs
 * @param sinkAmps largest current into the pin while low, amperes (0 if it never sinks)
 * @param sinkCode the code at which it occurs
 */
public record PinCurrent(int bit, double sourceAmps, int sourceCode, double sinkAmps, int sinkCode) {
    /** The larger of the source and sink currents, amperes. */
    public double worstAmps() {
        return Math.max(sourceAmps, sinkAmps);
    }
}
