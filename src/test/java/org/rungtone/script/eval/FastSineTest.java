package org.rungtone.script.eval;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** The polynomial sine against the correctly rounded library sine. */
class FastSineTest {
    @Test
    void matchesStrictMathSineWithinAFewUnitsInTheLastPlace() {
        double worst = 0;
        for (int i = -3_000_000; i <= 3_000_000; i++) {
            double p = i / 1_000_000.0;
            // Reference on the reduced phase, so the reference itself is not hurt by a large argument.
            double reference = StrictMath.sin(2 * Math.PI * (p - Math.rint(p)));
            worst = Math.max(worst, Math.abs(FastSine.sin2pi(p) - reference));
        }
        assertEquals(0, worst, 1e-15);
    }

    @Test
    void hitsTheQuarterCyclesExactly() {
        assertEquals(0.0, FastSine.sin2pi(0), 0);
        assertEquals(1.0, FastSine.sin2pi(0.25), 4e-16);
        assertEquals(0.0, FastSine.sin2pi(0.5), 0);
        assertEquals(-1.0, FastSine.sin2pi(0.75), 4e-16);
        assertEquals(0.0, FastSine.sin2pi(1), 0);
    }
}
