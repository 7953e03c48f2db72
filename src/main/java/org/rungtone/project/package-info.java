/**
 * The build as a whole: the validated, immutable {@link org.rungtone.project.BuildPlan} made from a project
 * file and command-line overrides, and {@link org.rungtone.project.Build}, which runs the stages in order and
 * hands their results to the report and firmware writers. {@link org.rungtone.project.CalibrationPlan} joins
 * the stages of a calibration plan: the codes to measure and meter advice, then the sweep program.
 */
package org.rungtone.project;
