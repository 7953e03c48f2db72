package org.rungtone.calibrate;

import java.util.Arrays;
import org.rungtone.internal.Setting;

/**
 * The sweep a sound card records: a start pattern, the plan's codes each held for the same time with a return
 * to code 0 before every {@value #RETURN_EVERY}th of them, and an end pattern, all on the sweep program's
 * 1 kHz tick. The patterns let a fit find the sweep in a recording
 * without knowing when it began, and their distance tells the sound card's clock against the board's.
 *
 * <p>Each pattern is 31 steps of {@value #PATTERN_TICKS} ticks, each step code 0 or the all-ones code (the
 * largest jump the board makes). A fit looks for the pattern's edges: its correlation template is the
 * sequence of jumps {@code e_j = s_j − s_{j−1}} between steps. The two sequences were designed for this
 * (a random search over balanced binary sequences, kept when better): each has 11 or 12 edges, and no shift
 * of one against itself or against the other lines up more than 3 of them with the same sign, so a peak is
 * at least 11/3 times any side peak (the aperiodic correlation of the edge sequences; the same measure as a
 * radar code's peak sidelobe level; Levanon and Mozeson, Radar Signals, 2004, ch. 6, from memory). The start
 * pattern ends on code 0, as every plan begins, so no edge is hidden at the first planned code; the end
 * pattern's first edge depends on the last planned code and is not in its template.
 */
public final class RecordingSweep {
    /** Ticks per pattern step: 20 ms at the sweep's 1 kHz tick. */
    public static final int PATTERN_TICKS = 20;
    /** The hold per code unless told otherwise: 1024 codes take 41 s. */
    public static final double DEFAULT_HOLD_SECONDS = 0.040;
    /** The shortest hold per code a recording sweep accepts. */
    public static final double MIN_HOLD_SECONDS = 0.010;
    /** The longest hold per code a recording sweep accepts. */
    public static final double MAX_HOLD_SECONDS = 1.0;
    /** Between the patterns the sweep returns to code 0 before every this many planned codes. */
    public static final int RETURN_EVERY = 16;
    private static final String START = "1000011000011110111011101100000";
    private static final String END = "1000001100011011000111011100011";

    private final int bits;
    private final int[] planCodes;
    private final int holdTicks;

    private RecordingSweep(int bits, int[] planCodes, int holdTicks) {
        this.bits = bits;
        this.planCodes = planCodes.clone();
        this.holdTicks = holdTicks;
    }

    /**
     * The recording sweep of a plan's codes, each held {@code holdSeconds} (rounded to whole ticks).
     *
     * @throws org.rungtone.internal.SettingError when the hold is outside {@value #MIN_HOLD_SECONDS} ..
     *     {@value #MAX_HOLD_SECONDS} s
     */
    public static RecordingSweep of(MeasurementPlan plan, double holdSeconds) {
        Setting.HOLD.check(holdSeconds >= MIN_HOLD_SECONDS - 1e-12 && holdSeconds <= MAX_HOLD_SECONDS + 1e-12,
                "must be 10ms .. 1s for a recording (tens of milliseconds suit a sound card): %s s", holdSeconds);
        return new RecordingSweep(plan.bits(), plan.codeArray(), (int) Math.round(holdSeconds * 1000));
    }

    /** Bit depth N. */
    public int bits() {
        return bits;
    }

    /** The plan's codes, in sweep order (a copy). */
    public int[] planCodes() {
        return planCodes.clone();
    }

    /** Ticks each planned code is held. */
    public int holdTicks() {
        return holdTicks;
    }

    /** Steps in each pattern. */
    public int patternSteps() {
        return START.length();
    }

    /** The returns to code 0 between the patterns: one before every {@value #RETURN_EVERY} planned codes. */
    public int returns() {
        return (planCodes.length - 1) / RETURN_EVERY;
    }

    /** Steps between the two patterns: the planned codes and the returns to code 0, each held the same. */
    public int middleSteps() {
        return planCodes.length + returns();
    }

    /** The step at which planned code {@code i} (in plan order) is held. */
    public int planStep(int i) {
        return patternSteps() + i + i / RETURN_EVERY;
    }

    /** Which part of the sweep step {@code step} belongs to. */
    public Part part(int step) {
        int p = patternSteps();
        if (step < p) {
            return Part.START;
        }
        if (step >= endPatternStart()) {
            return Part.END;
        }
        return (step - p + 1) % (RETURN_EVERY + 1) == 0 ? Part.RETURN : Part.PLAN;
    }

    /** The plan index of a step of {@link Part#PLAN}. */
    public int planIndex(int step) {
        int m = step - patternSteps();
        return m - (m + 1) / (RETURN_EVERY + 1);
    }

    /**
     * Every step's code: the start pattern, the plan's codes with a return to code 0 before every
     * {@value #RETURN_EVERY} of them (so that no level is more than a few steps from a visit of code 0: the
     * input passes no DC, and a level is known from the jumps that lead to it), the end pattern.
     */
    public int[] stepCodes() {
        int top = (1 << bits) - 1;
        int p = patternSteps();
        int middle = middleSteps();
        int[] out = new int[2 * p + middle];
        for (int i = 0; i < p; i++) {
            out[i] = START.charAt(i) == '1' ? top : 0;
            out[p + middle + i] = END.charAt(i) == '1' ? top : 0;
        }
        for (int i = 0; i < planCodes.length; i++) {
            out[planStep(i)] = planCodes[i];
        }
        return out;
    }

    /** Ticks step {@code i} is held. */
    public int ticksOf(int step) {
        int p = patternSteps();
        return step < p || step >= p + middleSteps() ? PATTERN_TICKS : holdTicks;
    }

    /** The tick at which each step begins, the first at 0, and one more entry: the end of the last. */
    public long[] stepStartTicks() {
        int steps = 2 * patternSteps() + middleSteps();
        long[] out = new long[steps + 1];
        for (int i = 0; i < steps; i++) {
            out[i + 1] = out[i] + ticksOf(i);
        }
        return out;
    }

    /** The whole sweep's length, seconds at the nominal tick. */
    public double durationSeconds() {
        long[] t = stepStartTicks();
        return t[t.length - 1] / 1000.0;
    }

    /** The step index where the end pattern begins. */
    public int endPatternStart() {
        return patternSteps() + middleSteps();
    }

    /** The parts of a recording sweep. */
    public enum Part {
        /** The start pattern. */
        START,
        /** A planned code. */
        PLAN,
        /** A return to code 0 between planned codes. */
        RETURN,
        /** The end pattern. */
        END;

        /** The part's name in reports. */
        public String word() {
            return name().toLowerCase(java.util.Locale.ROOT);
        }
    }

    /**
     * The edge template of a pattern: for step j of it (j ≥ 1), +1, −1 or 0 for the jump into it in units of
     * the full swing; index 0 (the jump into the pattern) is 0, as it depends on what came before.
     */
    static int[] edgeTemplate(boolean start) {
        String s = start ? START : END;
        int[] e = new int[s.length()];
        for (int j = 1; j < e.length; j++) {
            e[j] = (s.charAt(j) - '0') - (s.charAt(j - 1) - '0');
        }
        return e;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof RecordingSweep r && r.bits == bits && r.holdTicks == holdTicks
                && Arrays.equals(r.planCodes, planCodes);
    }

    @Override
    public int hashCode() {
        return Arrays.hashCode(planCodes) * 31 + holdTicks;
    }
}
