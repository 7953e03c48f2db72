package org.rungtone.project;

import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.CompletableFuture;
import java.util.function.Consumer;
import org.rungtone.report.PlotWarmUp;
import org.rungtone.report.SoundPlots;

/**
 * The plots of a single sound, drawn and written on another core as soon as its figures are known, while its
 * preview and listener figures still render and its C files are written. A single sound's plots use their own
 * ranges ({@link SoundPlots.Scales#none}), so nothing later changes them; the files are the same bytes as
 * drawn at the end.
 */
final class EarlyPlots implements Consumer<SoundPlots.Data> {
    private final Path dir;
    private final CompletableFuture<Void> ready = PlotWarmUp.start();
    private volatile CompletableFuture<List<Path>> job;

    /** Plots to be written into {@code dir}. */
    EarlyPlots(Path dir) {
        this.dir = dir;
    }

    /** Starts drawing the plots of {@code data} once the plotting machinery is loaded. */
    @Override
    public void accept(SoundPlots.Data data) {
        job = ready.thenApplyAsync(loaded -> SoundPlots.write(dir, data, SoundPlots.Scales.none()));
    }

    /** The plot files in {@link SoundPlots#write}'s order, once written; none when no figures came. */
    List<Path> files() {
        CompletableFuture<List<Path>> started = job;
        return started == null ? List.of() : Jobs.join(started);
    }

    /** Waits until a started job has finished, whatever its outcome: a failed build's folder then can go. */
    void settle() {
        CompletableFuture<List<Path>> started = job;
        if (started != null) {
            started.handle((files, failure) -> null).join();
        }
    }
}
