package org.rungtone.report;

import java.util.concurrent.CompletableFuture;

/**
 * Loads the plotting machinery once per run, on a thread of its own ({@link Plots#warmUp}: Java2D, fonts,
 * XChart and the PNG encoder, a few hundred milliseconds of one-time start-up). A command that will draw
 * plots starts it as early as it can, so that it runs on the second core while the first parses options and
 * renders the sound; whoever draws the first plot waits for it. Loading this class loads nothing of Java2D.
 */
public final class PlotWarmUp {
    private PlotWarmUp() {
    }

    /** Starts the warm-up unless it has started; the returned job completes when plots are ready to draw. */
    public static CompletableFuture<Void> start() {
        return Job.READY;
    }

    /** Holds the one job: created on first use, by whichever thread asks first. */
    private static final class Job {
        static final CompletableFuture<Void> READY = new CompletableFuture<>();

        static {
            Thread t = new Thread(() -> {
                try {
                    Plots.warmUp();
                    READY.complete(null);
                } catch (RuntimeException | Error e) {
                    READY.completeExceptionally(e);
                }
            }, "rungtone plot warm-up");
            // never keeps the process alive: a run that fails early exits without waiting for it
            t.setDaemon(true);
            t.start();
        }
    }
}
