package org.rungtone.analysis;

import org.rungtone.internal.Checks;
import org.rungtone.ladder.ESeries;

/**
 * A resistor and capacitor from preferred series for a first-order RC low-pass, {@code fc = 1/(2π·R·C)}.
 *
 * <p>Search: every capacitor of the series from 100 pF to 1 µF, each with the resistor of its series
 * nearest (on a log scale) to {@code 1/(2π·fc·C)}, kept to 1 kΩ .. 1 MΩ; the pair with the smallest cutoff
 * error wins, ties going to the resistor nearest 10 kΩ (low enough for the op-amp's input, high enough for
 * its output). Preferred values per IEC 60063 ({@link ESeries}).
 *
 * @param resistorOhms R from the resistor series
 * @param capacitorFarads C from the capacitor series
 * @param achievedCutoffHz 1/(2π·R·C)
 * @param errorPercent (achieved − wanted)/wanted·100
 */
public record RcProposal(double resistorOhms, double capacitorFarads, double achievedCutoffHz,
        double errorPercent) {
    static final double MIN_R = 1e3;
    static final double MAX_R = 1e6;
    static final double MIN_C = 100e-12;
    static final double MAX_C = 1e-6;
    static final double PREFERRED_R = 10e3;

    /**
     * The best pair for {@code cutoffHz}.
     *
     * @throws org.rungtone.internal.InputError when the cutoff is not positive or no pair lies within 20 %
     */
    public static RcProposal propose(double cutoffHz, ESeries resistorSeries, ESeries capacitorSeries) {
        Checks.checkPositive(cutoffHz, "filter cutoff");
        RcProposal best = null;
        double bestScore = Double.POSITIVE_INFINITY;
        for (double c : capacitorSeries.valuesBetween(MIN_C, MAX_C)) {
            double ideal = 1 / (2 * Math.PI * cutoffHz * c);
            if (ideal < MIN_R / 1.2 || ideal > MAX_R * 1.2) {
                continue;
            }
            double r = Math.max(MIN_R, Math.min(MAX_R, resistorSeries.nearest(ideal)));
            double achieved = 1 / (2 * Math.PI * r * c);
            double score = Math.abs(Math.log(achieved / cutoffHz)) + 1e-9 * Math.abs(Math.log(r / PREFERRED_R));
            if (score < bestScore) {
                bestScore = score;
                best = new RcProposal(r, c, achieved, 100 * (achieved - cutoffHz) / cutoffHz);
            }
        }
        Checks.checkInput(best != null && Math.abs(best.errorPercent()) < 20,
                "no RC pair for a %s Hz cutoff with R in 1k .. 1M and C in 100p .. 1u; "
                        + "choose a cutoff between about 0.16 Hz and 1.6 MHz", cutoffHz);
        return best;
    }
}
