package org.rungtone.project;

/**
 * The stages of one sound's build in the order they end, with the share of a build's time each typically
 * takes: measured with {@code --verbose} on a 600 s 44.1 kHz stereo clip built to 16 kHz 8-bit TPDF, where
 * decoding and resampling ("condition") take half the time. A stage that runs beside another (the preview
 * beside the analysis, the plots beside the C files) counts only what it adds.
 */
enum BuildStage {
    /** The source opened: its header read, a script rendered. */
    OPEN("open", 0.01),
    /** Decoded, resampled, level and fades applied. */
    CONDITION("condition", 0.53),
    /** Quantized onto every ladder case. */
    QUANTIZE("quantize", 0.03),
    /** The quality figures. */
    ANALYZE("analyze", 0.19),
    /** The analog preview. */
    PREVIEW("preview", 0.01),
    /** What the listener hears, against the source as supplied. */
    LISTENER("listener", 0.13),
    /** The C files. */
    EMIT("emit", 0.09),
    /** The preview WAV and the plots. */
    PLOTS("plots", 0.01);

    private final String label;
    private final double share;

    BuildStage(String label, double share) {
        this.label = label;
        this.share = share;
    }

    /** The stage's name in timings and progress: "condition". */
    String label() {
        return label;
    }

    /** The share of a build's time this stage typically takes. */
    double share() {
        return share;
    }

    /** The share of a build done when this stage begins. */
    double doneBefore() {
        double done = 0;
        for (BuildStage s : values()) {
            if (s == this) {
                return done;
            }
            done += s.share;
        }
        return done;
    }

    /** The share of a build done when this stage ends. */
    double doneAfter() {
        return doneBefore() + share;
    }

    /** The share of a build done once its sound is computed, before any file is written. */
    static double rendered() {
        return LISTENER.doneAfter();
    }
}
