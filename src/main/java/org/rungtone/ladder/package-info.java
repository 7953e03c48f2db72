/**
 * The resistor ladder: network topologies, the exact nodal solution of every code's output level
 * ({@link org.rungtone.ladder.LevelTable}), linearity figures, preferred-value series and Monte Carlo yield.
 */
package org.rungtone.ladder;
