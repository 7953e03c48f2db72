package org.rungtone.project;

import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionException;

/** Waiting for work started on another core. */
final class Jobs {
    private Jobs() {
    }

    /**
     * Runs {@code elsewhere} on another core while {@code here} runs on this thread, and returns when both are
     * done (so that a failure never leaves the other writing into a folder that goes), passing on this
     * thread's failure first.
     */
    static void alongside(Runnable here, Runnable elsewhere) {
        CompletableFuture<Void> other = CompletableFuture.runAsync(elsewhere);
        try {
            here.run();
        } finally {
            other.handle((done, failed) -> null).join();
        }
        join(other);
    }

    /** Waits for a job, passing on the user's input errors and programming errors unwrapped. */
    static <T> T join(CompletableFuture<T> job) {
        try {
            return job.join();
        } catch (CompletionException e) {
            if (e.getCause() instanceof RuntimeException r) {
                throw r;
            }
            if (e.getCause() instanceof Error err) {
                throw err;
            }
            throw e;
        }
    }
}
