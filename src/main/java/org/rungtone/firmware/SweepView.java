package org.rungtone.firmware;

/**
 * Template values of the sweep engine.
 *
 * @param count how many codes the sweep steps through
 * @param holdTicks ticks each code is held, or null when a button steps the sweep
 * @param debounceTicks ticks a button level must hold
 * @param modeText how the sweep steps, in words
 * @param codes the C array body of the codes
 * @param recording the patterns of a sweep for a recording, or null
 */
record SweepView(int count, Long holdTicks, int debounceTicks, String modeText, String codes,
        RecordingView recording) {
    private static final int PER_LINE = 16;

    /**
     * Template values of a sweep for a recording.
     *
     * @param patternSteps steps of the start pattern and of the end pattern
     * @param patternTicks ticks each pattern step is held
     */
    record RecordingView(int patternSteps, int patternTicks) {
    }

    /** The values of the plan's sweep. */
    static SweepView of(EmitPlan p) {
        SweepSpec s = p.request.sweep().orElseThrow();
        int[] codes = s.codes();
        RecordingView recording = s.patternSteps() > 0 ? new RecordingView(s.patternSteps(), s.patternTicks())
                : null;
        String held = recording == null ? "each held " + s.holdTicks() + " ticks" : "a start pattern and an end"
                + " pattern of " + s.patternSteps() + " steps of " + s.patternTicks() + " ticks around "
                + (codes.length - 2 * s.patternSteps()) + " steps each held " + s.holdTicks() + " ticks";
        return new SweepView(codes.length, p.button.isPresent() ? null : s.holdTicks(), s.debounceTicks(),
                p.button.map(b -> "the next on each press of " + b.name()).orElse(held),
                CLiterals.arrayBody(codes, CLiterals.hexDigits(p.bits), PER_LINE, "    "), recording);
    }
}
