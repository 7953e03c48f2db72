package org.rungtone.analysis;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.rungtone.internal.Checks;
import org.rungtone.source.Signal;

/**
 * Single-tone analysis after IEEE Std 1241-2010: SINAD and ENOB from the four-parameter sine fit
 * ({@link SineFit}); SNR, THD and SFDR from a 7-term Blackman-Harris spectrum ({@link Spectrum}).
 *
 * <p>Spectral bookkeeping: every component (DC, the fundamental at the fitted frequency, harmonics 2..10 at
 * {@code k·f0} folded into 0 .. rate/2) owns the bins of its main lobe, ±(7 bins, scaled for zero-padding,
 * plus one). A component's power is the sum of its bins (the spectrum is noise-calibrated, so a lobe sums
 * to the tone's power). The noise density is the mean of the bins nobody owns, and stands in for the noise
 * hidden under the DC and fundamental lobes: the fundamental's power has that share subtracted, and the
 * total noise is density·M/2. A harmonic whose lobe touches DC or the fundamental cannot be separated and
 * is left out. Then {@code SNR = P1/N}, {@code THD = ΣPh/P1}, {@code SINAD_fft = P1/(everything else
 * except DC)} and {@code SFDR = P1/max(largest harmonic, largest unowned bin read as a tone)}. ENOB is
 * {@code (SINAD − 1.76)/6.02} from the fit.
 *
 * <p>At most the first {@link #MAX_SAMPLES} samples are analysed.
 */
public final class ToneAnalysis {
    /** Longest record analysed, 2^20 samples. */
    public static final int MAX_SAMPLES = 1 << 20;
    /** Highest harmonic counted in THD. */
    public static final int HIGHEST_HARMONIC = 10;

    private static final int FREE = -1;
    private static final int DC = 0;
    private static final int FUNDAMENTAL = 1;

    private ToneAnalysis() {
    }

    /**
     * Analyses a signal that holds one dominant tone.
     *
     * @throws IllegalArgumentException when the signal is shorter than 64 samples or holds no tone
     */
    public static ToneReport analyze(Signal signal) {
        return analyze(signal, spectrum(signal));
    }

    /**
     * Analyses a signal with its {@link #spectrum} already computed (for callers that also plot it): the
     * spectrum seeds the sine fit and gives the harmonics, so it is transformed once.
     *
     * @throws IllegalArgumentException when the signal is shorter than 64 samples or holds no tone
     */
    public static ToneReport analyze(Signal signal, Spectrum spectrum) {
        double[] x = analysed(signal);
        Checks.checkArgument(x.length >= 64, "a tone analysis needs at least 64 samples: %d", x.length);
        double rate = signal.sampleRateHz();
        SineFit.Result fit = SineFit.fit(x, rate, SineFit.estimateFrequencyHz(spectrum));
        return fromSpectrum(spectrum, fit, x.length);
    }

    /** The spectrum {@link #analyze} works on (the first {@link #MAX_SAMPLES} samples), for plots. */
    public static Spectrum spectrum(Signal signal) {
        return Spectrum.of(analysed(signal), signal.sampleRateHz(), Window.BLACKMAN_HARRIS_7);
    }

    /** The samples analysed: the first {@link #MAX_SAMPLES}. */
    private static double[] analysed(Signal signal) {
        double[] x = signal.unsafeSamples();
        return x.length > MAX_SAMPLES ? Arrays.copyOf(x, MAX_SAMPLES) : x;
    }

    /** Where harmonic {@code order} of {@code f0} lies after folding into 0 .. rate/2. */
    public static double foldedHz(double f0, int order, double sampleRateHz) {
        double f = (order * f0) % sampleRateHz;
        return f > sampleRateHz / 2 ? sampleRateHz - f : f;
    }

    private static ToneReport fromSpectrum(Spectrum s, SineFit.Result fit, int n) {
        int bins = s.bins();
        int h = s.mainLobeHalfWidthBins();
        int[] owner = new int[bins];
        Arrays.fill(owner, FREE);
        double f0 = fit.frequencyHz();
        int fundBins = claim(owner, center(s, f0), h, FUNDAMENTAL);
        int dcBins = claim(owner, 0, h, DC);
        List<double[]> found = new ArrayList<>();
        for (int k = 2; k <= HIGHEST_HARMONIC; k++) {
            double f = foldedHz(f0, k, s.sampleRateHz());
            int c = center(s, f);
            if (touches(owner, c, h)) {
                continue;
            }
            claim(owner, c, h, k);
            double p = 0;
            for (int b = Math.max(0, c - h); b <= Math.min(bins - 1, c + h); b++) {
                if (owner[b] == k) {
                    p += s.power(b);
                }
            }
            found.add(new double[] {k, f, p});
        }
        double free = 0;
        int freeCount = 0;
        double fundRaw = 0;
        double maxFree = 0;
        for (int b = 0; b < bins; b++) {
            if (owner[b] == FREE) {
                free += s.power(b);
                freeCount++;
                maxFree = Math.max(maxFree, s.power(b));
            } else if (owner[b] == FUNDAMENTAL) {
                fundRaw += s.power(b);
            }
        }
        double density = freeCount > 0 ? free / freeCount : 0;
        double fund = Math.max(fundRaw - density * fundBins, Double.MIN_NORMAL);
        double harmonicSum = 0;
        double maxHarmonic = 0;
        List<ToneReport.Harmonic> harmonics = new ArrayList<>();
        for (double[] hk : found) {
            harmonicSum += hk[2];
            maxHarmonic = Math.max(maxHarmonic, hk[2]);
            harmonics.add(new ToneReport.Harmonic((int) hk[0], hk[1], db(hk[2] / fund)));
        }
        double noise = density * (s.fftLength() / 2.0);
        double noiseAndDistortion = free + harmonicSum + density * (fundBins + dcBins - 0.5);
        double maxSpur = Math.max(maxHarmonic, maxFree * s.enbwBins());
        return new ToneReport(s.sampleRateHz(), n, f0, db(fit.amplitude() * fit.amplitude()), fit.offset(),
                fit.sinadDb(), fit.enobBits(), db(fund / noiseAndDistortion), db(fund / noise),
                db(harmonicSum / fund), db(fund / maxSpur), db(noise), harmonics);
    }

    private static double db(double ratio) {
        return 10 * Math.log10(ratio);
    }

    private static int center(Spectrum s, double hz) {
        return (int) Math.round(hz / s.binHz());
    }

    private static boolean touches(int[] owner, int c, int h) {
        for (int b = Math.max(0, c - h); b <= Math.min(owner.length - 1, c + h); b++) {
            if (owner[b] == DC || owner[b] == FUNDAMENTAL) {
                return true;
            }
        }
        return false;
    }

    /** Gives the free bins around {@code c} to {@code who}; returns how many it took. */
    private static int claim(int[] owner, int c, int h, int who) {
        int taken = 0;
        for (int b = Math.max(0, c - h); b <= Math.min(owner.length - 1, c + h); b++) {
            if (owner[b] == FREE) {
                owner[b] = who;
                taken++;
            }
        }
        return taken;
    }
}
