package org.rungtone.ladder;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.rungtone.internal.InputError;

class SpreadTest {
    @Test
    void parsesAGaussianSigmaGivenAsAPercentage() {
        assertEquals(Spread.gaussian(0.017), Spread.parseGaussian("1.7%"));
        assertEquals(Spread.gaussian(0.5), Spread.parseGaussian(" 50% "));
        assertEquals("gaussian, sigma 1.7%", Spread.parseGaussian("1.7%").describe(0.05));
    }

    @Test
    void rejectsSigmasThatAreNotPercentagesOrOutOfRange() {
        assertEquals("write it as a percentage, e.g. 1.7%",
                assertThrows(InputError.class, () -> Spread.parseGaussian("0.02")).getMessage());
        assertEquals("must be a positive value, got 0%",
                assertThrows(InputError.class, () -> Spread.parseGaussian("0%")).getMessage());
        assertEquals("must be at most 50%, got 60%",
                assertThrows(InputError.class, () -> Spread.parseGaussian("60%")).getMessage());
    }
}
