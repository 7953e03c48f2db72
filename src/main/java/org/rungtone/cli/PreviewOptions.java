package org.rungtone.cli;

import org.rungtone.analysis.ReconstructionFilter;
import picocli.CommandLine.Option;

/** The reconstruction filter after the DAC and the preview WAV's rate (the same --filter syntax as survey). */
public final class PreviewOptions {
    @Option(names = "--filter", paramLabel = "<filter>", defaultValue = "none",
            description = "Reconstruction filter after the ladder, for the preview and the in-band figures:"
                    + " none, rc:HZ (first-order RC) or lp2:HZ[:Q] (second-order low-pass, Q 0.707 by default),"
                    + " e.g. lp2:6k (default ${DEFAULT-VALUE}).")
    ReconstructionFilter filter;

    @Option(names = "--preview-rate", paramLabel = "<hz>", converter = Converters.Hertz.class,
            defaultValue = "44.1k", description = "Rate of preview.wav: 44.1k or 48k (default ${DEFAULT-VALUE}).")
    double previewRateHz;

    @Option(names = "--preview-length", paramLabel = "<time>|all", defaultValue = "60s",
            description = "Longest preview.wav: the first part of the sound (default ${DEFAULT-VALUE}); all for the"
                    + " whole sound. The figures always cover the whole sound.")
    String previewLength;

    /** The preview length limit in seconds, infinite for all. */
    double previewSeconds() {
        if (previewLength.trim().equalsIgnoreCase("all")) {
            return Double.POSITIVE_INFINITY;
        }
        try {
            return org.rungtone.internal.Units.parse(previewLength, "s");
        } catch (org.rungtone.internal.InputError e) {
            throw new org.rungtone.internal.InputError("--preview-length: " + e.getMessage() + ", or all");
        }
    }

    /** The reconstruction filter. */
    ReconstructionFilter filter() {
        return filter;
    }
}
