/**
 * Compiles checked script trees into trees of block evaluators (512 samples at a time, no boxing and no look-ups
 * while rendering) and runs them: oscillators that integrate their frequency, envelopes, seeded noise, timing
 * of parts and notes, and the search for the origin of a NaN or infinity. Not API: use
 * {@code org.rungtone.script.RungScript}.
 */
package org.rungtone.script.eval;
