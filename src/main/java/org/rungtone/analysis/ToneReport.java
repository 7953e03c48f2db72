package org.rungtone.analysis;

import java.util.List;

/**
 * Single-tone figures of a signal (IEEE Std 1241-2010): the four-parameter sine fit and the windowed FFT.
 * Levels in dBFS are relative to a full-scale sine; harmonic levels in dBc are relative to the fundamental.
 * See {@link ToneAnalysis} for how THD and SFDR leave the noise out.
 *
 * @param sampleRateHz sample rate of the analysed signal
 * @param analysedSamples number of samples analysed
 * @param fundamentalHz fitted frequency of the fundamental
 * @param amplitudeDbfs fitted amplitude, 20·log10(A)
 * @param offset fitted DC offset (full scale = 1)
 * @param sinadDb SINAD from the sine-fit residual, relative to the tone's own power
 * @param enobSignalBits ENOB re signal: (sinadDb − 1.76)/6.02, the tone at its own level
 * @param fftSinadDb SINAD from the spectrum: fundamental over everything else but DC
 * @param snrDb fundamental over noise, harmonics 2..10 excluded
 * @param thdDb harmonics 2..10 (folded into the first Nyquist zone, the noise in their bins removed) over the
 *     fundamental; negative dB. An upper limit when {@code thdBelowNoise}
 * @param thdBelowNoise no harmonic stands out of the noise: {@code thdDb} is the most they can hold unseen
 * @param sfdrDb fundamental over the largest spur that stands out of the noise; a lower limit when
 *     {@code sfdrLimitedByNoise}
 * @param sfdrLimitedByNoise no spur stands out above the noise's largest peak: {@code sfdrDb} is the
 *     fundamental over that peak read as a tone
 * @param noiseFloorDbfs total noise power (harmonics and DC excluded) in dBFS
 * @param harmonics the harmonics, order 2 upward
 */
public record ToneReport(double sampleRateHz, int analysedSamples, double fundamentalHz, double amplitudeDbfs,
        double offset, double sinadDb, double enobSignalBits, double fftSinadDb, double snrDb, double thdDb,
        boolean thdBelowNoise, double sfdrDb, boolean sfdrLimitedByNoise, double noiseFloorDbfs,
        List<Harmonic> harmonics) {

    /** Copies the harmonic list. */
    public ToneReport {
        harmonics = List.copyOf(harmonics);
    }

    /**
     * ENOB re full scale (IEEE Std 1241-2010: the SINAD a full-scale sine would have):
     * {@code (sinadDb − amplitudeDbfs − 1.76)/6.02}, the noise and distortion held against full scale.
     */
    public double enobFullScaleBits() {
        return (sinadDb - amplitudeDbfs - 1.76) / 6.02;
    }

    /**
     * One harmonic of the fundamental.
     *
     * @param order harmonic number, 2 upward
     * @param frequencyHz where it lies after folding into 0 .. rate/2
     * @param levelDbc power relative to the fundamental, the noise in its bins removed; when it does not
     *     stand out, the most it can be (its largest bin read as a tone)
     * @param standsOut one of its bins stands out of the local noise (it is measured, not bounded)
     */
    public record Harmonic(int order, double frequencyHz, double levelDbc, boolean standsOut) {
    }
}
