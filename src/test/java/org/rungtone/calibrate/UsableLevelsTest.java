package org.rungtone.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Optional;
import org.junit.jupiter.api.Test;

class UsableLevelsTest {
    private static UsableLevels.Problem problem(double... volts) {
        Optional<UsableLevels.Problem> p = UsableLevels.problem(volts);
        assertTrue(p.isPresent(), "expected a problem");
        return p.get();
    }

    @Test
    void acceptsARisingTableEvenWhenItIsNotMonotonic() {
        assertEquals(Optional.empty(), UsableLevels.problem(new double[] {0, 1.3, 1.2, 2.5}));
        // a buffer's offset may put code 0 a little below ground
        assertEquals(Optional.empty(), UsableLevels.problem(new double[] {-0.003, 1.6, 3.3, 5.0}));
    }

    @Test
    void refusesAFlatTable() {
        assertEquals(new UsableLevels.Problem(3, "every code has the same level, 2.5V, so there is nothing to"
                + " quantize onto; check that the readings were taken at the ladder's output"),
                problem(2.5, 2.5, 2.5, 2.5));
        assertEquals("every code's level lies within 1mV of 2.5V, so there is nothing to quantize onto; check"
                + " that the readings were taken at the ladder's output", problem(2.5, 2.5001, 2.5, 2.5002).detail());
    }

    @Test
    void refusesAFallingOrLevelTable() {
        assertEquals(new UsableLevels.Problem(3, "code 3 is 4.5V below code 0 (5V), but the levels must rise from"
                + " code 0 to code 3; were the meter's leads swapped, or the pins listed with the top bit first?"),
                problem(5, 3.5, 2, 0.5));
        assertEquals("code 3 is level with code 0 (0V), but the levels must rise from code 0 to code 3; were the"
                + " meter's leads swapped, or the pins listed with the top bit first?", problem(0, 5, 4, 0).detail());
    }

    @Test
    void refusesATableWhoseEndsAreNotItsLowAndHigh() {
        assertEquals("code 0 (0V) and code 3 (1V) span less than half of the levels' range (0V at code 0 to 5V at"
                + " code 1); code 0 and code 3 must give about the lowest and the highest level: check the pin"
                + " order and the readings", problem(0, 5, 0.5, 1).detail());
        assertEquals("code 3 is only 500µV above code 0 (0V); a ladder's levels rise by 1mV or more from code 0 to"
                + " code 3: check that the readings were taken at the ladder's output",
                problem(0, 0.0012, 0.0006, 0.0005).detail());
    }

    @Test
    void refusesImplausibleVoltages() {
        assertEquals(new UsableLevels.Problem(1, "the level of code 1, 1.00e+300 V, is not a plausible board level"
                + " (a finite voltage within 1000 V)"), problem(0, 1e300, 2, 3));
        assertEquals("the level of code 2, 1.5kV, is not a plausible board level (a finite voltage within 1000 V)",
                problem(0, 1, 1500, 3).detail());
        assertEquals(0, problem(Double.NaN, 1, 2, 3).code());
    }
}
