package org.rungtone.firmware;

/**
 * Template values of the sweep engine.
 *
 * @param count how many codes the sweep steps through
 * @param holdTicks ticks each code is held, or null when a button steps the sweep
 * @param debounceTicks ticks a button level must hold
 * @param modeText how the sweep steps, in words
 * @param codes the C array body of the codes
 */
record SweepView(int count, Long holdTicks, int debounceTicks, String modeText, String codes) {
    private static final int PER_LINE = 16;

    /** The values of the plan's sweep. */
    static SweepView of(EmitPlan p) {
        SweepSpec s = p.request.sweep().orElseThrow();
        int[] codes = s.codes();
        return new SweepView(codes.length, p.button.isPresent() ? null : s.holdTicks(), s.debounceTicks(),
                p.button.map(b -> "the next on each press of " + b.name()).orElse("each held " + s.holdTicks()
                        + " ticks"), CLiterals.arrayBody(codes, CLiterals.hexDigits(p.bits), PER_LINE, "    "));
    }
}
