package org.rungtone.calibrate;

import java.util.Arrays;
import java.util.List;

/**
 * What a recording's fit found: where the sweep is and how the clocks compare, the input's corner and hum,
 * the full swing and the noise, each planned code's level relative to code 0 (0) and the all-ones code (1)
 * with its uncertainty, each step's residual, and a trace of the recording with the fitted model for a plot.
 * Levels are relative because the input's coupling capacitor passes no DC and its gain is unknown; one
 * reading of the all-ones code scales them to volts.
 *
 * <p>A level's uncertainty: the level of step k is a running sum of the step amplitudes, so its variance
 * grows along the sweep like a random walk, {@code W_k = Σ_{m<k} (1 − ρ_m)²/d_m} in units of the noise
 * variance, and the visits of code 0 (in the patterns, and the sweep's returns to it) tie the walk down: between
 * the visits a and b around step k it is taken as a bridge,
 * {@code σ_k² = σ²·((W_k − W_a)·(W_b − W_k)/(W_b − W_a) + 1/d_k)}.
 *
 * @param recording the recording fitted
 * @param sweep the sweep it holds
 * @param clock where the sweep's ticks fall
 * @param cornerHz the input's high-pass corner
 * @param humHz the hum's fundamental, 0 when none was found
 * @param swing the all-ones code's level above code 0, full-scale units, negative for an inverting input
 * @param noiseRms the noise per sample left by the fit, full-scale units
 * @param relativeLevels each planned code's level, in plan order, relative (code 0 is 0, all ones 1)
 * @param relativeSigmas their standard deviations, relative
 * @param stepResiduals each step's rms residual of its bins, full-scale units
 * @param trace the recording and the model for a plot
 * @param warnings what deserves attention although the fit went through
 */
public record RecordingResult(Recording recording, RecordingSweep sweep, SweepClock clock, double cornerHz,
        double humHz, double swing, double noiseRms, double[] relativeLevels, double[] relativeSigmas,
        double[] stepResiduals, Trace trace, List<String> warnings) {
    /** The most points a trace keeps. */
    static final int TRACE_POINTS = 6000;

    /**
     * A recording with its fitted model, for a plot.
     *
     * @param seconds each point's time from the recording's start
     * @param recorded the recording's bin mean there
     * @param model the fitted model there
     * @param input the input staircase the model came from (the levels times the gain, offset to the recording)
     */
    public record Trace(double[] seconds, double[] recorded, double[] model, double[] input) {
        /** Copies the arrays. */
        public Trace {
            seconds = seconds.clone();
            recorded = recorded.clone();
            model = model.clone();
            input = input.clone();
        }

        @Override
        public double[] seconds() {
            return seconds.clone();
        }

        @Override
        public double[] recorded() {
            return recorded.clone();
        }

        @Override
        public double[] model() {
            return model.clone();
        }

        @Override
        public double[] input() {
            return input.clone();
        }
    }

    static RecordingResult of(Recording rec, RecordingSweep sweep, SweepClock clock, StepBins bins,
            InputModelFit.Fitted fitted, List<String> warnings) {
        StaircaseSolver.Solution s = fitted.solution();
        int[] steps = sweep.stepCodes();
        double[] g = s.levels();
        int top = (1 << sweep.bits()) - 1;
        double g0 = g[firstVisit(steps, 0)];
        double swing = g[firstVisit(steps, top)] - g0;
        double noise = s.noiseRms(bins.bins());
        double[] walk = new double[steps.length + 1];
        for (int k = 0; k < steps.length; k++) {
            walk[k + 1] = walk[k] + sq(1 - s.rho()[k]) / s.information()[k];
        }
        int[] before = new int[steps.length];
        int[] after = new int[steps.length];
        for (int k = 0, last = 0; k < steps.length; k++) {
            last = steps[k] == 0 ? k : last;
            before[k] = last;
        }
        for (int k = steps.length - 1, next = steps.length; k >= 0; k--) {
            next = steps[k] == 0 ? k : next;
            after[k] = next;
        }
        int[] plan = sweep.planCodes();
        double[] rel = new double[plan.length];
        double[] sig = new double[plan.length];
        for (int i = 0; i < plan.length; i++) {
            int k = sweep.planStep(i);
            rel[i] = (g[k] - g0) / swing;
            // the walk is tied down at the visits of code 0 on either side (the end when none follows)
            double wa = walk[k] - walk[before[k]];
            double wb = walk[after[k]] - walk[k];
            double v = (wa + wb > 0 ? wa * wb / (wa + wb) : 0) + 1 / s.information()[k];
            sig[i] = noise * Math.sqrt(v) / Math.abs(swing);
        }
        double[] stepRms = new double[steps.length];
        for (int k = 0; k < steps.length; k++) {
            double ss = 0;
            int n = 0;
            for (int b = bins.binFrom[k]; b < bins.binFrom[k + 1]; b++) {
                ss += sq(bins.mean[b] - s.model()[b]);
                n++;
            }
            stepRms[k] = n == 0 ? 0 : Math.sqrt(ss / n);
        }
        return new RecordingResult(rec, sweep, clock, fitted.cornerHz(), fitted.humHz(), swing, noise, rel, sig,
                stepRms, trace(bins, s, g), warnings);
    }

    private static int firstVisit(int[] steps, int code) {
        for (int k = 0; k < steps.length; k++) {
            if (steps[k] == code) {
                return k;
            }
        }
        throw new IllegalStateException("the sweep never visits code " + code);
    }

    private static Trace trace(StepBins bins, StaircaseSolver.Solution s, double[] g) {
        int n = bins.bins();
        int every = Math.max(1, (n + TRACE_POINTS - 1) / TRACE_POINTS);
        int points = (n + every - 1) / every;
        double[] t = new double[points];
        double[] rec = new double[points];
        double[] model = new double[points];
        double[] input = new double[points];
        // the staircase drawn through the model's mean, so that both fit one axis
        double meanModel = Arrays.stream(s.model()).average().orElse(0);
        double meanLevel = 0;
        for (int k = 0; k < bins.steps; k++) {
            meanLevel += g[k] * (bins.binFrom[k + 1] - bins.binFrom[k]);
        }
        meanLevel /= Math.max(1, n);
        int k = 0;
        for (int i = 0; i < points; i++) {
            int b = i * every;
            while (bins.binFrom[k + 1] <= b) {
                k++;
            }
            t[i] = bins.centre(b) / bins.rateHz;
            rec[i] = bins.mean[b];
            model[i] = s.model()[b];
            input[i] = g[k] - meanLevel + meanModel;
        }
        return new Trace(t, rec, model, input);
    }

    private static double sq(double x) {
        return x * x;
    }

    /** Copies the arrays. */
    public RecordingResult {
        warnings = List.copyOf(warnings);
        relativeLevels = relativeLevels.clone();
        relativeSigmas = relativeSigmas.clone();
        stepResiduals = stepResiduals.clone();
    }

    @Override
    public double[] relativeLevels() {
        return relativeLevels.clone();
    }

    @Override
    public double[] relativeSigmas() {
        return relativeSigmas.clone();
    }

    @Override
    public double[] stepResiduals() {
        return stepResiduals.clone();
    }

    /** The median of the planned codes' level uncertainties, full-scale units. */
    public double medianLevelSigma() {
        double[] s = relativeSigmas.clone();
        Arrays.sort(s);
        return s.length == 0 ? 0 : s[s.length / 2] * Math.abs(swing);
    }

    /** The input's polarity: true when the recording rises as the board's output does. */
    public boolean upright() {
        return swing > 0;
    }
}
