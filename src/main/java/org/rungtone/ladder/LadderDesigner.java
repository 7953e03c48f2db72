package org.rungtone.ladder;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.TreeSet;

/**
 * Proposes preferred-value resistors (IEC 60063 series) for a ladder so that the worst endpoint INL of the
 * modelled network, pins, load and buffer included, is as small as the series allows.
 *
 * <p>Method. The ideal values are those of the topology (weighted {@code base_r·2^(N−1−i)}; R-2R rungs R,
 * legs and termination 2R; custom the user's values). The naive choice takes the nearest series value to
 * each. The search tries scale factors λ that put the most significant part exactly on a series value, with
 * targets {@code λ·ideal − r̄} for legs (r̄ the mean pin resistance, which sits in series with every leg)
 * and {@code λ·ideal} for rungs and termination. From the naive choice and from the nearest values to each
 * scale's targets, a coordinate descent replaces one position at a time by a nearby series value whenever
 * the objective (worst |INL| plus a thousandth of worst |DNL|) drops. A second round does the same with
 * series and parallel pairs allowed; then every pair that does not cut the objective by at least
 * {@value #PAIR_GAIN_PERCENT} % and {@value #PAIR_MIN_GAIN_LSB} LSB against its best single replacement
 * goes back to a single part, and the paired design as a whole must beat the single-part design by the same
 * margin to be proposed. Every descent accepts only improvements and the naive choice is one start, so the
 * proposal is never worse than naive.
 *
 * <p>The work is bounded by a count of network evaluations that shrinks with 2^N (a deterministic budget,
 * not a clock), so results do not depend on machine speed.
 */
public final class LadderDesigner {
    /** A pair must cut the worst INL by at least this percentage. */
    public static final int PAIR_GAIN_PERCENT = 10;
    /** A pair must cut the worst INL by at least this many LSB. */
    public static final double PAIR_MIN_GAIN_LSB = 0.02;

    /** Scores closer than this (LSB) are a tie, which the earlier candidate wins (rounding noise). */
    private static final double TIE_LSB = 1e-9;

    private final LadderSpec spec;
    private final ESeries series;
    private final double[] ideal;
    private final double[] pinShare;
    private final double[] levels;
    private final LevelSolver.Scratch scratch;
    private final Linearity.Worst worst = new Linearity.Worst();
    private int budget;
    private int floor;

    private LadderDesigner(LadderSpec spec, ESeries series) {
        this.spec = spec;
        this.series = series;
        this.ideal = idealOhms(spec);
        this.pinShare = new double[ideal.length];
        double meanPin = 0.5 * (spec.pinROhmsHigh() + spec.pinROhmsLow());
        for (int i = 0; i < spec.bits(); i++) {
            pinShare[i] = meanPin;
        }
        this.levels = new double[1 << spec.bits()];
        this.scratch = new LevelSolver.Scratch(spec.bits());
        this.budget = (int) Math.max(600, Math.min(40000, 1.5e8 / (1 << spec.bits())));
    }

    /** Proposes values for {@code spec} from {@code series}. */
    public static DesignProposal propose(LadderSpec spec, ESeries series) {
        return new LadderDesigner(spec, series).run();
    }

    /** The ideal value of each position of the spec's parts, with perfect pins. */
    static double[] idealOhms(LadderSpec spec) {
        int bits = spec.bits();
        double[] v = new double[spec.parts().size()];
        for (int i = 0; i < bits; i++) {
            if (spec.topology() == Topology.R2R) {
                v[i] = 2 * spec.baseROhms();
            } else if (spec.topology() == Topology.CUSTOM) {
                v[i] = spec.resistors().get(i);
            } else {
                v[i] = spec.resistors().isEmpty() ? spec.baseROhms() * Math.pow(2, bits - 1 - i)
                        : spec.resistors().get(bits - 1) * Math.pow(2, bits - 1 - i);
            }
        }
        for (int i = bits; i < v.length - 1; i++) {
            v[i] = spec.baseROhms();
        }
        if (spec.topology() == Topology.R2R) {
            v[v.length - 1] = 2 * spec.baseROhms();
        }
        return v;
    }

    private DesignProposal run() {
        int n = ideal.length;
        PartChoice[] naive = new PartChoice[n];
        for (int p = 0; p < n; p++) {
            naive[p] = PartChoice.single(series.nearest(ideal[p]));
        }
        List<Double> scales = scales();
        // Single parts may use 40 % of the evaluations, pairs the rest.
        floor = budget * 6 / 10;
        PartChoice[] singles = naive.clone();
        double singlesScore = descend(singles, false);
        for (double lambda : scales) {
            if (budget <= floor) {
                break;
            }
            PartChoice[] start = starts(lambda, false);
            double score = descend(start, false);
            if (score < singlesScore - TIE_LSB) {
                singlesScore = score;
                singles = start;
            }
        }
        floor = 0;
        PartChoice[] paired = singles.clone();
        double pairedScore = descend(paired, true);
        for (double lambda : scales) {
            if (budget <= 0) {
                break;
            }
            PartChoice[] start = starts(lambda, true);
            double score = descend(start, true);
            if (score < pairedScore - TIE_LSB) {
                pairedScore = score;
                paired = start;
            }
        }
        pairedScore = dropIdlePairs(paired);
        PartChoice[] best = earns(singlesScore, pairedScore) ? paired : singles;
        return new DesignProposal(series, toList(ideal), List.of(naive), linearity(naive), List.of(best),
                linearity(best), Ladder.of(spec, ohmsOf(best)));
    }

    /** True when a score with pairs is enough below one without to pay for the extra parts. */
    private static boolean earns(double without, double with) {
        return with < without * (1 - PAIR_GAIN_PERCENT / 100.0) && with < without - PAIR_MIN_GAIN_LSB;
    }

    /** The closest single (or, with pairs, single or pair) to every target at scale λ. */
    private PartChoice[] starts(double lambda, boolean pairs) {
        PartChoice[] start = new PartChoice[ideal.length];
        for (int p = 0; p < start.length; p++) {
            double t = Math.max(1, target(p, lambda));
            start[p] = PartChoice.single(series.nearest(t));
            if (pairs) {
                for (PartChoice c : pairsNear(t)) {
                    if (Math.abs(Math.log(c.ohms() / t)) < Math.abs(Math.log(start[p].ohms() / t))) {
                        start[p] = c;
                    }
                }
            }
        }
        return start;
    }

    /** Replaces each pair by its best single where the pair does not earn its place; returns the score. */
    private double dropIdlePairs(PartChoice[] choice) {
        double[] ohms = ohmsOf(choice);
        double score = score(ohms);
        for (int p = choice.length - 1; p >= 0; p--) {
            if (choice[p].kind() == PartChoice.Kind.SINGLE) {
                continue;
            }
            double pairOhms = ohms[p];
            PartChoice bestSingle = null;
            double bestSingleScore = Double.POSITIVE_INFINITY;
            for (double v : closest(series.valuesBetween(pairOhms / 1.3, pairOhms * 1.3), pairOhms, 4)) {
                ohms[p] = v;
                double s = score(ohms);
                if (s < bestSingleScore) {
                    bestSingleScore = s;
                    bestSingle = PartChoice.single(v);
                }
            }
            if (bestSingle != null && !earns(bestSingleScore, score)) {
                choice[p] = bestSingle;
                ohms[p] = bestSingle.ohms();
                score = bestSingleScore;
            } else {
                ohms[p] = pairOhms;
            }
        }
        return score;
    }

    /** Scale factors that put the most significant leg, or the R-2R rung, on a series value. */
    private List<Double> scales() {
        int msb = spec.bits() - 1;
        TreeSet<Double> set = new TreeSet<>();
        addScales(set, msb);
        if (spec.topology() == Topology.R2R && ideal.length > spec.bits() + 1) {
            addScales(set, spec.bits());
        } else if (spec.bits() > 1) {
            addScales(set, msb - 1);
        }
        set.add((ideal[msb] + pinShare[msb]) / ideal[msb]);
        List<Double> out = new ArrayList<>(set);
        out.sort(Comparator.comparingDouble(l -> Math.abs(Math.log(l))));
        return out;
    }

    private void addScales(TreeSet<Double> set, int p) {
        for (double v : series.valuesBetween(ideal[p] / 1.25, ideal[p] * 1.25)) {
            set.add((v + pinShare[p]) / ideal[p]);
        }
    }

    private double target(int p, double lambda) {
        return lambda * ideal[p] - pinShare[p];
    }

    /**
     * Coordinate descent in place, most significant position first: each position tries nearby single
     * values (and, with {@code pairs}, pairs around its current value) and keeps any that lowers the score.
     * Returns the final score.
     */
    private double descend(PartChoice[] choice, boolean pairs) {
        double[] ohms = ohmsOf(choice);
        double score = score(ohms);
        for (int sweep = 0; sweep < 8 && budget > floor; sweep++) {
            boolean improved = false;
            for (int p = choice.length - 1; p >= 0 && budget > floor; p--) {
                double current = choice[p].ohms();
                List<PartChoice> candidates = new ArrayList<>(singlesNear(current));
                if (pairs) {
                    candidates.addAll(pairsNear(current));
                }
                for (PartChoice c : candidates) {
                    if (budget <= floor) {
                        break;
                    }
                    ohms[p] = c.ohms();
                    double s = score(ohms);
                    if (s < score - TIE_LSB) {
                        score = s;
                        choice[p] = c;
                        current = c.ohms();
                        improved = true;
                    }
                    ohms[p] = current;
                }
            }
            if (!improved) {
                break;
            }
        }
        return score;
    }

    private List<PartChoice> singlesNear(double ohms) {
        List<PartChoice> out = new ArrayList<>();
        for (double v : closest(series.valuesBetween(ohms / 1.3, ohms * 1.3), ohms, 5)) {
            if (v != ohms) {
                out.add(PartChoice.single(v));
            }
        }
        return out;
    }

    /** The best-matching pairs around the ideal-scaled value of the position's current value. */
    private List<PartChoice> pairsNear(double t) {
        List<PartChoice> all = new ArrayList<>();
        for (double a : series.valuesBetween(t / 2, t * 0.999)) {
            double rest = t - a;
            if (rest >= 1) {
                all.add(PartChoice.series(a, series.nearest(rest)));
            }
        }
        for (double a : series.valuesBetween(t * 1.001, t * 100)) {
            double other = 1 / (1 / t - 1 / a);
            if (other <= t * 100) {
                all.add(PartChoice.parallel(a, series.nearest(other)));
            }
        }
        all.sort(Comparator.comparingDouble(c -> Math.abs(Math.log(c.ohms() / t))));
        return all.subList(0, Math.min(6, all.size()));
    }

    private static double[] closest(double[] values, double t, int count) {
        double[] v = values.clone();
        Double[] boxed = new Double[v.length];
        for (int i = 0; i < v.length; i++) {
            boxed[i] = v[i];
        }
        java.util.Arrays.sort(boxed, Comparator.comparingDouble(x -> Math.abs(Math.log(x / t))));
        double[] out = new double[Math.min(count, boxed.length)];
        for (int i = 0; i < out.length; i++) {
            out[i] = boxed[i];
        }
        return out;
    }

    private double score(double[] ohms) {
        budget--;
        LevelSolver.outputVolts(spec, ohms, levels, scratch);
        worst.of(levels);
        return worst.maxAbsInl + 1e-3 * worst.maxAbsDnl;
    }

    private Linearity linearity(PartChoice[] choice) {
        return Linearity.of(Ladder.of(spec, ohmsOf(choice)).levels(), spec.idealLevels());
    }

    private static double[] ohmsOf(PartChoice[] choice) {
        double[] v = new double[choice.length];
        for (int i = 0; i < v.length; i++) {
            v[i] = choice[i].ohms();
        }
        return v;
    }

    private static List<Double> toList(double[] v) {
        List<Double> out = new ArrayList<>();
        for (double x : v) {
            out.add(x);
        }
        return out;
    }
}
