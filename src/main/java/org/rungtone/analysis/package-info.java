/**
 * Measuring quality: error-based SNR of an output against its reference, single-tone analysis (sine fit,
 * spectra, SINAD, THD, SFDR, ENOB), weighting curves, the analog output model and the bit/rate survey.
 */
package org.rungtone.analysis;
