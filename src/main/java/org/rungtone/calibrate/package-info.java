/**
 * Per-board calibration: which codes to measure on a built ladder ({@link org.rungtone.calibrate.MeasurementPlan},
 * with meter advice), reading the filled-in measurements ({@link org.rungtone.calibrate.MeasurementCsv}),
 * fitting them by least squares to a superposition model or a switched-load model with outlier screening
 * ({@link org.rungtone.calibrate.BoardFit}), and the unit profile that carries one board's full level table
 * into {@code build}, {@code survey} and {@code ladder} ({@link org.rungtone.calibrate.UnitProfile}). A
 * simulated board ({@link org.rungtone.calibrate.SimulatedBoard}) stands in for the bench in demos and tests,
 * and {@link org.rungtone.calibrate.OutputSpan} chooses the span that compensated quantization maps onto.
 * A meter of known count gets check codes chosen for its ranges ({@link org.rungtone.calibrate.MeterRanges}),
 * and each reading weighs by its own digits. A sound card's recording of the recording sweep
 * ({@link org.rungtone.calibrate.RecordingSweep}: two patterns around the codes, with returns to code 0
 * among them) is fitted step by step ({@link org.rungtone.calibrate.RecordingFit}) into levels that enter the
 * same board fit. {@link org.rungtone.calibrate.UnitFit},
 * {@link org.rungtone.calibrate.RecordingCalibration} and {@link org.rungtone.calibrate.BoardSimulation} are the
 * work of {@code calibrate fit}, {@code calibrate listen} and {@code calibrate simulate}. Nothing here writes
 * files: texts and results are returned for the report to write.
 */
package org.rungtone.calibrate;
