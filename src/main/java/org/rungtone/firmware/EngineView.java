package org.rungtone.firmware;

/**
 * Template values of the playback engine: one of {@code clip}, {@code dds} and {@code sweep} is set (the
 * others are null), so each doubles as the section that renders its engine.
 *
 * @param clip the sounds of the clip or loop engine, or null
 * @param looping true for the loop engine
 * @param dds the oscillator of the dds engine, or null
 * @param sweep the codes of the sweep engine, or null
 * @param samples the stored samples, or null for the sweep (which stores none)
 * @param indexType the C type of a sample index ({@code uint16_t}, or {@code uint32_t} past 65,535 samples)
 */
record EngineView(SoundsView clip, boolean looping, DdsView dds, SweepView sweep, SampleView samples,
        String indexType) {
    /** The values of the plan's engine. */
    static EngineView of(EmitPlan p) {
        PlaybackEngine e = p.engine;
        return new EngineView(p.isClip() ? SoundsView.of(p) : null, e == PlaybackEngine.LOOP,
                e == PlaybackEngine.DDS ? DdsView.of(p) : null, e == PlaybackEngine.SWEEP ? SweepView.of(p) : null,
                e == PlaybackEngine.SWEEP ? null : SampleView.of(p), p.wideIndex ? "uint32_t" : "uint16_t");
    }
}
