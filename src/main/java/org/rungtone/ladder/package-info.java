/**
 * The resistor ladder: its description ({@link org.rungtone.ladder.LadderSpec}, read from a {@code [ladder]}
 * TOML table by {@link org.rungtone.ladder.LadderFile}), the exact solution of every code's output level
 * into a {@link org.rungtone.ladder.LevelTable} (Millman's theorem for summing networks, elimination from the
 * LSB end for R-2R, full nodal analysis as reference), IEEE 1658 linearity
 * ({@link org.rungtone.ladder.Linearity}), Monte Carlo tolerance analysis
 * ({@link org.rungtone.ladder.MonteCarlo}), IEC 60063 preferred-value series and resistor proposals
 * ({@link org.rungtone.ladder.LadderDesigner}), and the study that gathers them for the ladder report
 * ({@link org.rungtone.ladder.LadderStudy}).
 */
package org.rungtone.ladder;
