package org.rungtone.project;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.CompletableFuture;
import org.rungtone.analysis.Spectrum;
import org.rungtone.analysis.ToneReport;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.report.AnalysisPlots;
import org.rungtone.report.PlotWarmUp;

/**
 * The PNG plots of one sound: drawn on another core as soon as the figures they show are known (while the
 * sound's preview is still rendering), then written with the sound's other files. The bytes do not depend on
 * when or where they are drawn.
 */
final class SoundPlots {
    /** The error spectrum's plot. */
    static final String ERROR_SPECTRUM = "error-spectrum.png";
    /** The single tone's output spectrum plot. */
    static final String SPECTRUM = "spectrum.png";

    private volatile CompletableFuture<List<Drawn>> drawn;

    /**
     * What the plots show.
     *
     * @param errorSpectrum the emitted case's error spectrum (null when the error is zero: no plot)
     * @param inBandCutoffHz top of the in-band figures
     * @param tone single-tone figures, if the source is one sine
     * @param toneSpectrum the output spectrum, for tones
     * @param bits the bit depth
     */
    record Data(Spectrum errorSpectrum, double inBandCutoffHz, Optional<ToneReport> tone,
            Optional<Spectrum> toneSpectrum, int bits) {

        /** The plots' data of a rendered sound. */
        static Data of(SoundRenderer.Rendered r) {
            return new Data(r.errorSpectrum(), r.inBandCutoffHz(), r.tone(), r.toneSpectrum(), r.plan().bits());
        }
    }

    /** One drawn plot: its file name and PNG bytes. */
    private record Drawn(String fileName, byte[] png) {
    }

    /** Starts drawing the plots of {@code data} once the plotting machinery is loaded, on another thread. */
    void draw(Data data) {
        drawn = PlotWarmUp.start().thenApplyAsync(ready -> pngs(data));
    }

    /**
     * Writes the plots into {@code dir}, drawing them now if {@link #draw} was not called for {@code r}, and
     * returns the files in order.
     */
    List<Path> write(SoundRenderer.Rendered r, Path dir) {
        CompletableFuture<List<Drawn>> job = drawn;
        List<Drawn> pngs = job != null ? Jobs.join(job) : pngs(Data.of(r));
        List<Path> files = new ArrayList<>();
        for (Drawn d : pngs) {
            Path file = dir.resolve(d.fileName());
            AtomicFiles.writeBytes(file, d.png());
            files.add(file);
        }
        return files;
    }

    private static List<Drawn> pngs(Data data) {
        List<Drawn> out = new ArrayList<>();
        if (data.errorSpectrum() != null) {
            out.add(new Drawn(ERROR_SPECTRUM, AnalysisPlots.errorSpectrumPng(data.errorSpectrum(),
                    data.inBandCutoffHz())));
        }
        if (data.tone().isPresent() && data.toneSpectrum().isPresent()) {
            out.add(new Drawn(SPECTRUM, AnalysisPlots.spectrumPng(data.toneSpectrum().get(), data.tone().get(),
                    data.bits())));
        }
        return out;
    }
}
