/**
 * Sample codecs: Tread, Rungtone's adaptive differential code of 2, 3 or 4 bits per sample that decodes to the
 * ladder's N-bit codes in the player's tick ({@link org.rungtone.codec.TreadFormat}), its reference decoder
 * ({@link org.rungtone.codec.TreadDecoder}) and its search encoder, which chooses codes against the
 * decoder's exact integer behaviour and the board's real levels ({@link org.rungtone.codec.TreadEncoder}).
 */
package org.rungtone.codec;
