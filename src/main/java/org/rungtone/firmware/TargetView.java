package org.rungtone.firmware;

/**
 * Template values that only one target family's templates use; the other families' views are null.
 *
 * @param tableNote where the tables live, when the family says so ({@code PROGMEM} on avr), or null
 * @param avr the AVR registers, or null
 * @param cortexm the Cortex-M registers, or null
 * @param rp2040 the RP2040's alarm tick, or null
 */
record TargetView(String tableNote, AvrView avr, CortexmView cortexm, Rp2040View rp2040) {
    /** The values of the plan's family. */
    static TargetView of(EmitPlan p) {
        switch (p.family) {
            case AVR:
                return new TargetView("PROGMEM", AvrView.of(p), null, null);
            case CORTEXM:
                return new TargetView(null, null, CortexmView.of(p), null);
            case RP2040:
                return new TargetView(null, null, null, Rp2040View.of(p));
            default:
                return new TargetView(null, null, null, null);
        }
    }
}
