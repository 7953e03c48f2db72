package org.rungtone.analysis;

import org.rungtone.internal.Checks;
import org.rungtone.ladder.ESeries;

/**
 * Parts for a unity-gain Sallen-Key second-order low-pass with equal resistors R1 = R2 = R, C1 from the
 * junction of the resistors to the output and C2 from the amplifier input to ground:
 * {@code f0 = 1/(2π·R·√(C1·C2))}, {@code Q = ½·√(C1/C2)}, so {@code C1/C2 = 4Q²} and Q ≥ ½ (R. P. Sallen,
 * E. L. Key, "A Practical Method of Designing RC Active Filters", IRE Trans. Circuit Theory 2(1), 1955).
 *
 * <p>Search: every C2 of the capacitor series from 100 pF to 1 µF, C1 the series value nearest 4Q²·C2, R
 * the series value nearest {@code 1/(2π·f0·√(C1·C2))} within 1 kΩ .. 1 MΩ; the smallest sum of the log
 * errors in f0 and Q wins, ties going to R nearest 10 kΩ.
 *
 * @param resistorOhms R1 = R2
 * @param c1Farads feedback capacitor (to the output)
 * @param c2Farads capacitor to ground
 * @param achievedCutoffHz f0 of the chosen parts
 * @param achievedQ Q of the chosen parts
 * @param cutoffErrorPercent f0 error in per cent
 * @param qErrorPercent Q error in per cent
 */
public record SallenKeyProposal(double resistorOhms, double c1Farads, double c2Farads, double achievedCutoffHz,
        double achievedQ, double cutoffErrorPercent, double qErrorPercent) {

    /**
     * The best parts for natural frequency {@code cutoffHz} and quality factor {@code q}.
     *
     * @throws org.rungtone.internal.InputError when Q &lt; ½ (not reachable with equal resistors and unity
     *     gain), the cutoff is not positive, or no parts lie within 20 %
     */
    public static SallenKeyProposal propose(double cutoffHz, double q, ESeries resistorSeries,
            ESeries capacitorSeries) {
        Checks.checkPositive(cutoffHz, "filter cutoff");
        Checks.checkInput(q >= 0.5, "a unity-gain Sallen-Key stage with equal resistors needs Q >= 0.5: %s; "
                + "use a first-order RC for a gentler roll-off", q);
        SallenKeyProposal best = null;
        double bestScore = Double.POSITIVE_INFINITY;
        for (double c2 : capacitorSeries.valuesBetween(RcProposal.MIN_C, RcProposal.MAX_C)) {
            double c1 = capacitorSeries.nearest(4 * q * q * c2);
            if (c1 > RcProposal.MAX_C * 1.01) {
                continue;
            }
            double ideal = 1 / (2 * Math.PI * cutoffHz * Math.sqrt(c1 * c2));
            if (ideal < RcProposal.MIN_R / 1.2 || ideal > RcProposal.MAX_R * 1.2) {
                continue;
            }
            double r = Math.max(RcProposal.MIN_R, Math.min(RcProposal.MAX_R, resistorSeries.nearest(ideal)));
            double f0 = 1 / (2 * Math.PI * r * Math.sqrt(c1 * c2));
            double qa = 0.5 * Math.sqrt(c1 / c2);
            double score = Math.abs(Math.log(f0 / cutoffHz)) + Math.abs(Math.log(qa / q))
                    + 1e-9 * Math.abs(Math.log(r / RcProposal.PREFERRED_R));
            if (score < bestScore) {
                bestScore = score;
                best = new SallenKeyProposal(r, c1, c2, f0, qa, 100 * (f0 - cutoffHz) / cutoffHz,
                        100 * (qa - q) / q);
            }
        }
        Checks.checkInput(best != null && Math.abs(best.cutoffErrorPercent()) < 20
                        && Math.abs(best.qErrorPercent()) < 20,
                "no Sallen-Key parts for %s Hz, Q %s with R in 1k .. 1M and C in 100p .. 1u", cutoffHz, q);
        return best;
    }
}
