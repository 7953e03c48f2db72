package org.rungtone.analysis;

import java.util.Optional;
import org.rungtone.codec.TreadFormat;

/**
 * One cell of a bit-depth × sample-rate survey: the plain codes, or a Tread store of them.
 *
 * @param bits bit depth N
 * @param rateHz sample rate
 * @param samples number of samples of the clip at this rate
 * @param sinadDb full-band SINAD against the conditioned reference at this rate (quantization only)
 * @param inBandSnrDb SNR up to the survey's in-band cutoff for this rate (quantization only)
 * @param aWeightedSnrDb A-weighted SNR (quantization only)
 * @param enobFullScaleBits ENOB re full scale ({@link AudioMetrics}), the figure an ENOB target applies to
 * @param clippedSamples reference samples beyond full scale
 * @param flashBytesUnpacked samples × (1 byte up to 8 bits, else 2); for a Tread store its bytes
 * @param flashBytesPacked ceil(samples × N / 8); for a Tread store its bytes: the stream, the decoder's tables
 *     and one reset point
 * @param fits the counted flash bytes (packed or unpacked, as the spec says) are within the budget, or no
 *     budget was given
 * @param reachesTarget the target is met (false when no target was given)
 * @param chosen this is the smallest setting that fits and reaches the target
 * @param listenerSnrDb listener SNR (20 kHz band) of the cell's reconstructed output against the source as
 *     supplied ({@link ListenerMetrics}); NaN when the survey ran without the source
 * @param listenerAWeightedSnrDb listener SNR (A-weighted); NaN when the survey ran without the source
 * @param codec the Tread store of the row, or empty for the plain codes
 */
public record SurveyRow(int bits, double rateHz, int samples, double sinadDb, double inBandSnrDb,
        double aWeightedSnrDb, double enobFullScaleBits, long clippedSamples, long flashBytesUnpacked,
        long flashBytesPacked, boolean fits, boolean reachesTarget, boolean chosen, double listenerSnrDb,
        double listenerAWeightedSnrDb, Optional<TreadFormat> codec) {

    /**
     * Flash bytes of a Tread store of {@code samples} samples to {@code bits}-bit codes: the stream, the
     * decoder's tables and one reset point.
     */
    public static long treadBytes(TreadFormat codec, int samples, int bits) {
        return codec.streamBytes(samples) + codec.playerTableBytes(bits) + TreadFormat.resetBytes(bits);
    }

    /** Flash bytes unpacked: 1 byte per sample up to 8 bits, 2 above. */
    public static long unpackedBytes(int samples, int bits) {
        return (long) samples * (bits <= 8 ? 1 : 2);
    }

    /** Flash bytes bit-packed: ceil(samples × bits / 8). */
    public static long packedBytes(int samples, int bits) {
        return ((long) samples * bits + 7) / 8;
    }

    /** ENOB re signal: {@code (sinadDb − 1.76)/6.02}, the programme at its own level. */
    public double enobSignalBits() {
        return (sinadDb - 1.76) / 6.02;
    }

    /** True when the listener figures were measured. */
    public boolean hasListenerFigures() {
        return !Double.isNaN(listenerSnrDb);
    }

    SurveyRow withChosen(boolean isChosen) {
        return new SurveyRow(bits, rateHz, samples, sinadDb, inBandSnrDb, aWeightedSnrDb, enobFullScaleBits,
                clippedSamples, flashBytesUnpacked, flashBytesPacked, fits, reachesTarget, isChosen, listenerSnrDb,
                listenerAWeightedSnrDb, codec);
    }
}
