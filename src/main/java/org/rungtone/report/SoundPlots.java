package org.rungtone.report;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.function.Function;
import org.rungtone.analysis.Spectrum;
import org.rungtone.analysis.ToneReport;
import org.rungtone.quantize.Dither;

/**
 * The plot files of one sound: {@code error-spectrum.png} and, for a tone, {@code spectrum.png}. The sounds
 * of one project share their y ranges ({@link Scales}), so their plots compare at a glance.
 */
public final class SoundPlots {
    private static final String ERROR_SPECTRUM = "error-spectrum.png";
    private static final String SPECTRUM = "spectrum.png";

    private SoundPlots() {
    }

    /**
     * What the plots of one sound draw.
     *
     * @param sound the sound's name, as the pages show it
     * @param bits bit depth
     * @param dither the dither the codes were made with (the ideal floor assumes it)
     * @param shaped whether error feedback shaped the error
     * @param errorSpectrum the emitted case's error spectrum (empty when the error is zero)
     * @param inBandCutoffHz top of the in-band figures
     * @param toneSpectrum the output spectrum, for a tone
     * @param tone the tone's figures, for a tone
     */
    public record Data(String sound, int bits, Dither dither, boolean shaped, Optional<Spectrum> errorSpectrum,
            double inBandCutoffHz, Optional<Spectrum> toneSpectrum, Optional<ToneReport> tone) {
    }

    /**
     * Y ranges shared by comparable plots.
     *
     * @param spectrum the output spectra's, when any sound is a tone
     * @param error the error spectra's, when any sound has an error
     */
    public record Scales(Optional<PlotAxis.Span> spectrum, Optional<PlotAxis.Span> error) {
        /** Each plot on its own range. */
        public static Scales none() {
            return new Scales(Optional.empty(), Optional.empty());
        }

        /** The ranges that hold every sound's plots. */
        public static Scales of(List<Data> sounds) {
            return new Scales(union(sounds, AnalysisPlots::spectrumSpan), union(sounds, AnalysisPlots::errorSpan));
        }

        private static Optional<PlotAxis.Span> union(List<Data> sounds,
                Function<Data, Optional<PlotAxis.Span>> span) {
            Optional<PlotAxis.Span> all = Optional.empty();
            for (Data d : sounds) {
                Optional<PlotAxis.Span> s = span.apply(d);
                if (s.isPresent()) {
                    all = Optional.of(all.map(a -> a.union(s.get())).orElse(s.get()));
                }
            }
            return all;
        }
    }

    /**
     * Writes the sound's plots into {@code dir} on the shared scales.
     *
     * @return the files written: the error spectrum (when there is an error), then the spectrum (for a tone)
     */
    public static List<Path> write(Path dir, Data d, Scales scales) {
        List<Path> files = new ArrayList<>();
        if (d.errorSpectrum().isPresent()) {
            Path file = dir.resolve(ERROR_SPECTRUM);
            Plots.write(file, AnalysisPlots.errorSpectrumChart(d, scales.error()));
            files.add(file);
        }
        if (d.tone().isPresent() && d.toneSpectrum().isPresent()) {
            Path file = dir.resolve(SPECTRUM);
            Plots.write(file, AnalysisPlots.spectrumChart(d, scales.spectrum()));
            files.add(file);
        }
        return files;
    }
}
