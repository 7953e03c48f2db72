package org.rungtone.ladder;

import java.util.Locale;
import org.rungtone.internal.Units;

/**
 * One resistor of a ladder: what it does, which bit it belongs to and its value in ohms.
 *
 * @param role leg (pin to node), rung (node to node, R-2R only) or termination (LSB node to ground)
 * @param bit the bit of a leg; the lower node of a rung; 0 for the termination
 * @param ohms the value in ohms
 */
public record Part(Role role, int bit, double ohms) {
    /** What a resistor does in the network. */
    public enum Role {
        /** From the pin of a bit to its node. */
        LEG,
        /** Between node {@code bit} and node {@code bit + 1} of an R-2R ladder. */
        RUNG,
        /** From the LSB node of an R-2R ladder to ground. */
        TERMINATION
    }

    /** A short label: "leg b3", "rung b3-b4", "termination". */
    public String label() {
        switch (role) {
            case LEG:
                return "leg b" + bit;
            case RUNG:
                return String.format(Locale.ROOT, "rung b%d-b%d", bit, bit + 1);
            default:
                return "termination";
        }
    }

    /** The same part with another value. */
    public Part withOhms(double newOhms) {
        return new Part(role, bit, newOhms);
    }

    @Override
    public String toString() {
        return label() + " " + Units.format(ohms, "");
    }
}
