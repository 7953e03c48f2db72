package org.rungtone.calibrate;

import org.rungtone.ladder.ESeries;

/**
 * A resistive divider that brings the board's swing down to a sound card's line input: the upper resistor
 * picked so the full swing arrives near {@value #TARGET_VOLTS} V. A line input clips at about 1 to 2 V peak
 * (common practice, no source) and its coupling capacitor lets a full jump swing the input by the full swing
 * either way, so half a volt leaves room. The ratio need not be exact: the fit finds the gain. The divider
 * loads the ladder like any load, which scales every level alike and leaves the relative levels as they are.
 *
 * @param topOhms from the board's output to the input's tip (E12), 0 when no divider is needed
 * @param bottomOhms from the tip to ground
 * @param swingVolts the board's full swing
 * @param inputVolts what the full swing becomes at the input
 */
public record LineInputDivider(double topOhms, double bottomOhms, double swingVolts, double inputVolts) {
    /** Where the full swing should arrive, volts. */
    public static final double TARGET_VOLTS = 0.5;
    /** The divider's lower resistor, ohms: low against a line input's 10 kΩ or more. */
    public static final double BOTTOM_OHMS = 4700;

    /** The divider for a board that swings {@code swingVolts}. */
    public static LineInputDivider forSwing(double swingVolts) {
        if (swingVolts <= 1.5 * TARGET_VOLTS) {
            return new LineInputDivider(0, BOTTOM_OHMS, swingVolts, swingVolts);
        }
        double wanted = BOTTOM_OHMS * (swingVolts / TARGET_VOLTS - 1);
        double top = ESeries.E12.nearest(wanted);
        if (top < wanted) {
            top = ESeries.E12.nearest(wanted * 1.2);
        }
        return new LineInputDivider(top, BOTTOM_OHMS, swingVolts, swingVolts * BOTTOM_OHMS / (top + BOTTOM_OHMS));
    }

    /** True when the swing is small enough for the input without a divider. */
    public boolean direct() {
        return topOhms == 0;
    }
}
