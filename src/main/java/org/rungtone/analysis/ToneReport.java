package org.rungtone.analysis;

import java.util.List;

/**
 * Single-tone figures of a signal (IEEE Std 1241-2010): the four-parameter sine fit and the windowed FFT.
 * Levels in dBFS are relative to a full-scale sine; harmonic levels in dBc are relative to the fundamental.
 *
 * @param sampleRateHz sample rate of the analysed signal
 * @param analysedSamples number of samples analysed
 * @param fundamentalHz fitted frequency of the fundamental
 * @param amplitudeDbfs fitted amplitude, 20·log10(A)
 * @param offset fitted DC offset (full scale = 1)
 * @param sinadDb SINAD from the sine-fit residual
 * @param enobBits (sinadDb − 1.76)/6.02
 * @param fftSinadDb SINAD from the spectrum: fundamental over everything else but DC
 * @param snrDb fundamental over noise, harmonics 2..10 excluded
 * @param thdDb harmonics 2..10 (folded into the first Nyquist zone) over the fundamental; negative dB
 * @param sfdrDb fundamental over the largest spur (harmonic or not)
 * @param noiseFloorDbfs total noise power (harmonics and DC excluded) in dBFS
 * @param harmonics the measured harmonics, order 2 upward
 */
public record ToneReport(double sampleRateHz, int analysedSamples, double fundamentalHz, double amplitudeDbfs,
        double offset, double sinadDb, double enobBits, double fftSinadDb, double snrDb, double thdDb,
        double sfdrDb, double noiseFloorDbfs, List<Harmonic> harmonics) {

    /** Copies the harmonic list. */
    public ToneReport {
        harmonics = List.copyOf(harmonics);
    }

    /**
     * One harmonic of the fundamental.
     *
     * @param order harmonic number, 2 upward
     * @param frequencyHz where it lies after folding into 0 .. rate/2
     * @param levelDbc power relative to the fundamental
     */
    public record Harmonic(int order, double frequencyHz, double levelDbc) {
    }
}
