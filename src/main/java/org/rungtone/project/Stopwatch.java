package org.rungtone.project;

import java.util.LinkedHashMap;
import java.util.Map;

/** Wall-clock milliseconds per stage, in order; tells a listener each stage it finishes. */
final class Stopwatch {
    private final Map<String, Double> laps = new LinkedHashMap<>();
    private final java.util.function.Consumer<String> listener;
    private long last = System.nanoTime();

    Stopwatch(java.util.function.Consumer<String> listener) {
        this.listener = listener;
    }

    void lap(String stage) {
        long now = System.nanoTime();
        laps.merge(stage, (now - last) / 1e6, Double::sum);
        last = now;
        listener.accept(stage);
    }

    Map<String, Double> laps() {
        return laps;
    }
}
