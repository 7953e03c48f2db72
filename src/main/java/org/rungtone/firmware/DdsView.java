package org.rungtone.firmware;

/**
 * Template values of the DDS engine.
 *
 * @param phaseBits width n of the phase accumulator
 * @param phaseMask 2^n − 1 in hex
 * @param tableBits k: the wavetable has 2^k codes
 * @param tickRateNum the achieved tick rate is exactly tickRateNum / tickRateDen hertz
 * @param tickRateDen the denominator of that fraction
 * @param tickRateMilliHz the achieved tick rate rounded to millihertz
 * @param initialTuningWord the tuning word of the start frequency
 * @param initialNote the start frequency requested and made, in words
 */
record DdsView(int phaseBits, String phaseMask, int tableBits, long tickRateNum, long tickRateDen,
        long tickRateMilliHz, long initialTuningWord, String initialNote) {
    /** The values of the plan's oscillator. */
    static DdsView of(EmitPlan p) {
        int n = p.request.dds().phaseBits();
        return new DdsView(n, CLiterals.hex((1L << n) - 1, 8), p.ddsTableBits(), p.tickRate.numerator(),
                p.tickRate.denominator(), Math.round(p.tickRateHz * 1000), p.ddsTuningWord,
                Fmt.hz(p.request.dds().frequencyHz()) + " requested, "
                        + Fmt.hz(Dds.actualHz(p.ddsTuningWord, p.tickRateHz, n), 9) + " actual");
    }
}
