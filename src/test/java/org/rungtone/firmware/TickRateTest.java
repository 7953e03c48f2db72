package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class TickRateTest {
    @Test
    void aTimersRateIsItsClockOverItsCyclesInLowestTerms() {
        // 16 MHz / 726 cycles: gcd(16,000,000, 726) = 2
        assertEquals(new TickRate(8_000_000, 363), TickRate.ofTimer(16e6, 726));
        assertEquals(16e6 / 726, TickRate.ofTimer(16e6, 726).hz(), 1e-9);
        // a clock with a fraction of a hertz is taken to the millihertz: 7,372,800.5 Hz / 384 = 14,745,601 / 768
        assertEquals(new TickRate(14_745_601, 768), TickRate.ofTimer(7_372_800.5, 384));
        assertEquals(TickRate.ofTimer(16e6, 726), TickRate.of(TimerSolver.solve(16e6, TimerKind.AVR_TIMER1, 22050,
                1000)));
    }

    @Test
    void aRateInHertzIsExactWhenWholeElseToTheMillihertz() {
        assertEquals(new TickRate(22_050, 1), TickRate.ofHz(22050));
        assertEquals(new TickRate(22_038_567, 1000), TickRate.ofHz(22038.567));
        // the microsecond alarm averages the requested rate to the millihertz
        assertEquals(new TickRate(22_050, 1), TickRate.of(TimerSolver.solve(1e6, TimerKind.RP2040_ALARM, 22050,
                0)));
    }

    @Test
    void knowsWhenTheDdsSettersArithmeticWouldOverflow() {
        // the setter multiplies a rest below 1000 * num by den: 1000 * num * den must stay below 2^64
        assertTrue(TickRate.ofTimer(16e6, 726).fitsDdsArithmetic());
        assertTrue(new TickRate(168_000_000, 3810).fitsDdsArithmetic());
        assertFalse(new TickRate(168_000_000, 168_000_001).fitsDdsArithmetic());
    }
}
