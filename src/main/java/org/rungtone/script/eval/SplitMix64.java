package org.rungtone.script.eval;

/**
 * The SplitMix64 pseudo-random generator (G. L. Steele, D. Lea, C. H. Flood, "Fast splittable pseudorandom
 * number generators", OOPSLA 2014): a 64-bit counter stepped by the golden-ratio constant and scrambled. Its
 * output is fixed by this code, so the same seed gives the same samples on every Java version.
 */
final class SplitMix64 {
    private long state;

    SplitMix64(long seed) {
        this.state = seed;
    }

    /** A generator for stream {@code index} of {@code seed}: distinct indices give unrelated sequences. */
    static SplitMix64 stream(long seed, long index) {
        SplitMix64 mixer = new SplitMix64(seed ^ (0xD1B54A32D192ED03L * (index + 1)));
        return new SplitMix64(mixer.nextLong());
    }

    long nextLong() {
        long z = state += 0x9E3779B97F4A7C15L;
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
        return z ^ (z >>> 31);
    }

    /** Uniform on [0, 1) with 53 random bits. */
    double nextDouble() {
        return (nextLong() >>> 11) * 0x1.0p-53;
    }
}
