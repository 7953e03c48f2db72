package org.rungtone.report;

import java.nio.file.Path;
import java.util.List;

/**
 * What one build did, as the reports show it. Figures carry their units in their names.
 *
 * @param toolVersion Rungtone version
 * @param source source file
 * @param sourceLayout one-line description of the source ("PCM 16-bit, 2 ch, 44100 Hz, 3.20 s")
 * @param symbol C symbol prefix
 * @param bits bit depth
 * @param rateHz target sample rate
 * @param samples number of output samples
 * @param durationSeconds output duration
 * @param dither dither kind
 * @param shaping error-feedback filter name
 * @param seed random seed
 * @param conditioning one-line summary of conditioning
 * @param resampler resampler description
 * @param ladder where the level table came from
 * @param clippedSamples samples beyond full scale before quantization
 * @param snrDb aligned error SNR of the quantized output against the conditioned reference
 * @param flashBytes bytes of sample data
 * @param files files written, in order
 * @param warnings what the user should know
 * @param stageMillis wall-clock milliseconds per stage, in pipeline order
 */
public record BuildSummary(String toolVersion, Path source, String sourceLayout, String symbol, int bits,
        double rateHz, int samples, double durationSeconds, String dither, String shaping, long seed,
        String conditioning, String resampler, String ladder, long clippedSamples, double snrDb,
        long flashBytes, List<Path> files, List<String> warnings,
        java.util.Map<String, Double> stageMillis) {
    /** Copies the lists. */
    public BuildSummary {
        files = List.copyOf(files);
        warnings = List.copyOf(warnings);
        stageMillis = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(stageMillis));
    }
}
