package org.rungtone.analysis;

/**
 * What the listener gets: the board's reconstructed output (the analog preview) against the source as
 * supplied, both at the analysis rate, in the audio band. See {@link ListenerMetrics} for the method.
 *
 * @param analysisRateHz the common rate both were compared at (the preview rate)
 * @param analysedSeconds how much was compared (at most the first {@value ListenerMetrics#MAX_SECONDS} s)
 * @param bandLowHz lower edge of the band, 20 Hz
 * @param bandTopHz upper edge of the band, 20 kHz (lower only for an analysis rate below 44.1 kHz)
 * @param snrDb listener SNR (20 kHz band): the source's power in the band over the error's, where the error
 *     is everything of the output that is not the source at one gain: noise, distortion, images, and the
 *     treble the rate and the filter lose
 * @param aWeightedSnrDb listener SNR (A-weighted): the same with the error A-weighted (IEC 61672-1)
 * @param delaySeconds how far the output lagged the source (removed before comparing)
 */
public record ListenerReport(double analysisRateHz, double analysedSeconds, double bandLowHz, double bandTopHz,
        double snrDb, double aWeightedSnrDb, double delaySeconds) {
}
