package org.rungtone.analysis;

/**
 * Error-based quality of one output against its reference: the figures the build report prints for each
 * ladder case (ideal, modelled or measured, compensated) and the survey prints per cell. See
 * {@link AudioMetrics} for the definitions.
 *
 * @param label which case this is ("ideal", "modelled", "measured", "compensated", ...)
 * @param sampleRateHz rate of the compared signals
 * @param samples number of samples compared
 * @param inBandCutoffHz upper edge of the in-band figure (at most rate/2)
 * @param referenceRmsDbfs level of the reference (mean removed) relative to a full-scale sine
 * @param sinadDb reference power over all error power (noise and distortion), full band
 * @param inBandSnrDb in-band reference power over in-band error power
 * @param aWeightedSnrDb reference power (unweighted) over A-weighted error power (IEC 61672-1)
 * @param enobBits effective bits from the error power against a full-scale sine:
 *     ((−errorRmsDbfs) − 1.76)/6.02, independent of the programme's level
 * @param errorRmsDbfs error power relative to a full-scale sine, in dB
 * @param alignmentGain least-squares gain of output over reference (output units per full scale)
 * @param alignmentOffset least-squares offset of the output (output units)
 */
public record QualityReport(String label, double sampleRateHz, int samples, double inBandCutoffHz,
        double referenceRmsDbfs, double sinadDb, double inBandSnrDb, double aWeightedSnrDb, double enobBits,
        double errorRmsDbfs, double alignmentGain, double alignmentOffset) {

    /** The same figures under another label. */
    public QualityReport withLabel(String newLabel) {
        return new QualityReport(newLabel, sampleRateHz, samples, inBandCutoffHz, referenceRmsDbfs, sinadDb,
                inBandSnrDb, aWeightedSnrDb, enobBits, errorRmsDbfs, alignmentGain, alignmentOffset);
    }
}
