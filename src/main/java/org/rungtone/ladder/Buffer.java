package org.rungtone.ladder;

import org.rungtone.internal.Checks;

/**
 * The op-amp stage after the ladder: a non-inverting gain and the output swing it can reach. A ladder voltage
 * v comes out as {@code min(max(gain · v, outMinVolts), outMaxVolts)}; codes beyond the swing clip.
 *
 * @param gain voltage gain, positive (1 for a follower)
 * @param outMinVolts lowest output the amplifier reaches (its headroom to the negative rail)
 * @param outMaxVolts highest output the amplifier reaches
 */
public record Buffer(double gain, double outMinVolts, double outMaxVolts) {
    /** Checks that the gain is positive and the swing not empty. */
    public Buffer {
        Checks.checkArgument(Double.isFinite(gain) && gain > 0, "buffer gain must be positive: %s", gain);
        Checks.checkArgument(outMaxVolts > outMinVolts, "buffer swing must have max > min: %s .. %s",
                outMinVolts, outMaxVolts);
    }

    /** The output for a ladder voltage, clipped to the swing. */
    public double apply(double ladderVolts) {
        double v = gain * ladderVolts;
        return v < outMinVolts ? outMinVolts : (v > outMaxVolts ? outMaxVolts : v);
    }
}
