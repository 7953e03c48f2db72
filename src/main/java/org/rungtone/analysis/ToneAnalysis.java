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
 * is left out. Then {@code SNR = P1/N}, {@code SINAD_fft = P1/(everything else except DC)}.
 *
 * <p>THD and SFDR with noise (dither, noise shaping): the noise in a harmonic's bins is not distortion.
 * As IEEE Std 1241-2010 does for spectral THD, each harmonic's power is its bins less the local noise in them
 * (the mean of the unowned bins within 32 main-lobe half-widths, times the number of bins), floored at zero;
 * {@code THD = ΣPh/P1}. A spur counts for SFDR only when one of its bins stands out of the local noise by
 * {@value NoiseFloor#SPUR_MARGIN_DB} dB ({@link NoiseFloor}): a harmonic (its corrected power) or a lobe of
 * unowned bins (their power less the local noise); {@code SFDR = P1/largest spur}. When no harmonic stands
 * out, THD is reported as an upper limit, the harmonics' largest bins read as tones, and flagged as below
 * the noise. When no spur stands out, or a bin of noise elsewhere reads as a larger tone than the largest
 * spur (a spur that large could hide there, e.g. in the high-frequency noise of noise shaping), SFDR is a
 * lower limit, the fundamental over that bin read as a tone, and flagged as limited by the noise.
 *
 * <p>ENOB: {@code (SINAD − 1.76)/6.02} with SINAD from the fit is the ENOB of this signal at its own level
 * (re signal); IEEE Std 1241-2010 defines ENOB for a full-scale sine, so a tone A dB below full scale
 * gives {@code (SINAD + A − 1.76)/6.02} re full scale (see {@link ToneReport}).
 *
 * <p>At most the first {@link #MAX_SAMPLES} samples are analysed.
 */
public final class ToneAnalysis {
    /** Longest record analysed, 2^20 samples. */
    public static final int MAX_SAMPLES = 1 << 20;
    /** Highest harmonic counted in THD. */
    public static final int HIGHEST_HARMONIC = 10;

    /** The local noise is averaged over this many main-lobe half-widths either side. */
    private static final int LOCAL_NOISE_LOBES = 32;
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
        List<Component> found = new ArrayList<>();
        for (int k = 2; k <= HIGHEST_HARMONIC; k++) {
            double f = foldedHz(f0, k, s.sampleRateHz());
            int c = center(s, f);
            if (touches(owner, c, h)) {
                continue;
            }
            claim(owner, c, h, k);
            found.add(component(s, owner, k, f, c, h));
        }
        boolean[] isFree = new boolean[bins];
        double free = 0;
        int freeCount = 0;
        double fundRaw = 0;
        for (int b = 0; b < bins; b++) {
            isFree[b] = owner[b] == FREE;
            if (isFree[b]) {
                free += s.power(b);
                freeCount++;
            } else if (owner[b] == FUNDAMENTAL) {
                fundRaw += s.power(b);
            }
        }
        double density = freeCount > 0 ? free / freeCount : 0;
        NoiseFloor floor = new NoiseFloor(s, isFree, LOCAL_NOISE_LOBES * h);
        double fund = Math.max(fundRaw - density * fundBins, Double.MIN_NORMAL);
        Distortion d = distortion(s, floor, found, fund);
        double noise = density * (s.fftLength() / 2.0);
        double noiseAndDistortion = free + d.rawHarmonicSum() + density * (fundBins + dcBins - 0.5);
        Spur spur = largestSpur(s, floor, owner, d, fund);
        return new ToneReport(s.sampleRateHz(), n, f0, db(fit.amplitude() * fit.amplitude()), fit.offset(),
                fit.sinadDb(), fit.enobBits(), db(fund / noiseAndDistortion), db(fund / noise),
                db(d.thdPower() / fund), d.belowNoise(), db(fund / spur.power()), spur.limitedByNoise(),
                db(noise), d.harmonics());
    }

    /** Harmonic {@code k}'s bins: their raw power, number and largest bin. */
    private record Component(int order, double frequencyHz, int center, double power, int bins, double peak) {
    }

    private static Component component(Spectrum s, int[] owner, int k, double f, int c, int h) {
        double p = 0;
        int taken = 0;
        double peak = 0;
        for (int b = Math.max(0, c - h); b <= Math.min(owner.length - 1, c + h); b++) {
            if (owner[b] == k) {
                p += s.power(b);
                taken++;
                peak = Math.max(peak, s.power(b));
            }
        }
        return new Component(k, f, c, p, taken, peak);
    }

    /**
     * THD's numerator and the harmonics after IEEE Std 1241-2010: each harmonic's bins less the local noise
     * in them, floored at zero. When no harmonic stands out of the noise, the numerator is instead the most
     * the harmonics can hold unseen: the sum of each one's largest bin read as a tone.
     */
    private record Distortion(double thdPower, boolean belowNoise, double rawHarmonicSum, double largestHarmonic,
            List<ToneReport.Harmonic> harmonics) {
    }

    private static Distortion distortion(Spectrum s, NoiseFloor floor, List<Component> found, double fund) {
        double corrected = 0;
        double unseen = 0;
        double raw = 0;
        double largest = 0;
        boolean any = false;
        List<ToneReport.Harmonic> harmonics = new ArrayList<>();
        for (Component c : found) {
            double excess = c.power() - floor.densityAt(c.center()) * c.bins();
            double p = Math.max(0, excess);
            boolean out = floor.standsOut(c.peak(), c.center());
            double bound = c.peak() * s.enbwBins();
            corrected += excess;
            unseen += bound;
            raw += c.power();
            if (out) {
                any = true;
                largest = Math.max(largest, p);
            }
            harmonics.add(new ToneReport.Harmonic(c.order(), c.frequencyHz(), db((out ? p : bound) / fund), out));
        }
        return new Distortion(any ? Math.max(0, corrected) : unseen, !any && !found.isEmpty(), raw, largest,
                harmonics);
    }

    /** The spur SFDR is measured against, and whether the noise rather than a spur set it. */
    private record Spur(double power, boolean limitedByNoise) {
    }

    /**
     * The largest spur that stands out of the noise: a harmonic (its noise-corrected power) or a lobe of
     * unowned bins around a bin above the margin (its bins less the local noise). SFDR is measured against
     * it when it is at least the largest bin elsewhere (outside DC, the fundamental and the spurs) read as a
     * tone; otherwise a spur as large as that bin could hide in the noise, and SFDR is at least that far down.
     */
    private static Spur largestSpur(Spectrum s, NoiseFloor floor, int[] owner, Distortion d, double fund) {
        int h = s.mainLobeHalfWidthBins();
        boolean[] spur = new boolean[owner.length];
        for (ToneReport.Harmonic harmonic : d.harmonics()) {
            for (int b = 0; b < owner.length && harmonic.standsOut(); b++) {
                spur[b] |= owner[b] == harmonic.order();
            }
        }
        double best = d.largestHarmonic();
        for (int b = 0; b < owner.length; b++) {
            double p = s.power(b);
            if (owner[b] == FREE && floor.standsOut(p, b)) {
                double lobe = 0;
                int taken = 0;
                for (int k = Math.max(0, b - h); k <= Math.min(owner.length - 1, b + h); k++) {
                    if (owner[k] == FREE) {
                        lobe += s.power(k);
                        taken++;
                        spur[k] = true;
                    }
                }
                best = Math.max(best, lobe - floor.densityAt(b) * taken);
            }
        }
        double loudest = 0;
        for (int b = 0; b < owner.length; b++) {
            if (owner[b] != DC && owner[b] != FUNDAMENTAL && !spur[b]) {
                loudest = Math.max(loudest, s.power(b));
            }
        }
        double hidden = loudest * s.enbwBins();
        if (best > 0 && best >= hidden) {
            return new Spur(best, false);
        }
        return new Spur(Math.max(Math.max(hidden, best), fund * Double.MIN_NORMAL), true);
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
