/**
 * Per-board calibration: which codes to measure on a built ladder ({@link org.rungtone.calibrate.MeasurementPlan},
 * with meter advice), reading the filled-in measurements ({@link org.rungtone.calibrate.MeasurementCsv}),
 * fitting them by least squares to a superposition model or a switched-load model with outlier screening
 * ({@link org.rungtone.calibrate.BoardFit}), and the unit profile that carries one board's full level table
 * into {@code build}, {@code survey} and {@code ladder} ({@link org.rungtone.calibrate.UnitProfile}). A
 * simulated board ({@link org.rungtone.calibrate.SimulatedBoard}) stands in for the bench in demos and tests,
 * and {@link org.rungtone.calibrate.OutputSpan} chooses the span that compensated quantization maps onto.
 * {@link org.rungtone.calibrate.UnitFit} and {@link org.rungtone.calibrate.BoardSimulation} are the work of
 * {@code calibrate fit} and {@code calibrate simulate}. Nothing here writes files: texts and results are
 * returned for the report to write.
 */
package org.rungtone.calibrate;
