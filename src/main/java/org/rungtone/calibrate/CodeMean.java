package org.rungtone.calibrate;

/**
 * All readings of one code reduced to their mean and spread.
 *
 * @param code the DAC code
 * @param meanVolts the mean of its readings
 * @param count how many readings
 * @param stdVolts the sample standard deviation of the readings (0 for one reading)
 * @param rangeVolts highest minus lowest reading
 * @param firstLine the file line of its first reading, or 0
 */
public record CodeMean(int code, double meanVolts, int count, double stdVolts, double rangeVolts, int firstLine) {
}
