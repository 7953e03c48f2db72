package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.ESeries;

class FilterProposalTest {
    @Test
    void rcPairComesFromTheSeriesAndHitsTheCutoff() {
        RcProposal p = RcProposal.propose(3400, ESeries.E24, ESeries.E12);
        // Members of the IEC 60063 series.
        assertTrue(ESeries.E24.contains(p.resistorOhms()), "R " + p.resistorOhms());
        assertTrue(ESeries.E12.contains(p.capacitorFarads() * 1e12), "C " + p.capacitorFarads());
        assertEquals(1 / (2 * Math.PI * p.resistorOhms() * p.capacitorFarads()), p.achievedCutoffHz(), 1e-9);
        assertEquals(100 * (p.achievedCutoffHz() - 3400) / 3400, p.errorPercent(), 1e-9);
        // No pair from the two series (R 1k..1M, C 100p..1u) comes closer: exhaustive search.
        double best = Double.POSITIVE_INFINITY;
        for (double r : ESeries.E24.valuesBetween(1e3, 1e6)) {
            for (double c : ESeries.E12.valuesBetween(100e-12, 1e-6)) {
                best = Math.min(best, Math.abs(Math.log(1 / (2 * Math.PI * r * c) / 3400)));
            }
        }
        assertEquals(best, Math.abs(Math.log(p.achievedCutoffHz() / 3400)), 1e-12);
        assertTrue(p.resistorOhms() >= 1e3 && p.resistorOhms() <= 1e6);
    }

    @Test
    void tiesGoToTheResistorNearestTenKilohms() {
        // 1/(2π·10k·1n) = 15.915 kHz: exactly reachable with 10 k and 1 nF, or 1 k and 10 nF, or 100 k and
        // 100 pF; the 10 k choice is preferred.
        RcProposal p = RcProposal.propose(1 / (2 * Math.PI * 1e4 * 1e-9), ESeries.E24, ESeries.E6);
        assertEquals(1e4, p.resistorOhms(), 1e-6);
        assertEquals(1e-9, p.capacitorFarads(), 1e-21);
        assertEquals(0.0, p.errorPercent(), 1e-9);
    }

    @Test
    void sallenKeyPartsRealiseCutoffAndQ() {
        // Unity-gain, equal-R Sallen-Key: f0 = 1/(2πR√(C1C2)), Q = ½√(C1/C2) (Sallen & Key 1955).
        SallenKeyProposal p = SallenKeyProposal.propose(3400, Math.sqrt(0.5), ESeries.E24, ESeries.E12);
        double f0 = 1 / (2 * Math.PI * p.resistorOhms() * Math.sqrt(p.c1Farads() * p.c2Farads()));
        assertEquals(f0, p.achievedCutoffHz(), 1e-9);
        assertEquals(0.5 * Math.sqrt(p.c1Farads() / p.c2Farads()), p.achievedQ(), 1e-12);
        assertTrue(Math.abs(p.cutoffErrorPercent()) < 5, "f0 error " + p.cutoffErrorPercent());
        assertTrue(Math.abs(p.qErrorPercent()) < 5, "Q error " + p.qErrorPercent());
        assertTrue(ESeries.E12.contains(p.c1Farads() * 1e12) && ESeries.E12.contains(p.c2Farads() * 1e12));
        assertTrue(ESeries.E24.contains(p.resistorOhms()));
    }

    @Test
    void sallenKeyRejectsAQBelowOneHalf() {
        InputError e = assertThrows(InputError.class,
                () -> SallenKeyProposal.propose(3400, 0.4, ESeries.E24, ESeries.E12));
        assertEquals("a unity-gain Sallen-Key stage with equal resistors needs Q >= 0.5: 0.4; "
                + "use a first-order RC for a gentler roll-off", e.getMessage());
    }
}
