/**
 * Measuring quality: error-based SNR of an output against its reference, single-tone analysis (sine fit,
 * spectra, SINAD, THD, SFDR, ENOB), weighting curves, the analog output model and the bit/rate survey; and
 * finding a seamless loop in a sustained sound (pitch period, loop points, the baked crossfade).
 */
package org.rungtone.analysis;
