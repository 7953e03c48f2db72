package org.rungtone.calibrate;

/**
 * One meter reading of one code.
 *
 * @param code the DAC code that was on the pins
 * @param volts the reading in volts
 * @param stepVolts the resolution the reading was written with (its last digit: "2.613" is 1 mV), or 0
 *     when unknown (a computed value)
 * @param line the line of the measurements file it came from, or 0
 */
public record Reading(int code, double volts, double stepVolts, int line) {
}
