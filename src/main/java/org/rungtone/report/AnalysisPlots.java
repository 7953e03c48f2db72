package org.rungtone.report;

import java.math.BigDecimal;
import java.math.MathContext;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.rungtone.analysis.Spectrum;
import org.rungtone.analysis.SurveyResult;
import org.rungtone.analysis.SurveyRow;
import org.rungtone.analysis.SurveyTarget;
import org.rungtone.analysis.ToneReport;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.Checks;

/**
 * Charts of the analysis results, drawn through {@link Plots}: the output spectrum with its harmonics and
 * the ideal quantizer's noise floor, the error spectrum, and survey SINAD against bit depth per rate.
 *
 * <p>The ideal noise floor is the error power of an ideal N-bit quantizer whose full scale spans
 * (2^N − 1) steps, {@code −(1.76 + 20·log10(2^N − 1))} dBFS in total (W. R. Bennett, BSTJ 27, 1948), spread
 * over the spectrum's M/2 bins and read like a tone, i.e. plus the window's noise bandwidth in bins. Long
 * spectra are thinned to at most 2048 points, keeping the largest bin of each group so that peaks survive.
 */
public final class AnalysisPlots {
    private static final int MAX_POINTS = 2048;
    private static final double FLOOR_DB = -220;

    private AnalysisPlots() {
    }

    /**
     * The output spectrum (tone-calibrated dBFS) with the fundamental and harmonics marked and the ideal
     * {@code bits}-bit noise floor drawn.
     */
    public static Plots.Chart spectrumChart(Spectrum spectrum, ToneReport tone, int bits) {
        Checks.checkBits(bits);
        int bins = spectrum.bins();
        double[] y = new double[bins];
        for (int k = 0; k < bins; k++) {
            y[k] = Math.max(FLOOR_DB, spectrum.toneDbfs(k));
        }
        List<Plots.Series> series = new ArrayList<>();
        series.add(thinned("output", spectrum, y, Plots.Style.LINE));
        double floorDb = -(1.76 + 20 * Math.log10(Math.pow(2, bits) - 1))
                + 10 * Math.log10(spectrum.enbwBins() / (spectrum.fftLength() / 2.0));
        double nyquist = spectrum.sampleRateHz() / 2;
        series.add(new Plots.Series(String.format(Locale.ROOT, "ideal %d-bit noise floor per bin", bits),
                new double[] {0, nyquist}, new double[] {floorDb, floorDb}, Plots.Style.DASHED));
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
            hx[i] = marks.get(i)[0];
            hy[i] = marks.get(i)[1];
        }
        series.add(new Plots.Series("fundamental and harmonics 2..10", hx, hy, Plots.Style.MARKERS));
        String title = String.format(Locale.ROOT, "Output spectrum: SINAD %.1f dB, THD %s, SFDR %s, %s %.2f bits",
                tone.sinadDb(), FigureText.thd(tone), FigureText.sfdr(tone), FigureText.ENOB_FULL_SCALE,
                tone.enobFullScaleBits());
        return new Plots.Chart(title, "frequency (Hz)", "level (dBFS, tone-calibrated)", false, series);
    }

    /** The error's spectral density in dBFS per hertz, with the in-band cutoff drawn. */
    public static Plots.Chart errorSpectrumChart(Spectrum errorSpectrum, double inBandCutoffHz) {
        int bins = errorSpectrum.bins();
        double[] y = new double[bins];
        double min = Double.POSITIVE_INFINITY;
        double max = Double.NEGATIVE_INFINITY;
        double perHz = 10 * Math.log10(errorSpectrum.binHz());
        for (int k = 0; k < bins; k++) {
            y[k] = Math.max(FLOOR_DB, errorSpectrum.powerDbfs(k) - perHz);
            min = Math.min(min, y[k]);
            max = Math.max(max, y[k]);
        }
        List<Plots.Series> series = new ArrayList<>();
        series.add(thinned("error", errorSpectrum, y, Plots.Style.LINE));
        series.add(new Plots.Series(String.format(Locale.ROOT, "in-band cutoff %.0f Hz", inBandCutoffHz),
                new double[] {inBandCutoffHz, inBandCutoffHz}, new double[] {min, max}, Plots.Style.DASHED));
        return new Plots.Chart("Error spectrum (output minus aligned reference)", "frequency (Hz)",
                "error density (dBFS/Hz)", false, series);
    }

    /** Survey SINAD against bit depth, one line per rate; the chosen setting and a SINAD target marked. */
    public static Plots.Chart surveyChart(SurveyResult result) {
        List<Plots.Series> series = new ArrayList<>();
        List<Double> rates = new ArrayList<>();
        for (SurveyRow r : result.rows()) {
            if (!rates.contains(r.rateHz())) {
                rates.add(r.rateHz());
            }
        }
        int minBits = Integer.MAX_VALUE;
        int maxBits = Integer.MIN_VALUE;
        for (double rate : rates) {
            List<SurveyRow> rows = new ArrayList<>(result.rowsAtRate(rate));
            rows.sort((a, b) -> Integer.compare(a.bits(), b.bits()));
            double[] x = new double[rows.size()];
            double[] y = new double[rows.size()];
            for (int i = 0; i < rows.size(); i++) {
                x[i] = rows.get(i).bits();
                y[i] = Math.max(FLOOR_DB, rows.get(i).sinadDb());
                minBits = Math.min(minBits, rows.get(i).bits());
                maxBits = Math.max(maxBits, rows.get(i).bits());
            }
            series.add(new Plots.Series(plain(rate / 1000) + " kHz", x, y,
                    Plots.Style.LINE_AND_MARKERS));
        }
        SurveyTarget target = result.target();
        if (target != null && target.kind() == SurveyTarget.Kind.SINAD_DB && !rates.isEmpty()) {
            series.add(new Plots.Series("target " + plain(target.value()) + " dB",
                    new double[] {minBits, maxBits}, new double[] {target.value(), target.value()},
                    Plots.Style.DASHED));
        }
        result.chosen().ifPresent(c -> series.add(new Plots.Series(
                "chosen: " + c.bits() + " bits at " + plain(c.rateHz() / 1000) + " kHz",
                new double[] {c.bits()}, new double[] {c.sinadDb()}, Plots.Style.MARKERS)));
        return new Plots.Chart("Survey: SINAD against bit depth", "bit depth (bits)", "SINAD (dB)", false,
                series);
    }

    /** Writes {@link #spectrumChart} as PNG. */
    public static void writeSpectrum(Path file, Spectrum spectrum, ToneReport tone, int bits) {
        AtomicFiles.writeBytes(file, spectrumPng(spectrum, tone, bits));
    }

    /** {@link #spectrumChart} as PNG bytes, to write later. */
    public static byte[] spectrumPng(Spectrum spectrum, ToneReport tone, int bits) {
        return Plots.png(spectrumChart(spectrum, tone, bits));
    }

    /** Writes {@link #errorSpectrumChart} as PNG, legend bottom right (shaped error rises to the right). */
    public static void writeErrorSpectrum(Path file, Spectrum errorSpectrum, double inBandCutoffHz) {
        AtomicFiles.writeBytes(file, errorSpectrumPng(errorSpectrum, inBandCutoffHz));
    }

    /** {@link #errorSpectrumChart} as PNG bytes (as {@link #writeErrorSpectrum} draws it), to write later. */
    public static byte[] errorSpectrumPng(Spectrum errorSpectrum, double inBandCutoffHz) {
        return Plots.png(errorSpectrumChart(errorSpectrum, inBandCutoffHz), Plots.Legend.BOTTOM_RIGHT);
    }

    /** Writes {@link #surveyChart} as PNG, legend bottom right (SINAD rises with the bit depth). */
    public static void writeSurvey(Path file, SurveyResult result) {
        Plots.write(file, surveyChart(result), Plots.Legend.BOTTOM_RIGHT);
    }

    /** A number without trailing zeros: 8, 11.025, 22.05. */
    private static String plain(double v) {
        return BigDecimal.valueOf(v).round(new MathContext(6)).stripTrailingZeros().toPlainString();
    }

    /** At most {@link #MAX_POINTS} points: the largest value of each group of bins, at its frequency. */
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
            px[p] = s.frequencyHz(best);
            py[p] = y[best];
        }
        return new Plots.Series(name, px, py, style);
    }
}
