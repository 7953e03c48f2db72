package org.rungtone.project;

/**
 * How far a build has got, for a progress line. A build calls it from its own thread and, while it reads the
 * source, from the threads that decode it, so an implementation must be thread-safe.
 */
@FunctionalInterface
public interface BuildProgress {
    /** Reports nothing. */
    BuildProgress NONE = (step, fraction) -> { };

    /**
     * Tells how far the build has got.
     *
     * @param step what was just done, or is being done, in words: "reading", "condition done"
     * @param fraction the share of the whole build done so far, 0..1, estimated from the typical time of
     *     each stage ({@link BuildStage})
     */
    void update(String step, double fraction);
}
