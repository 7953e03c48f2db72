package org.rungtone.analysis;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.rungtone.internal.Checks;
import org.rungtone.source.Signal;

/**
 * Finds a seamless loop in a sustained sound (a siren, a hum, an organ tone): a pure function of the signal.
 *
 * <ol>
 * <li>The sustained part ({@link SustainedPart}) and its pitch period p ({@link PitchPeriod}, YIN).</li>
 * <li>Loop starts: the start of the sustained part and places 1, 2, 4, 8 and 16 envelope frames later (up to
 * half-way into the part): a start on the last of a slow attack matches no end, a later one does, and the
 * earliest that does keeps the attack short. Once a start has given a seam at or below {@value #INAUDIBLE_DB}
 * dB, no later one is tried.</li>
 * <li>Loop ends, for each start s: one candidate per whole number k of periods, at s + k·p, refined to the
 * sample within half a period either side by the cross-correlation of the stretch before the candidate end
 * with the stretch before the start: the lag with the least weighted squared difference
 * {@code Σ ((1 − wᵢ)·(x[e−C+i] − x[s−C+i]))²} (which is the two stretches' energies minus twice their
 * weighted cross-correlation) wins, so the end meets the start at matching phase and slope.</li>
 * <li>Ranking: by the seam level that remains after the crossfade ({@link LoopCrossfade#seamLevelDb}); among
 * the loops within {@value #TIE_DB} dB of the cleanest seam, the longest (a longer loop keeps more of the
 * sound's own life; a rule of thumb of ours), then the earliest start.</li>
 * </ol>
 * The period reported is the loop's length over the whole number of periods it holds, counted with YIN's
 * period over the loop alone (the sustained part may take in the end of a pitch glide, such as a motor
 * spinning up). No loop is found when the sound has no sustained part long enough, no steady pitch, or no
 * seam at or below {@value #ACCEPT_DB} dB (a rule of thumb of ours: a seam louder than that is heard as a
 * thump or a warble on every pass).
 *
 * <p>Sizes: the crossfade is {@value #CROSSFADE_SECONDS} s and at least two periods; a loop is at least
 * {@value #MIN_LOOP_SECONDS} s and {@value #MIN_LOOP_PERIODS} periods long, and at most
 * {@value #MAX_LOOP_SECONDS} s (which bounds the search's time: it weighs every lag once per start).
 */
public final class LoopFinder {
    /** Length of the baked crossfade, in seconds. */
    static final double CROSSFADE_SECONDS = 0.008;
    /** The shortest loop, in seconds. */
    static final double MIN_LOOP_SECONDS = 0.05;
    /** The fewest periods in a loop. */
    static final int MIN_LOOP_PERIODS = 4;
    /** The longest loop searched, in seconds. */
    static final double MAX_LOOP_SECONDS = 8;
    /** The loudest seam accepted, in dB relative to the sustained sound. */
    static final double ACCEPT_DB = -25;
    /** A seam this far down is not heard: later starts, which only lengthen the attack, are not tried. */
    static final double INAUDIBLE_DB = -55;
    /** Loops this close to the cleanest seam count as equally clean. */
    static final double TIE_DB = 3;
    /** Loop starts tried, in envelope frames after the start of the sustained part (at most half-way in). */
    private static final int[] START_FRAMES = {0, 1, 2, 4, 8, 16};

    private LoopFinder() {
    }

    /** The best loop in the whole sound, or empty when it has no repeating section. */
    public static Optional<SeamlessLoop> find(Signal sound) {
        return find(sound, sound.length());
    }

    /**
     * The best loop that ends at or before sample {@code maxEnd} (to keep a shortened sound within a flash
     * budget), or empty when there is no repeating section there.
     *
     * @throws IllegalArgumentException when {@code maxEnd} is not within the sound
     */
    public static Optional<SeamlessLoop> find(Signal sound, int maxEnd) {
        Checks.checkArgument(maxEnd >= 0 && maxEnd <= sound.length(), "loop end limit %d is outside the sound"
                + " (%d samples)", maxEnd, sound.length());
        Optional<SustainedPart> sustain = SustainedPart.of(sound);
        if (sustain.isEmpty()) {
            return Optional.empty();
        }
        SustainedPart part = sustain.get();
        OptionalDouble period = PitchPeriod.of(sound, part.start(), part.end());
        if (period.isEmpty()) {
            return Optional.empty();
        }
        double p = period.getAsDouble();
        double rate = sound.sampleRateHz();
        int crossfade = (int) Math.max(Math.round(CROSSFADE_SECONDS * rate), Math.ceil(2 * p));
        int minLoop = (int) Math.max(Math.ceil(MIN_LOOP_SECONDS * rate), Math.ceil(MIN_LOOP_PERIODS * p));
        int maxLoop = (int) Math.round(MAX_LOOP_SECONDS * rate);
        Search search = new Search(sound.unsafeSamples(), p, crossfade, part.rms());
        int limit = Math.min(maxEnd, part.end());
        List<Candidate> candidates = new ArrayList<>();
        int frame = (int) Math.round(SustainedPart.FRAME_SECONDS * rate);
        for (int offset : START_FRAMES) {
            boolean inaudible = candidates.stream().anyMatch(c -> c.seamDb() <= INAUDIBLE_DB);
            if (offset * frame > part.length() / 2 || inaudible) {
                break;
            }
            int start = Math.max(crossfade, part.start() + offset * frame);
            int last = Math.min(limit, start + maxLoop);
            if (last - start >= Math.max(minLoop, crossfade)) {
                search.from(start, Math.max(minLoop, crossfade), last, candidates);
            }
        }
        Optional<Candidate> chosen = best(candidates);
        if (chosen.isEmpty() || chosen.get().seamDb() > ACCEPT_DB) {
            return Optional.empty();
        }
        Candidate best = chosen.get();
        // the period again over the loop alone: the sustained part may take in the last of a pitch glide
        double inLoop = PitchPeriod.of(sound, best.start(), best.end()).orElse(p);
        int length = best.end() - best.start();
        double periods = Math.max(1, Math.round(length / inLoop));
        return Optional.of(new SeamlessLoop(best.start(), best.end(), length / periods, best.seamDb(), crossfade));
    }

    /** One loop weighed: its points and its seam level. */
    record Candidate(int start, int end, double seamDb) {
        int length() {
            return end - start;
        }
    }

    /** The best candidate by the ranking of the class comment, or empty for none. */
    static Optional<Candidate> best(List<Candidate> candidates) {
        double cleanest = candidates.stream().mapToDouble(Candidate::seamDb).min().orElse(0);
        return candidates.stream().filter(c -> c.seamDb() <= cleanest + TIE_DB)
                .max(Comparator.comparingInt(Candidate::length).thenComparing(Candidate::start,
                        Comparator.reverseOrder()));
    }

    /** The end search for one sound. */
    private static final class Search {
        private final double[] x;
        private final double period;
        private final int crossfade;
        private final double rms;
        private final double[] gain;

        Search(double[] x, double period, int crossfade, double rms) {
            this.x = x;
            this.period = period;
            this.crossfade = crossfade;
            this.rms = rms;
            gain = new double[crossfade];
            for (int i = 0; i < crossfade; i++) {
                double g = 1 - LoopCrossfade.weight(i, crossfade);
                gain[i] = g * g;
            }
        }

        /**
         * Adds to {@code out} the loops from {@code start} whose length is at least {@code minLength} and whose
         * end is at most {@code last}: one candidate per whole number of periods, refined to the sample.
         */
        void from(int start, int minLength, int last, List<Candidate> out) {
            int half = Math.max(1, (int) Math.floor(period / 2));
            for (long k = Math.max(1, (long) Math.floor(minLength / period)); ; k++) {
                long centre = start + Math.round(k * period);
                if (centre - half > last) {
                    break;
                }
                int lo = (int) Math.max(start + minLength, centre - half);
                int hi = (int) Math.min(last, centre + half);
                int end = -1;
                double least = Double.POSITIVE_INFINITY;
                for (int e = lo; e <= hi; e++) {
                    double m = mismatch(start, e, least);
                    if (m < least) {
                        least = m;
                        end = e;
                    }
                }
                if (end >= 0) {
                    out.add(new Candidate(start, end, LoopCrossfade.seamLevelDb(x, start, end, crossfade, rms)));
                }
            }
        }

        /**
         * The weighted squared difference of the stretches before {@code end} and before {@code start}, given up
         * once it passes {@code bound}.
         */
        private double mismatch(int start, int end, double bound) {
            double sum = 0;
            int a = end - crossfade;
            int b = start - crossfade;
            for (int i = 0; i < crossfade && sum < bound; i++) {
                double d = x[a + i] - x[b + i];
                sum += gain[i] * d * d;
            }
            return sum;
        }
    }
}
