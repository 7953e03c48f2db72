package org.rungtone.report;

import java.nio.file.Path;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.rungtone.analysis.QualityReport;
import org.rungtone.analysis.SeamlessLoop;
import org.rungtone.analysis.ToneReport;

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
 * @param ladder where the played level table came from
 * @param clippedSamples samples beyond full scale before quantization
 * @param quality the figures of every ladder case, the emitted case last
 * @param emittedCase label of the case whose codes the C files hold
 * @param shapingGainDb in-band SNR won (positive) or lost by noise shaping against flat quantization
 * @param tone single-tone figures, when the source is essentially one sine
 * @param preview the analog preview's settings and figures
 * @param firmware the firmware emitter's report lines (pins, timer, storage), empty for a bare sample array
 * @param flashBytes bytes of sample data
 * @param files files written, in order
 * @param warnings what the user should know
 * @param stageMillis wall-clock milliseconds per stage, in pipeline order
 * @param autoLoop the loop found in the sound ({@code loop = "auto"}), when there is one
 * @param facts what the report states beyond its figures, as values for the JSON report
 */
public record BuildSummary(String toolVersion, Path source, String sourceLayout, String symbol, int bits,
        double rateHz, int samples, double durationSeconds, String dither, String shaping, long seed,
        String conditioning, String resampler, String ladder, long clippedSamples, List<QualityReport> quality,
        String emittedCase, Optional<Double> shapingGainDb, Optional<ToneReport> tone, PreviewInfo preview,
        List<String> firmware, long flashBytes, List<Path> files, List<String> warnings,
        Map<String, Double> stageMillis, Optional<SeamlessLoop> autoLoop, BuildFacts facts) {

    /** Copies the collections. */
    public BuildSummary {
        quality = List.copyOf(quality);
        firmware = List.copyOf(firmware);
        files = List.copyOf(files);
        warnings = List.copyOf(warnings);
        stageMillis = Collections.unmodifiableMap(new LinkedHashMap<>(stageMillis));
    }

    /**
     * The analog preview.
     *
     * @param filter reconstruction filter description
     * @param rateHz preview WAV rate
     * @param passbandTopHz top of the passband used for the droop figure
     * @param zohDroopDb zero-order-hold droop at the passband top
     * @param peak largest absolute preview sample (may exceed 1 by filter ringing)
     */
    public record PreviewInfo(String filter, double rateHz, double passbandTopHz, double zohDroopDb, double peak) {
    }

    /** The figures of the emitted case. */
    public QualityReport emitted() {
        return quality.get(quality.size() - 1);
    }
}
