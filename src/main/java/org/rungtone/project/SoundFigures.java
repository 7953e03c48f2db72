package org.rungtone.project;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.function.UnaryOperator;
import org.rungtone.analysis.AudioMetrics;
import org.rungtone.analysis.CodeUse;
import org.rungtone.analysis.QualityReport;
import org.rungtone.analysis.Spectrum;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.quantize.ErrorFilter;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.Signal;

/** The quality figures of a rendered sound's ladder cases (see {@link SoundRenderer}). */
final class SoundFigures {
    /** The fewest samples the quality figures are measured over (their spectra need that many). */
    static final int MIN_MEASURED = 16;
    /** A wavetable's cycle is measured repeated to at least this many samples. */
    private static final int CYCLE_MEASURED = 4096;

    private SoundFigures() {
    }

    /** The figures of every ladder case, emitted case last. */
    record Figures(List<QualityReport> quality, Spectrum errorSpectrum, Optional<Double> shapingGainDb) {
    }

    /**
     * The figures of a sound: as they are for a sound of {@value #MIN_MEASURED} samples or more; over the cycle
     * repeated for a wavetable (its playback repeats it); left out, with a warning, for a shorter sound or a
     * constant one (silence has no error to speak of).
     */
    static Figures of(BuildPlan plan, boolean wavetable, Signal reference, SoundRenderer.Cases cases, double cutoff,
            List<String> warnings, Coding coding) {
        if (constant(reference)) {
            warnings.add("the sound is silent (one constant level) after conditioning: it builds as that level,"
                    + " and there are no quality figures to measure against it");
            return unmeasured(plan, reference, cases, cutoff, tag(coding));
        }
        if (wavetable) {
            int times = (int) Math.max(1, Math.ceil((double) CYCLE_MEASURED / reference.length()));
            return measure(plan, repeated(reference, times), cases, cutoff, c -> repeated(c, times), coding);
        }
        if (reference.length() < MIN_MEASURED) {
            warnings.add(String.format(Locale.ROOT, "quality figures need at least %d samples and this sound has"
                    + " %d: they are left out", MIN_MEASURED, reference.length()));
            return unmeasured(plan, reference, cases, cutoff, tag(coding));
        }
        return measure(plan, reference, cases, cutoff, c -> c, coding);
    }

    /** What a case's label says of a Tread store (its cases are what the decoder puts out). */
    private static String tag(Coding coding) {
        return coding.codec().map(f -> ", " + f.optionName()).orElse("");
    }

    private static boolean constant(Signal s) {
        double[] v = s.unsafeSamples();
        for (double x : v) {
            if (x != v[0]) {
                return false;
            }
        }
        return true;
    }

    /** Every ladder case with its code use and no figures (NaN). */
    private static Figures unmeasured(BuildPlan plan, Signal reference, SoundRenderer.Cases cases, double cutoff,
            String tag) {
        List<QualityReport> quality = new ArrayList<>();
        double rate = reference.sampleRateHz();
        int n = reference.length();
        quality.add(QualityReport.unmeasured("ideal ladder" + tag, rate, n, cutoff).withCodeUse(cases.idealUse()));
        if (plan.quantize().board().isPresent()) {
            quality.add(QualityReport.unmeasured("board, plain codes" + tag, rate, n, cutoff)
                    .withCodeUse(cases.idealUse()));
            cases.compensatedUse().ifPresent(u -> quality.add(QualityReport.unmeasured("board, compensated" + tag,
                    rate, n, cutoff).withCodeUse(u)));
        }
        return new Figures(quality, null, Optional.empty());
    }

    private static Signal repeated(Signal s, int times) {
        double[] one = s.unsafeSamples();
        double[] all = new double[one.length * times];
        for (int i = 0; i < times; i++) {
            System.arraycopy(one, 0, all, i * one.length, one.length);
        }
        return Signal.wrap(all, s.sampleRateHz());
    }

    private static Codes repeated(Codes c, int times) {
        int[] one = c.unsafeCodes();
        int[] all = new int[one.length * times];
        for (int i = 0; i < times; i++) {
            System.arraycopy(one, 0, all, i * one.length, one.length);
        }
        return Codes.of(c.bits(), c.sampleRateHz(), all);
    }

    /**
     * The quality figures of every ladder case and the shaping gain, against {@code reference}; each case's
     * codes pass through {@code codes} first (the repeat of a wavetable's cycle).
     */
    private static Figures measure(BuildPlan plan, Signal reference, SoundRenderer.Cases cases, double cutoff,
            UnaryOperator<Codes> codes, Coding coding) {
        AudioMetrics metrics = AudioMetrics.of(reference, cutoff);
        String tag = tag(coding);
        List<QualityReport> quality = new ArrayList<>();
        Codes idealCodes = codes.apply(cases.ideal().codes());
        LevelTable played = cases.played();
        Spectrum errorSpectrum;
        CodeUse idealUse = cases.idealUse();
        if (plan.quantize().board().isEmpty()) {
            AudioMetrics.Measured m = metrics.measureWithSpectrum("ideal ladder" + tag, idealCodes, cases.idealTable());
            quality.add(m.report().withCodeUse(idealUse));
            errorSpectrum = m.errorSpectrum();
        } else {
            quality.add(metrics.measure("ideal ladder" + tag, idealCodes, cases.idealTable()).withCodeUse(idealUse));
            AudioMetrics.Measured plain = metrics.measureWithSpectrum("board, plain codes" + tag, idealCodes, played);
            quality.add(plain.report().withCodeUse(idealUse));
            errorSpectrum = plain.errorSpectrum();
            if (cases.compensated().isPresent()) {
                AudioMetrics.Measured comp = metrics.measureWithSpectrum("board, compensated" + tag,
                        codes.apply(cases.compensated().get()), played);
                quality.add(comp.report().withCodeUse(cases.compensatedUse().orElseThrow()));
                errorSpectrum = comp.errorSpectrum();
            }
        }
        Optional<Double> shapingGain = Optional.empty();
        QuantizeSettings q = plan.quantize();
        if (q.shaping().order() > 0) {
            double[] range = cases.range();
            Quantizer flat = new Quantizer(played, range[0], range[1], q.dither(), ErrorFilter.NONE, q.seed());
            double flatInBand = metrics.measure("flat", coding.apply(flat, reference).quantized().codes(), played)
                    .inBandSnrDb();
            shapingGain = Optional.of(quality.get(quality.size() - 1).inBandSnrDb() - flatInBand);
        }
        return new Figures(quality, errorSpectrum, shapingGain);
    }
}
