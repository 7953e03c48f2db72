package org.rungtone.cli;

import java.util.Locale;
import org.rungtone.analysis.ReconstructionFilter;
import org.rungtone.internal.InputError;
import picocli.CommandLine.Option;

/** The reconstruction filter after the DAC and the preview WAV's rate. */
public final class PreviewOptions {
    @Option(names = "--filter", paramLabel = "none|rc|lp2", defaultValue = "none",
            description = "Reconstruction filter after the DAC for the preview and the in-band figures:"
                    + " none, rc (first-order RC) or lp2 (second-order low-pass) (default ${DEFAULT-VALUE}).")
    String filter;

    @Option(names = "--cutoff", paramLabel = "<hz>", converter = Converters.Hertz.class,
            description = "Cutoff of the rc or lp2 filter (default 0.4 x the sample rate).")
    Double cutoffHz;

    @Option(names = "--q", paramLabel = "<q>", defaultValue = "0.7071",
            description = "Q of the lp2 filter (default ${DEFAULT-VALUE}, Butterworth).")
    double q;

    @Option(names = "--preview-rate", paramLabel = "<hz>", converter = Converters.Hertz.class,
            defaultValue = "44.1k", description = "Rate of preview.wav: 44.1k or 48k (default ${DEFAULT-VALUE}).")
    double previewRateHz;

    /** The filter for a given sample rate. */
    ReconstructionFilter filter(double sampleRateHz) {
        double cutoff = cutoffHz != null ? cutoffHz : 0.4 * sampleRateHz;
        switch (filter.toLowerCase(Locale.ROOT)) {
            case "none":
                if (cutoffHz != null) {
                    throw new InputError("--cutoff needs --filter rc or --filter lp2");
                }
                return ReconstructionFilter.none();
            case "rc":
                return ReconstructionFilter.firstOrder(cutoff);
            case "lp2":
                return ReconstructionFilter.secondOrder(cutoff, q);
            default:
                throw new InputError("--filter must be none, rc or lp2: " + filter);
        }
    }
}
