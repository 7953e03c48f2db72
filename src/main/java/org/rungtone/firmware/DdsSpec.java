package org.rungtone.firmware;

import org.rungtone.internal.Setting;

/**
 * Settings of the DDS engine; the wavetable is the request's one sound, 2^k codes long.
 *
 * @param phaseBits accumulator width n, k..32
 * @param frequencyHz the frequency the oscillator starts at (changeable at run time)
 */
public record DdsSpec(int phaseBits, double frequencyHz) {
    /** Accumulator width used when none is given. */
    public static final int DEFAULT_PHASE_BITS = 32;
    /** Start frequency used when none is given. */
    public static final double DEFAULT_FREQUENCY_HZ = 1000;

    /** Checks the fields. */
    public DdsSpec {
        Setting.DDS_PHASE_BITS.check(phaseBits >= 1 && phaseBits <= 32, "must be 1..32: %d", phaseBits);
        Setting.DDS_FREQUENCY.check(Double.isFinite(frequencyHz) && frequencyHz >= 0,
                "must be zero or positive: %s", frequencyHz);
    }

    /** A 32-bit accumulator starting at {@code frequencyHz}. */
    public static DdsSpec of(double frequencyHz) {
        return new DdsSpec(DEFAULT_PHASE_BITS, frequencyHz);
    }
}
