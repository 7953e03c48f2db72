package org.rungtone.calibrate;

/**
 * One code of a measurement plan: the code, why it is measured, and the level the ladder model expects.
 *
 * @param code the DAC code, 0 .. 2^N − 1
 * @param role why this code is on the list
 * @param expectedVolts the modelled output level of the code
 */
public record PlannedCode(int code, Role role, double expectedVolts) {
    /** Why a code is measured. */
    public enum Role {
        /** All bits low: the offset. */
        ZERO("all bits low"),
        /** All bits high: the top of the span. */
        FULL("all bits high"),
        /** One bit high: that bit's weight. */
        BIT("one bit"),
        /** A further code that checks the fit (and feeds the switched-load model). */
        VERIFY("check"),
        /** Any other code of a plan that measures every code. */
        EVERY("");

        private final String label;

        Role(String label) {
            this.label = label;
        }

        /** A short label for the checklist. */
        public String label() {
            return label;
        }
    }

    /** The label of this code's role; single-bit codes name their bit ("bit 3"). */
    public String describe() {
        if (role == Role.BIT) {
            return "bit " + Integer.numberOfTrailingZeros(code) + " alone";
        }
        return role.label();
    }
}
