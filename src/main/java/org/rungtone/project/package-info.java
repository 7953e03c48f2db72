/**
 * The build as a whole: the validated, immutable {@link org.rungtone.project.BuildPlan} made from a project
 * file and command-line overrides, and {@link org.rungtone.project.Build}, which runs the stages in order and
 * hands their results to the report and firmware writers.
 */
package org.rungtone.project;
