/**
 * Conditioning a source for its target: mix-down, DC removal, gain and normalization, silence trimming,
 * fades and resampling to the target rate with an anti-alias filter.
 */
package org.rungtone.condition;
