package org.rungtone.project;

import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.CompletableFuture;
import java.util.function.Function;
import org.rungtone.report.PlotWarmUp;
import org.rungtone.report.SoundPlots;

/**
 * The files of a single sound that are written on other cores as soon as what they hold is known, while the
 * rest of the sound renders: the C files once the codes are (the figures, preview and listener figures still
 * to come), the plots once the figures are (on their own ranges, {@link SoundPlots.Scales#none}, which nothing
 * later changes). The files are the same bytes as when written after rendering.
 */
final class EarlyOutputs implements SoundRenderer.Early {
    private final Path dir;
    private final Function<SoundRenderer.Coded, Build.Emitted> emit;
    private final CompletableFuture<Void> plotsReady = PlotWarmUp.start();
    private volatile CompletableFuture<Build.Emitted> firmware;
    private volatile CompletableFuture<List<Path>> plots;

    /** Outputs in {@code dir}, the C files written by {@code emit}. */
    EarlyOutputs(Path dir, Function<SoundRenderer.Coded, Build.Emitted> emit) {
        this.dir = dir;
        this.emit = emit;
    }

    /** Starts writing the C files of {@code coded}. */
    @Override
    public void coded(SoundRenderer.Coded coded) {
        firmware = CompletableFuture.supplyAsync(() -> emit.apply(coded));
    }

    /** Starts drawing the plots of {@code data} once the plotting machinery is loaded. */
    @Override
    public void analysed(SoundPlots.Data data) {
        plots = plotsReady.thenApplyAsync(loaded -> SoundPlots.write(dir, data, SoundPlots.Scales.none()));
    }

    /**
     * What writing the C files gave, once they are written.
     *
     * @throws IllegalStateException when no codes came
     */
    Build.Emitted firmware() {
        CompletableFuture<Build.Emitted> started = firmware;
        if (started == null) {
            throw new IllegalStateException("no codes were handed on");
        }
        return Jobs.join(started);
    }

    /** The plot files in {@link SoundPlots#write}'s order, once written; none when no figures came. */
    List<Path> plots() {
        CompletableFuture<List<Path>> started = plots;
        return started == null ? List.of() : Jobs.join(started);
    }

    /** Waits until the started jobs have finished, whatever their outcome: a failed build's folder then can go. */
    void settle() {
        for (CompletableFuture<?> started : new CompletableFuture<?>[] {firmware, plots}) {
            if (started != null) {
                started.handle((done, failure) -> null).join();
            }
        }
    }
}
