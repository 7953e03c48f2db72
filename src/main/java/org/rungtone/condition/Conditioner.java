package org.rungtone.condition;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.rungtone.source.Signal;

/**
 * Applies a {@link Conditioning} to a mono signal. Pure: the input is not modified. Warnings that do not
 * stop the run (an all-silent source, a clip longer than the fades) are collected in the result.
 */
public final class Conditioner {
    private final Resampler resampler;

    /** A conditioner that resamples with {@code resampler}. */
    public Conditioner(Resampler resampler) {
        this.resampler = resampler;
    }

    /**
     * The conditioned signal and what was done.
     *
     * @param signal the result at the target rate
     * @param gainDb the gain applied by --gain or --normalize, in dB
     * @param trimmedStartSeconds silence removed at the start
     * @param trimmedEndSeconds silence removed at the end
     * @param resampler the resampler's description, or "none" when the rate already matched
     * @param warnings what the user should know
     */
    public record Conditioned(Signal signal, double gainDb, double trimmedStartSeconds,
            double trimmedEndSeconds, String resampler, List<String> warnings) {
        /** Copies the warnings. */
        public Conditioned {
            warnings = List.copyOf(warnings);
        }
    }

    /**
     * Conditions {@code source}. The source is read in place, never copied whole: trimming picks an index
     * range, the resampler reads that range, and DC removal, gain and fades work on the resampled result
     * (when the rate already matches, the range is copied once).
     */
    public Conditioned apply(Signal source, Conditioning c) {
        List<String> warnings = new ArrayList<>();
        double rate = source.sampleRateHz();
        double[] x = source.unsafeSamples();
        double mean = 0;
        if (c.removeDc() && x.length > 0) {
            for (double v : x) {
                mean += v;
            }
            mean /= x.length;
        }
        double trimmedStart = 0;
        double trimmedEnd = 0;
        int first = 0;
        int last = x.length - 1;
        if (c.trimBelowDbfs().isPresent()) {
            double threshold = Math.pow(10, c.trimBelowDbfs().getAsDouble() / 20);
            while (first < x.length && Math.abs(x[first] - mean) < threshold) {
                first++;
            }
            while (last >= first && Math.abs(x[last] - mean) < threshold) {
                last--;
            }
            if (first > last) {
                warnings.add(String.format(Locale.ROOT,
                        "the whole source is below the %.1f dBFS trim threshold; nothing was trimmed",
                        c.trimBelowDbfs().getAsDouble()));
                first = 0;
                last = x.length - 1;
            } else {
                trimmedStart = first / rate;
                trimmedEnd = (x.length - 1 - last) / rate;
            }
        }
        String how = "none";
        Signal s;
        if (rate != c.targetRateHz()) {
            s = resampler.resample(source, first, last + 1, c.targetRateHz());
            how = resampler.name();
        } else {
            s = Signal.wrap(Arrays.copyOfRange(x, first, last + 1), rate);
        }
        if (c.removeDc()) {
            // The resampled signal's own mean: equal to the source's but for the filter's edge transients.
            double[] y = s.unsafeSamples();
            double m = 0;
            for (double v : y) {
                m += v;
            }
            m = y.length == 0 ? 0 : m / y.length;
            for (int i = 0; i < y.length; i++) {
                y[i] -= m;
            }
        }
        double[] y = s.unsafeSamples();
        double gainDb = 0;
        if (c.gainDb().isPresent()) {
            gainDb = c.gainDb().getAsDouble();
        } else if (c.normalizeDbfs().isPresent()) {
            double peak = s.peak();
            if (peak > 0) {
                gainDb = c.normalizeDbfs().getAsDouble() - 20 * Math.log10(peak);
            } else {
                warnings.add("the source is silent; normalization left it silent");
            }
        }
        double g = Math.pow(10, gainDb / 20);
        int n = y.length;
        int fadeIn = (int) Math.min(n, Math.round(c.fadeInSeconds() * s.sampleRateHz()));
        int fadeOut = (int) Math.min(n, Math.round(c.fadeOutSeconds() * s.sampleRateHz()));
        if (fadeIn + fadeOut > n && n > 0) {
            warnings.add(String.format(Locale.ROOT, "fades (%.0f ms + %.0f ms) are longer than the clip"
                    + " (%.0f ms); they overlap", 1000 * c.fadeInSeconds(), 1000 * c.fadeOutSeconds(),
                    1000.0 * n / s.sampleRateHz()));
        }
        for (int i = 0; i < n; i++) {
            double v = y[i] * g;
            if (i < fadeIn) {
                v *= (double) i / fadeIn;
            }
            if (n - 1 - i < fadeOut) {
                v *= (double) (n - 1 - i) / fadeOut;
            }
            y[i] = v;
        }
        long over = 0;
        for (double v : y) {
            if (v > 1 || v < -1) {
                over++;
            }
        }
        if (over > 0) {
            warnings.add(String.format(Locale.ROOT, "%d samples exceed full scale after conditioning and will"
                    + " clip; lower --gain or use --normalize", over));
        }
        return new Conditioned(s, gainDb, trimmedStart, trimmedEnd, how, warnings);
    }
}
