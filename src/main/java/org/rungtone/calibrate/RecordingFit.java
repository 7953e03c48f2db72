package org.rungtone.calibrate;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.rungtone.internal.InputError;

/**
 * Fits a sound card's recording of a {@link RecordingSweep}: finds its two patterns
 * ({@link PatternSearch}), times its steps ({@link SweepClock}), reduces it to bins ({@link StepBins}),
 * fits the input's corner and hum ({@link InputModelFit}) with every step's level ({@link StaircaseSolver}),
 * and gives each planned code's level relative to code 0 and the all-ones code. Refuses, with one line naming
 * the file, a recording too short for the sweep, too quiet, clipped, without the patterns, or of another sweep.
 */
public final class RecordingFit {
    /** A sweep whose pattern distance differs from the plan's by more than this share is another sweep. */
    public static final double WRONG_SWEEP_SHARE = 0.005;
    /** The quietest pattern jump searched for, full-scale units (−46 dBFS). */
    public static final double MIN_JUMP = 0.005;
    /** The levels' median uncertainty must stay below this share of an LSB. */
    public static final double MAX_SIGMA_LSB = 0.25;
    /**
     * A fit too noisy for the levels that leaves more than this many times the recording's own noise does not
     * follow its steps, or the input carries something besides the sweep.
     */
    public static final double MISFIT_RATIO = 10;
    /** A fit that leaves more than this many times the recording's own noise is worth a warning. */
    public static final double WARN_NOISE_RATIO = 2;

    private RecordingFit() {
    }

    /**
     * Fits a recording of {@code sweep}.
     *
     * @throws InputError naming the file: too short, too quiet, clipped, pattern missing, another sweep
     */
    public static RecordingResult fit(Recording rec, RecordingSweep sweep) {
        double fs = rec.sampleRateHz();
        double[] y = rec.samples();
        double needed = sweep.durationSeconds();
        if (rec.durationSeconds() < needed * (1 - WRONG_SWEEP_SHARE)) {
            throw refuse(rec, "is %s long, shorter than the sweep of this plan (%s): record the whole sweep, from"
                    + " before the board starts it to after it ends", seconds(rec.durationSeconds()), seconds(needed));
        }
        double peak = 0;
        for (double v : y) {
            peak = Math.max(peak, Math.abs(v));
        }
        if (peak < MIN_JUMP) {
            throw refuse(rec, "is too quiet: its peak is %s; turn the line input's level up (or the divider's"
                    + " ratio down) so the sweep's full swing reaches about -6 dBFS", dbfs(peak));
        }
        PatternSearch search = new PatternSearch(y, fs);
        double stepSamples = fs * RecordingSweep.PATTERN_TICKS / 1000;
        PatternSearch.Found start = search.find(RecordingSweep.edgeTemplate(true), stepSamples, 0, y.length);
        PatternSearch.Found found = search.find(RecordingSweep.edgeTemplate(false), stepSamples, 0, y.length);
        // both patterns pass the same input: an end pattern of the other polarity is not this sweep's
        PatternSearch.Found end = found != null && start != null && found.jump() * start.jump() < 0 ? null : found;
        long[] ticks = sweep.stepStartTicks();
        double toEnd = ticks[sweep.endPatternStart()] * fs / 1000;
        checkPatterns(rec, sweep, start, end, toEnd);
        if (Math.abs(start.jump()) < MIN_JUMP) {
            throw refuse(rec, "is too quiet: the sweep's full swing reaches only %s; turn the line input's level"
                    + " up (or the divider's ratio down) to about -6 dBFS", dbfs(Math.abs(start.jump())));
        }
        SweepClock clock = SweepClock.measure(y, fs, sweep, start.start(), end.start());
        double last = clock.sampleAt(ticks[ticks.length - 1]);
        if (last + StepBins.GUARD_SAMPLES > y.length) {
            throw refuse(rec, "ends %s before the sweep does: record until the end pattern is over",
                    seconds((last - y.length) / fs));
        }
        checkClipping(rec, clock.startSample(), last);
        StepBins bins = StepBins.of(y, fs, sweep, clock);
        InputModelFit.Fitted fitted = new InputModelFit(bins, sweep.stepCodes()).fit();
        double own = ownNoise(rec, clock.startSample(), last);
        RecordingResult r = RecordingResult.of(rec, sweep, clock, bins, fitted, warnings(clock, fitted, bins, own,
                sweep));
        double lsb = Math.abs(r.swing()) / ((1 << sweep.bits()) - 1);
        if (r.medianLevelSigma() > MAX_SIGMA_LSB * lsb) {
            if (r.noiseRms() > MISFIT_RATIO * own) {
                throw refuse(rec, "does not fit this plan's %d codes held %d ms: the fit leaves %.0f times the"
                        + " recording's own noise; is it of another sweep (give the plan's options: ladder, codes,"
                        + " --hold), or does something else sound in the input?", sweep.planCodes().length,
                        sweep.holdTicks(), r.noiseRms() / own);
            }
            throw refuse(rec, "is too quiet for %d-bit levels: their noise is %.2f LSB (at most %.2f); turn the"
                    + " line input's level up so the full swing reaches about -6 dBFS, or hold each code longer",
                    sweep.bits(), r.medianLevelSigma() / lsb, MAX_SIGMA_LSB);
        }
        return r;
    }

    private static void checkPatterns(Recording rec, RecordingSweep sweep, PatternSearch.Found start,
            PatternSearch.Found end, double toEnd) {
        double fs = rec.sampleRateHz();
        if (start == null) {
            throw refuse(rec, end != null ? "has the sweep's end pattern (at %s) but not its start pattern: start"
                    + " the recorder before the board starts the sweep" : "holds no start pattern of a recording"
                    + " sweep: is the board's output on the line input, running the sweep of 'calibrate plan"
                    + " --recording'?", end == null ? "" : seconds(end.start() / fs));
        }
        boolean after = end != null && end.start() > start.start();
        if (!after || Math.abs((end.start() - start.start()) / toEnd - 1) > WRONG_SWEEP_SHARE) {
            if (start.start() + toEnd + sweep.patternSteps() * RecordingSweep.PATTERN_TICKS * fs / 1000
                    > rec.length()) {
                throw refuse(rec, "ends %s after the sweep's start, but this plan's sweep takes %s: record the"
                        + " whole sweep", seconds((rec.length() - start.start()) / fs),
                        seconds(sweep.durationSeconds()));
            }
            if (!after) {
                throw refuse(rec, "holds the sweep's start pattern (at %s) but not its end pattern: is the"
                        + " recording cut, or the board reset during the sweep?", seconds(start.start() / fs));
            }
            throw refuse(rec, "is of another sweep: its codes take %s between the patterns, this plan's %d codes"
                    + " held %d ms take %s; give the plan's options (ladder, codes, --hold) as for 'calibrate plan'",
                    seconds((end.start() - start.start()) / fs - sweep.patternSteps() * 0.020),
                    sweep.planCodes().length, sweep.holdTicks(), seconds(toEnd / fs - sweep.patternSteps() * 0.020));
        }
    }

    /**
     * What the report should point out: pattern edges that could not be timed (the clock then rests on fewer),
     * and a fit that leaves more than {@value #WARN_NOISE_RATIO} times the recording's own noise (something the
     * model leaves out: a second coupling stage, a card's own processing, or steps out of place).
     */
    private static List<String> warnings(SweepClock clock, InputModelFit.Fitted fitted, StepBins bins, double own,
            RecordingSweep sweep) {
        List<String> out = new ArrayList<>();
        int edges = 0;
        for (boolean start : new boolean[] {true, false}) {
            for (int e : RecordingSweep.edgeTemplate(start)) {
                edges += Math.abs(e);
            }
        }
        if (clock.edgesTimed() < edges * 2 / 3) {
            out.add(String.format(Locale.ROOT, "only %d of the patterns' %d edges could be timed: the clocks' ratio"
                    + " rests on those; check the recording's plot around the patterns", clock.edgesTimed(), edges));
        }
        double noise = fitted.solution().noiseRms(bins.bins());
        if (noise > WARN_NOISE_RATIO * own) {
            out.add(String.format(Locale.ROOT, "the fit leaves %.1f times the recording's own noise: look at the"
                    + " steps with the largest residuals and the plot; a card with effects or a second high-pass"
                    + " stage is not modelled (switch the input's effects off)", noise / own));
        }
        return out;
    }

    /**
     * The recording's own noise per sample between {@code from} and {@code to}, from the median magnitude of
     * its sample-to-sample differences (steps and hum barely move it; the median of |N(0, 2σ²)| is
     * 0.6745·√2·σ), at least the rounding of an integer format.
     */
    static double ownNoise(Recording rec, double from, double to) {
        double[] y = rec.samples();
        int a = (int) Math.max(0, from);
        int b = (int) Math.min(y.length - 1, to);
        double[] d = new double[Math.max(0, b - a)];
        for (int i = a; i < b; i++) {
            d[i - a] = Math.abs(y[i + 1] - y[i]);
        }
        Arrays.sort(d);
        double median = d.length == 0 ? 0 : d[d.length / 2];
        double rounding = rec.pcmBits() == 0 ? 0 : Math.pow(2, -(rec.pcmBits() - 1)) / Math.sqrt(12);
        return Math.max(median / (0.6745 * Math.sqrt(2)), rounding);
    }

    /** Refuses two or more samples in a row at the format's largest value (or the smallest) within the sweep. */
    private static void checkClipping(Recording rec, double from, double to) {
        double[] y = rec.samples();
        double rail = rec.railLevel() - 1e-12;
        int run = 0;
        for (int i = (int) Math.max(0, from); i < Math.min(y.length, to); i++) {
            run = y[i] >= rail || y[i] <= -1 ? run + 1 : 0;
            if (run == 2) {
                throw refuse(rec, "clips at %s (samples at full scale): turn the line input's level down, or"
                        + " the divider's ratio up, so the sweep's full swing stays near -6 dBFS", seconds(i
                        / rec.sampleRateHz()));
            }
        }
    }

    private static InputError refuse(Recording rec, String format, Object... args) {
        return new InputError(rec.source() + ": the recording " + String.format(Locale.ROOT, format, args));
    }

    static String seconds(double s) {
        return String.format(Locale.ROOT, "%.2f s", s);
    }

    static String dbfs(double v) {
        return String.format(Locale.ROOT, "%.1f dBFS", 20 * Math.log10(Math.max(v, 1e-12)));
    }
}
