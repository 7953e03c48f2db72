package org.rungtone.script.eval;

/** The block being evaluated: its number, the index of its first sample and its length. */
final class Block {
    /** Samples per block: a few kilobytes per node, so a whole tree's buffers stay in the caches. */
    static final int SIZE = 512;

    int id = -1;
    long start;
    int length;

    /** Moves on to the block starting at sample {@code start}. */
    void advance(long start, int length) {
        this.id++;
        this.start = start;
        this.length = length;
    }
}
