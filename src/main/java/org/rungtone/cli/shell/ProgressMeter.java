package org.rungtone.cli.shell;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import java.util.function.LongSupplier;

/**
 * One status line on standard error while long work runs: what is being done, how much of it, the time since
 * the command started and an estimate of the time left, redrawn in place after a carriage return. Work that
 * ends within half a second shows nothing, and a meter that is off (standard error is not a terminal, or
 * {@code --quiet}) writes nothing at all, so files and standard output never see it.
 */
public final class ProgressMeter implements AutoCloseable {
    /** Work that ends sooner shows no line (common practice, no source: a line that flashes by is noise). */
    static final long QUIET_NANOS = 500_000_000L;
    /** A task's time left is estimated once it has run this long and done at least 1 % of its work. */
    static final long ESTIMATE_AFTER_NANOS = 1_000_000_000L;
    private static final long TICK_MILLIS = 250;
    private static final long SECOND_NANOS = 1_000_000_000L;

    private final PrintWriter err;
    private final boolean on;
    private final LongSupplier nanoClock;
    private final int columns;
    private final long start;
    private ScheduledExecutorService ticker;
    private String task = "";
    private String detail = "";
    private double fraction = Double.NaN;
    private long taskStart;
    private String shown = "";
    private boolean closed;

    /** A meter writing to {@code err} when {@code on}, reading the time from {@code nanoClock}. */
    ProgressMeter(PrintWriter err, boolean on, LongSupplier nanoClock, int columns) {
        this.err = err;
        this.on = on;
        this.nanoClock = nanoClock;
        this.columns = columns;
        this.start = nanoClock.getAsLong();
        this.taskStart = start;
    }

    /**
     * A meter on standard error, on when that is a terminal and the user did not ask for quiet; while on, it
     * redraws its clock a few times a second between reports.
     */
    public static ProgressMeter onStandardError(PrintWriter err, boolean quiet) {
        boolean on = !quiet && Terminal.stderrIsTerminal();
        ProgressMeter meter = new ProgressMeter(err, on, System::nanoTime,
                Terminal.columns(System.getenv()).orElse(Terminal.DEFAULT_COLUMNS));
        if (on) {
            meter.ticker = Executors.newSingleThreadScheduledExecutor(r -> {
                Thread t = new Thread(r, "rungtone-progress");
                t.setDaemon(true);
                return t;
            });
            meter.ticker.scheduleAtFixedRate(meter::tick, TICK_MILLIS, TICK_MILLIS, TimeUnit.MILLISECONDS);
        }
        return meter;
    }

    /**
     * Shows how far {@code task} has got: {@code fraction} of it is done (0..1, NaN when unknown) and
     * {@code detail} says what it is at ("" for nothing). The time left is estimated from when the task
     * began, so a new task starts a new estimate; within a task the share shown never goes back. Any thread may
     * call this.
     */
    public synchronized void show(String task, String detail, double fraction) {
        if (!on || closed) {
            return;
        }
        long now = nanoClock.getAsLong();
        if (!task.equals(this.task)) {
            // the first task began with the command; a later one with its first report
            taskStart = this.task.isEmpty() ? start : now;
            this.task = task;
        } else if (fraction < this.fraction) {
            // workers on other threads report out of turn now and then: the share shown never goes back
            fraction = this.fraction;
        }
        this.detail = detail;
        this.fraction = fraction;
        draw(now);
    }

    /** Redraws the line with the clock moved on (between reports, the elapsed time still counts). */
    synchronized void tick() {
        if (on && !closed && !task.isEmpty()) {
            draw(nanoClock.getAsLong());
        }
    }

    /** Clears the line and stops redrawing; later reports show nothing. */
    @Override
    public synchronized void close() {
        if (ticker != null) {
            ticker.shutdownNow();
        }
        closed = true;
        if (!shown.isEmpty()) {
            err.print("\r" + " ".repeat(shown.length()) + "\r");
            err.flush();
            shown = "";
        }
    }

    private void draw(long now) {
        if (now - start < QUIET_NANOS) {
            return;
        }
        String line = line(now);
        if (line.length() >= columns) {
            line = line.substring(0, columns - 1);
        }
        if (line.equals(shown)) {
            return;
        }
        String blank = line.length() < shown.length() ? " ".repeat(shown.length() - line.length()) : "";
        err.print("\r" + line + blank);
        err.flush();
        shown = line;
    }

    /** "building chime: condition done  47%  0:04 elapsed, about 0:05 left". */
    private String line(long now) {
        StringBuilder b = new StringBuilder(task);
        if (!detail.isEmpty()) {
            b.append(": ").append(detail);
        }
        if (!Double.isNaN(fraction)) {
            b.append(String.format(Locale.ROOT, "  %d%%", (int) Math.floor(100 * Math.min(1, Math.max(0, fraction)))));
        }
        b.append("  ").append(clock((now - start) / SECOND_NANOS)).append(" elapsed");
        long ran = now - taskStart;
        if (fraction >= 0.01 && fraction < 1 && ran >= ESTIMATE_AFTER_NANOS) {
            double left = ran * (1 - fraction) / fraction;
            b.append(", about ").append(clock((long) Math.ceil(left / SECOND_NANOS))).append(" left");
        }
        return b.toString();
    }

    /** Seconds as m:ss, or h:mm:ss from an hour on. */
    static String clock(long seconds) {
        long h = seconds / 3600;
        long m = seconds / 60 % 60;
        long s = seconds % 60;
        return h > 0 ? String.format(Locale.ROOT, "%d:%02d:%02d", h, m, s)
                : String.format(Locale.ROOT, "%d:%02d", m, s);
    }
}
