package org.rungtone.analysis;

/**
 * One cell of a bit-depth × sample-rate survey.
 *
 * @param bits bit depth N
 * @param rateHz sample rate
 * @param samples number of samples of the clip at this rate
 * @param sinadDb full-band SINAD against the conditioned reference at this rate
 * @param inBandSnrDb SNR up to the survey's in-band cutoff for this rate
 * @param aWeightedSnrDb A-weighted SNR
 * @param enobBits effective bits ({@link AudioMetrics})
 * @param clippedSamples reference samples beyond full scale
 * @param flashBytesUnpacked samples × (1 byte up to 8 bits, else 2)
 * @param flashBytesPacked ceil(samples × N / 8)
 * @param fits the counted flash bytes (packed or unpacked, as the spec says) are within the budget, or no
 *     budget was given
 * @param reachesTarget the target is met (false when no target was given)
 * @param chosen this is the smallest setting that fits and reaches the target
 */
public record SurveyRow(int bits, double rateHz, int samples, double sinadDb, double inBandSnrDb,
        double aWeightedSnrDb, double enobBits, long clippedSamples, long flashBytesUnpacked,
        long flashBytesPacked, boolean fits, boolean reachesTarget, boolean chosen) {

    /** Flash bytes unpacked: 1 byte per sample up to 8 bits, 2 above. */
    public static long unpackedBytes(int samples, int bits) {
        return (long) samples * (bits <= 8 ? 1 : 2);
    }

    /** Flash bytes bit-packed: ceil(samples × bits / 8). */
    public static long packedBytes(int samples, int bits) {
        return ((long) samples * bits + 7) / 8;
    }

    SurveyRow withChosen(boolean isChosen) {
        return new SurveyRow(bits, rateHz, samples, sinadDb, inBandSnrDb, aWeightedSnrDb, enobBits,
                clippedSamples, flashBytesUnpacked, flashBytesPacked, fits, reachesTarget, isChosen);
    }
}
