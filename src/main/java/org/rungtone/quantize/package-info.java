/**
 * Quantization: mapping a signal onto the levels of any {@link org.rungtone.ladder.LevelTable} by nearest
 * level, with optional RPDF/TPDF dither and error-feedback noise shaping, into {@link
 * org.rungtone.quantize.Codes}.
 */
package org.rungtone.quantize;
