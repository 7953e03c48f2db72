package org.rungtone.report;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.rungtone.analysis.Spectrum;
import org.rungtone.analysis.ToneReport;
import org.rungtone.internal.Checks;
import org.rungtone.quantize.Dither;

/**
 * Charts of one sound's analysis, drawn through {@link Plots}: the output spectrum with its harmonics and
 * the ideal quantizer's noise floor, and the error spectrum with the ideal error density.
 *
 * <p>The ideal floor is the error power of an ideal N-bit quantizer whose full scale spans (2^N − 1) steps,
 * {@code −(1.76 + 20·log10(2^N − 1))} dBFS in total (W. R. Bennett, BSTJ 27, 1948), plus what the dither
 * adds: RPDF doubles it (+3.01 dB), TPDF triples it (+4.77 dB) (Lipshitz, Wannamaker, Vanderkooy, J. Audio
 * Eng. Soc. 40(5), 1992). The output spectrum spreads it over its M/2 bins and reads it like a tone (plus
 * the window's noise bandwidth in bins); the error spectrum spreads it over 0 .. fs/2 as a density per
 * hertz. Long spectra are thinned to at most 2048 points, keeping the largest bin of each group so that
 * peaks survive. Frequencies are drawn in kHz.
 */
public final class AnalysisPlots {
    private static final int MAX_POINTS = 2048;
    private static final double FLOOR_DB = -220;
    /** The y range a spectrum shows below its top, at most: deeper bins are the arithmetic's own floor. */
    private static final double SPECTRUM_DEPTH_DB = 160;
    private static final double ERROR_DEPTH_DB = 120;

    private AnalysisPlots() {
    }

    /**
     * The output spectrum (tone-calibrated dBFS) with the fundamental and harmonics marked and the ideal
     * floor for the dither drawn; its y axis covers {@code sharedY} too when given (several sounds' plots on
     * one scale).
     */
    public static Plots.Chart spectrumChart(SoundPlots.Data d, Optional<PlotAxis.Span> sharedY) {
        Spectrum spectrum = d.toneSpectrum().orElseThrow();
        ToneReport tone = d.tone().orElseThrow();
        double[] y = new double[spectrum.bins()];
        for (int k = 0; k < y.length; k++) {
            y[k] = Math.max(FLOOR_DB, spectrum.toneDbfs(k));
        }
        Plots.Series output = thinned("output", spectrum, y, Plots.Style.LINE);
        double floorDb = idealErrorDbfs(d.bits(), d.dither())
                + 10 * Math.log10(spectrum.enbwBins() / (spectrum.fftLength() / 2.0));
        List<double[]> marks = new ArrayList<>();
        marks.add(new double[] {tone.fundamentalHz(), tone.amplitudeDbfs()});
        for (ToneReport.Harmonic h : tone.harmonics()) {
            double level = tone.amplitudeDbfs() + h.levelDbc();
            // a harmonic lost in the arithmetic's own floor (e.g. folded onto another one) gets no marker
            if (level > FLOOR_DB + 20) {
                marks.add(new double[] {h.frequencyHz(), level});
            }
        }
        double[] hx = new double[marks.size()];
        double[] hy = new double[marks.size()];
        for (int i = 0; i < hx.length; i++) {
            hx[i] = marks.get(i)[0] / 1000;
            hy[i] = marks.get(i)[1];
        }
        List<Plots.Series> series = List.of(output,
                new Plots.Series("fundamental and harmonics 2..10", hx, hy, Plots.Style.MARKERS));
        List<Plots.Reference> refs = List.of(Plots.Reference.horizontal(
                floorLabel("floor per bin", d), floorDb));
        String title = String.format(Locale.ROOT, "SINAD %.1f dB, THD %s, SFDR %s, %s %.2f bits", tone.sinadDb(),
                FigureText.thd(tone), FigureText.sfdr(tone), FigureText.ENOB_FULL_SCALE, tone.enobFullScaleBits());
        PlotAxis x = frequencyAxis(spectrum);
        PlotAxis.Span span = sharedY.orElse(spectrumSpan(d).orElseThrow());
        PlotAxis yAxis = PlotAxis.rounded("level (dBFS, tone-calibrated)", span.low(), span.high());
        return new Plots.Chart(title, x, yAxis, series, refs, "Spectrum of the board's output for " + d.sound()
                + ", " + range(x) + " kHz, dBFS (tone-calibrated), with the ideal noise floor for "
                + ditherText(d) + " dashed");
    }

    /**
     * The error's spectral density in dBFS per hertz, with the in-band cutoff and the ideal error density
     * for the dither drawn; its y axis covers {@code sharedY} too when given.
     */
    public static Plots.Chart errorSpectrumChart(SoundPlots.Data d, Optional<PlotAxis.Span> sharedY) {
        Spectrum errorSpectrum = d.errorSpectrum().orElseThrow();
        Plots.Series error = thinned("error", errorSpectrum, errorDensity(errorSpectrum), Plots.Style.LINE);
        List<Plots.Reference> refs = List.of(
                Plots.Reference.horizontal(floorLabel("error density", d), idealDensity(d, errorSpectrum)),
                Plots.Reference.vertical("in-band cutoff " + plain(d.inBandCutoffHz() / 1000) + " kHz",
                        d.inBandCutoffHz() / 1000));
        PlotAxis x = frequencyAxis(errorSpectrum);
        PlotAxis.Span span = sharedY.orElse(errorSpan(d).orElseThrow());
        PlotAxis yAxis = PlotAxis.rounded("error density (dBFS/Hz)", span.low(), span.high());
        return new Plots.Chart("Error spectrum (output minus aligned reference)", x, yAxis, List.of(error), refs,
                "Error spectrum of " + d.sound() + " (what the board adds to the sound), " + range(x)
                        + " kHz, dBFS/Hz, with the in-band cutoff and the ideal error density for "
                        + ditherText(d) + " dashed");
    }

    /** The y values the output spectrum chart needs (data and floor), when the sound is a tone. */
    public static Optional<PlotAxis.Span> spectrumSpan(SoundPlots.Data d) {
        if (d.toneSpectrum().isEmpty() || d.tone().isEmpty()) {
            return Optional.empty();
        }
        Spectrum s = d.toneSpectrum().get();
        double[] y = new double[s.bins()];
        for (int k = 0; k < y.length; k++) {
            y[k] = Math.max(FLOOR_DB, s.toneDbfs(k));
        }
        double floor = idealErrorDbfs(d.bits(), d.dither()) + 10 * Math.log10(s.enbwBins() / (s.fftLength() / 2.0));
        return Optional.of(depthLimited(thinned("", s, y, Plots.Style.LINE).y(), SPECTRUM_DEPTH_DB)
                .including(floor).including(d.tone().get().amplitudeDbfs()));
    }

    /** The y values the error spectrum chart needs (data and ideal density), when there is an error. */
    public static Optional<PlotAxis.Span> errorSpan(SoundPlots.Data d) {
        if (d.errorSpectrum().isEmpty()) {
            return Optional.empty();
        }
        Spectrum s = d.errorSpectrum().get();
        return Optional.of(depthLimited(thinned("", s, errorDensity(s), Plots.Style.LINE).y(), ERROR_DEPTH_DB)
                .including(idealDensity(d, s)));
    }

    /**
     * Total error power of an ideal {@code bits}-bit quantizer with {@code dither}, dBFS:
     * {@code −(1.76 + 20·log10(2^N − 1)) + 10·log10(1, 2 or 3)}.
     */
    static double idealErrorDbfs(int bits, Dither dither) {
        Checks.checkBits(bits);
        double ditherShare = switch (dither) {
            case NONE -> 1;
            case RPDF -> 2;
            case TPDF -> 3;
        };
        return -(1.76 + 20 * Math.log10(Math.pow(2, bits) - 1)) + 10 * Math.log10(ditherShare);
    }

    private static double idealDensity(SoundPlots.Data d, Spectrum s) {
        return idealErrorDbfs(d.bits(), d.dither()) - 10 * Math.log10(s.sampleRateHz() / 2);
    }

    private static double[] errorDensity(Spectrum s) {
        double[] y = new double[s.bins()];
        double perHz = 10 * Math.log10(s.binHz());
        for (int k = 0; k < y.length; k++) {
            y[k] = Math.max(FLOOR_DB, s.powerDbfs(k) - perHz);
        }
        return y;
    }

    /** "ideal 8-bit floor per bin, TPDF dither" (", before shaping" when the error was shaped). */
    private static String floorLabel(String what, SoundPlots.Data d) {
        return "ideal " + d.bits() + "-bit " + what + ", " + ditherText(d) + (d.shaped() ? ", before shaping" : "");
    }

    private static String ditherText(SoundPlots.Data d) {
        return d.dither() == Dither.NONE ? "no dither" : d.dither().name() + " dither";
    }

    private static PlotAxis frequencyAxis(Spectrum s) {
        return PlotAxis.exact("frequency (kHz)", 0, s.sampleRateHz() / 2000);
    }

    /** "0–8" for an axis from 0 to 8. */
    private static String range(PlotAxis a) {
        return plain(a.min()) + "\u2013" + plain(a.max());
    }

    /** The span of {@code y}, its bottom no more than {@code depth} below its top. */
    private static PlotAxis.Span depthLimited(double[] y, double depth) {
        double low = Double.POSITIVE_INFINITY;
        double high = Double.NEGATIVE_INFINITY;
        for (double v : y) {
            low = Math.min(low, v);
            high = Math.max(high, v);
        }
        return new PlotAxis.Span(Math.max(low, high - depth), high);
    }

    /** A number without trailing zeros: 8, 11.025, 22.05. */
    static String plain(double v) {
        return BigDecimal.valueOf(v).round(new MathContext(6)).stripTrailingZeros().toPlainString();
    }

    /** At most {@link #MAX_POINTS} points: the largest value of each group of bins, at its frequency in kHz. */
    private static Plots.Series thinned(String name, Spectrum s, double[] y, Plots.Style style) {
        int n = y.length;
        int group = Math.max(1, (n + MAX_POINTS - 1) / MAX_POINTS);
        int points = (n + group - 1) / group;
        double[] px = new double[points];
        double[] py = new double[points];
        for (int p = 0; p < points; p++) {
            int best = p * group;
            for (int k = p * group; k < Math.min(n, (p + 1) * group); k++) {
                if (y[k] > y[best]) {
                    best = k;
                }
            }
            px[p] = s.frequencyHz(best) / 1000;
            py[p] = y[best];
        }
        return new Plots.Series(name, px, py, style);
    }
}
