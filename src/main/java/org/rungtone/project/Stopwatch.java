package org.rungtone.project;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.function.DoubleConsumer;

/** Wall-clock milliseconds per stage, in order; tells a progress listener how far the build has got. */
final class Stopwatch {
    private final Map<String, Double> laps = new LinkedHashMap<>();
    private final BuildProgress progress;
    private long last = System.nanoTime();

    Stopwatch(BuildProgress progress) {
        this.progress = progress;
    }

    void lap(BuildStage stage) {
        long now = System.nanoTime();
        laps.merge(stage.label(), (now - last) / 1e6, Double::sum);
        last = now;
        progress.update(stage.label() + " done", stage.doneAfter());
    }

    /** A listener for the share of {@code stage} done, told as {@code step} and the build's share. */
    DoubleConsumer within(BuildStage stage, String step) {
        return share -> progress.update(step, stage.doneBefore() + share * stage.share());
    }

    Map<String, Double> laps() {
        return laps;
    }
}
