package org.rungtone.project;

import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionException;

/** Waiting for work started on another core. */
final class Jobs {
    private Jobs() {
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
