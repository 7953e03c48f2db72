package org.rungtone.codec;

/**
 * A Tread decoder's whole state between two codes: the last two ladder codes it put out (0 .. 2^N − 1), from
 * which it predicts the next, and the step index (0 .. kmax). Stored at every reset point: a sound's start and
 * a loop's start.
 *
 * @param last the code put out last, y1
 * @param previous the code put out before it, y2
 * @param index the step index k
 */
public record TreadState(int last, int previous, int index) {
}
