package org.rungtone.condition;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.rungtone.internal.Setting;
import org.rungtone.internal.Units;
import org.rungtone.source.SampleSource;
import org.rungtone.source.Signal;

/**
 * Applies a {@link Conditioning} to a mono signal. Pure: the input is not modified. Warnings that do not
 * stop the run (an all-silent source, a clip longer than the fades) are collected in the result.
 */
public final class Conditioner {
    /** Samples read at a time when scanning a source for its mean and trim points. */
    private static final int SCAN = 1 << 16;

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
        return apply(SampleSource.of(source), c);
    }

    /**
     * Conditions a source that is read by range (a WAV file decoded on demand): the mean and the trim points
     * are found by reading it block by block, and the resampler reads the kept range block by block, so
     * only the result at the target rate is ever held whole.
     */
    public Conditioned apply(SampleSource source, Conditioning c) {
        List<String> warnings = new ArrayList<>();
        double rate = source.sampleRateHz();
        int length = source.length();
        double trimmedStart = 0;
        double trimmedEnd = 0;
        int first = 0;
        int last = length - 1;
        if (c.trimBelowDbfs().isPresent()) {
            double mean = c.removeDc() ? mean(source) : 0;
            double threshold = Math.pow(10, c.trimBelowDbfs().getAsDouble() / 20);
            first = firstAbove(source, mean, threshold);
            last = first < length ? lastAbove(source, mean, threshold) : -1;
            if (first > last) {
                warnings.add(String.format(Locale.ROOT,
                        "the whole source is below the %.1f dBFS trim threshold; nothing was trimmed",
                        c.trimBelowDbfs().getAsDouble()));
                first = 0;
                last = length - 1;
            } else {
                trimmedStart = first / rate;
                trimmedEnd = (length - 1 - last) / rate;
            }
        }
        checkFades(c, last + 1 - first, rate, trimmedStart + trimmedEnd > 0);
        String how = "none";
        Signal s;
        if (rate != c.targetRateHz()) {
            s = resampler.resample(source, first, last + 1, c.targetRateHz());
            how = resampler.describe(rate, c.targetRateHz());
        } else {
            s = source.read(first, last + 1);
        }
        // Few passes over the result: each pass over a long array costs its own warm-up in a fresh JVM.
        double[] y = s.unsafeSamples();
        // The resampled signal's own mean: equal to the source's but for the filter's edge transients.
        double m = c.removeDc() && y.length > 0 ? sum(y) / y.length : 0;
        double peak = subtractAndPeak(y, m);
        double gainDb = 0;
        if (c.gainDb().isPresent()) {
            gainDb = c.gainDb().getAsDouble();
        } else if (c.normalizeDbfs().isPresent()) {
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
        long over = levelAndCount(y, g, fadeIn, fadeOut);
        if (over > 0) {
            warnings.add(String.format(Locale.ROOT, "%d samples exceed full scale after conditioning and will"
                    + " clip; lower the gain or normalize instead", over));
        }
        return new Conditioned(s, gainDb, trimmedStart, trimmedEnd, how, warnings);
    }

    /**
     * Refuses fades that do not fit in the sound ({@code samples} at {@code rateHz} once trimmed): each fade,
     * and both together, must fit, so that the fades never overlap. Half a sample of slack keeps a fade over
     * exactly the whole sound.
     */
    private static void checkFades(Conditioning c, int samples, double rateHz, boolean trimmed) {
        double in = c.fadeInSeconds();
        double out = c.fadeOutSeconds();
        if (in == 0 && out == 0) {
            return;
        }
        double seconds = samples / rateHz;
        double slack = 0.5 / rateHz;
        String length = Units.format(seconds, "s") + (trimmed ? " once trimmed" : "");
        for (Setting fade : new Setting[] {Setting.FADE_IN, Setting.FADE_OUT}) {
            double t = fade == Setting.FADE_IN ? in : out;
            fade.check(t <= seconds + slack, "%s is longer than the sound (%s); make it at most %s",
                    Units.format(t, "s"), length, Units.format(seconds, "s"));
        }
        if (in + out > seconds + slack) {
            throw Setting.FADE_IN.problem("%s %s and %s %s together are longer than the sound (%s) and would"
                    + " overlap; make them add up to at most %s", Setting.FADE_IN.ref(), Units.format(in, "s"),
                    Setting.FADE_OUT.ref(), Units.format(out, "s"), length, Units.format(seconds, "s"));
        }
    }

    // The passes over the result are small methods of their own: a fresh JVM compiles each hot loop apart,
    // and small methods compile quickly.

    private static double sum(double[] y) {
        double m = 0;
        for (double v : y) {
            m += v;
        }
        return m;
    }

    /** Subtracts {@code m} from every sample; returns the largest magnitude left. */
    private static double subtractAndPeak(double[] y, double m) {
        double peak = 0;
        for (int i = 0; i < y.length; i++) {
            double v = y[i] - m;
            y[i] = v;
            peak = Math.max(peak, Math.abs(v));
        }
        return peak;
    }

    /** Applies gain {@code g} and linear fades; returns how many samples end up beyond full scale. */
    private static long levelAndCount(double[] y, double g, int fadeIn, int fadeOut) {
        int n = y.length;
        long over = 0;
        for (int i = 0; i < n; i++) {
            double v = y[i] * g;
            if (i < fadeIn) {
                v *= (double) i / fadeIn;
            }
            if (n - 1 - i < fadeOut) {
                v *= (double) (n - 1 - i) / fadeOut;
            }
            y[i] = v;
            if (v > 1 || v < -1) {
                over++;
            }
        }
        return over;
    }

    private static double mean(SampleSource source) {
        int n = source.length();
        if (n == 0) {
            return 0;
        }
        double[] b = new double[Math.min(SCAN, n)];
        double sum = 0;
        for (int at = 0; at < n; at += b.length) {
            int k = Math.min(b.length, n - at);
            source.read(at, b, 0, k);
            for (int i = 0; i < k; i++) {
                sum += b[i];
            }
        }
        return sum / n;
    }

    /** Index of the first sample at least {@code threshold} from {@code mean}; the length if none. */
    private static int firstAbove(SampleSource source, double mean, double threshold) {
        int n = source.length();
        double[] b = new double[Math.max(1, Math.min(SCAN, n))];
        for (int at = 0; at < n; at += b.length) {
            int k = Math.min(b.length, n - at);
            source.read(at, b, 0, k);
            for (int i = 0; i < k; i++) {
                if (!(Math.abs(b[i] - mean) < threshold)) {
                    return at + i;
                }
            }
        }
        return n;
    }

    /** Index of the last sample at least {@code threshold} from {@code mean}; -1 if none. */
    private static int lastAbove(SampleSource source, double mean, double threshold) {
        int n = source.length();
        double[] b = new double[Math.max(1, Math.min(SCAN, n))];
        for (int end = n; end > 0; end -= b.length) {
            int k = Math.min(b.length, end);
            source.read(end - k, b, 0, k);
            for (int i = k - 1; i >= 0; i--) {
                if (!(Math.abs(b[i] - mean) < threshold)) {
                    return end - k + i;
                }
            }
        }
        return -1;
    }
}
