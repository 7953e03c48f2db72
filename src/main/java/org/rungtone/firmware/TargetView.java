package org.rungtone.firmware;

/**
 * Template values that only one target family's templates use; the other family's view is null.
 *
 * @param tableNote where the tables live, when the family says so ({@code PROGMEM} on avr), or null
 * @param avr the AVR registers, or null
 * @param cortexm the Cortex-M registers, or null
 */
record TargetView(String tableNote, AvrView avr, CortexmView cortexm) {
    /** The values of the plan's family. */
    static TargetView of(EmitPlan p) {
        switch (p.family) {
            case AVR:
                return new TargetView("PROGMEM", AvrView.of(p), null);
            case CORTEXM:
                return new TargetView(null, null, CortexmView.of(p));
            default:
                return new TargetView(null, null, null);
        }
    }
}
