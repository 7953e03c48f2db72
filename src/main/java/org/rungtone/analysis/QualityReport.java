package org.rungtone.analysis;

import java.util.Optional;

/**
 * Error-based quality of one output against its reference: the figures the build report prints for each
 * ladder case (ideal, modelled or measured, compensated) and the survey prints per cell. See
 * {@link AudioMetrics} for the definitions. These are the quantization-only figures: output and reference
 * are both at the target rate, so what the rate itself loses (treble above rate/2) does not show here; the
 * {@link #listener} figures compare what the board plays with the source as supplied.
 *
 * @param label which case this is ("ideal", "modelled", "measured", "compensated", ...)
 * @param sampleRateHz rate of the compared signals
 * @param samples number of samples compared
 * @param inBandCutoffHz upper edge of the in-band figure (at most rate/2)
 * @param referenceRmsDbfs level of the reference (mean removed) relative to a full-scale sine
 * @param sinadDb reference power over all error power (noise and distortion), full band
 * @param inBandSnrDb in-band reference power over in-band error power
 * @param aWeightedSnrDb reference power (unweighted) over A-weighted error power (IEC 61672-1)
 * @param enobFullScaleBits ENOB re full scale (IEEE Std 1241-2010): the error power against a full-scale
 *     sine, ((−errorRmsDbfs) − 1.76)/6.02, independent of the programme's level
 * @param errorRmsDbfs error power relative to a full-scale sine, in dB
 * @param alignmentGain least-squares gain of output over reference (output units per full scale)
 * @param alignmentOffset least-squares offset of the output (output units)
 * @param codeUse how the case's codes use the range, when they came from a quantizer
 * @param listener the board's reconstructed output against the source as supplied, for the emitted case
 */
public record QualityReport(String label, double sampleRateHz, int samples, double inBandCutoffHz,
        double referenceRmsDbfs, double sinadDb, double inBandSnrDb, double aWeightedSnrDb,
        double enobFullScaleBits, double errorRmsDbfs, double alignmentGain, double alignmentOffset,
        Optional<CodeUse> codeUse, Optional<ListenerReport> listener) {

    /**
     * A case whose figures were not measured (a sound too short for them, or silent): every figure NaN.
     *
     * @param label which case this is
     * @param sampleRateHz rate of the codes
     * @param samples number of samples
     * @param inBandCutoffHz upper edge the in-band figure would have had
     */
    public static QualityReport unmeasured(String label, double sampleRateHz, int samples, double inBandCutoffHz) {
        return new QualityReport(label, sampleRateHz, samples, inBandCutoffHz, Double.NaN, Double.NaN, Double.NaN,
                Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Optional.empty(), Optional.empty());
    }

    /** True when the figures were measured (not {@link #unmeasured}). */
    public boolean measured() {
        return !Double.isNaN(sinadDb);
    }

    /**
     * ENOB re signal: {@code (sinadDb − 1.76)/6.02}, the programme at its own level. It is lower than
     * {@link #enobFullScaleBits} by the reference's distance below a full-scale sine, in steps of 6.02 dB.
     */
    public double enobSignalBits() {
        return (sinadDb - 1.76) / 6.02;
    }

    /** The same figures under another label. */
    public QualityReport withLabel(String newLabel) {
        return new QualityReport(newLabel, sampleRateHz, samples, inBandCutoffHz, referenceRmsDbfs, sinadDb,
                inBandSnrDb, aWeightedSnrDb, enobFullScaleBits, errorRmsDbfs, alignmentGain, alignmentOffset,
                codeUse, listener);
    }

    /** The same figures with the codes' use of the range. */
    public QualityReport withCodeUse(CodeUse use) {
        return new QualityReport(label, sampleRateHz, samples, inBandCutoffHz, referenceRmsDbfs, sinadDb,
                inBandSnrDb, aWeightedSnrDb, enobFullScaleBits, errorRmsDbfs, alignmentGain, alignmentOffset,
                Optional.of(use), listener);
    }

    /** The same figures with what the listener gets. */
    public QualityReport withListener(ListenerReport figures) {
        return new QualityReport(label, sampleRateHz, samples, inBandCutoffHz, referenceRmsDbfs, sinadDb,
                inBandSnrDb, aWeightedSnrDb, enobFullScaleBits, errorRmsDbfs, alignmentGain, alignmentOffset,
                codeUse, Optional.of(figures));
    }
}
