package org.rungtone.ladder;

import java.util.Locale;
import org.rungtone.internal.InputError;

/** The shape of the resistor network between the GPIO pins and the buffer input. */
public enum Topology {
    /**
     * Binary-weighted summing network: pin i drives resistor R_i into one common node; R_i halves from the
     * LSB to the MSB. The common node feeds the buffer.
     */
    WEIGHTED("weighted"),
    /**
     * R-2R voltage-mode ladder: pin i drives a 2R leg into node i; nodes are joined by R rungs; the LSB node
     * is terminated by 2R to ground and the MSB node feeds the buffer.
     */
    R2R("r2r"),
    /** A summing network like {@link #WEIGHTED} whose per-bit resistors are all given by the user. */
    CUSTOM("custom");

    private final String key;

    Topology(String key) {
        this.key = key;
    }

    /** The name used in ladder files and on the command line. */
    public String key() {
        return key;
    }

    /** True for the single-node summing networks (weighted and custom). */
    public boolean isSumming() {
        return this != R2R;
    }

    /**
     * Parses a topology name, case-insensitively.
     *
     * @throws InputError naming the known topologies when the name is unknown
     */
    public static Topology parse(String name) {
        String n = name == null ? "" : name.trim().toLowerCase(Locale.ROOT);
        for (Topology t : values()) {
            if (t.key.equals(n) || (t == R2R && n.equals("r-2r"))) {
                return t;
            }
        }
        throw new InputError("unknown topology '" + name + "'; use weighted, r2r or custom");
    }
}
