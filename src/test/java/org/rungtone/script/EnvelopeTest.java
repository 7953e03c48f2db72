package org.rungtone.script;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** Envelope values at segment boundaries; at 1 kHz sample k is at k milliseconds. */
class EnvelopeTest {
    private static final double RATE = 1000;

    @Test
    void adsrPassesThroughItsCorners() {
        double[] y = Scripts.clip("adsr(10ms, 20ms, 0.5, 30ms, 100ms)", 0.2, RATE);
        assertEquals(0.0, y[0], 1e-12);
        assertEquals(0.5, y[5], 1e-12);      // half way up the attack
        assertEquals(1.0, y[10], 1e-12);     // end of attack
        assertEquals(0.75, y[20], 1e-12);    // half way down the decay
        assertEquals(0.5, y[30], 1e-12);     // sustain reached
        assertEquals(0.5, y[99], 1e-12);
        assertEquals(0.5, y[100], 1e-12);    // note-off: release starts from the sustain level
        assertEquals(0.25, y[115], 1e-12);
        assertEquals(0.0, y[130], 1e-12);
        assertEquals(0.0, y[199], 1e-12);
    }

    @Test
    void adsrReleasedDuringAttackFallsFromWhereItWas() {
        double[] y = Scripts.clip("adsr(100ms, 20ms, 0.5, 40ms, 50ms)", 0.2, RATE);
        assertEquals(0.5, y[50], 1e-12);
        assertEquals(0.25, y[70], 1e-12);
        assertEquals(0.0, y[90], 1e-12);
    }

    @Test
    void adsrWithoutNoteOffEndsWithItsPart() {
        double[] y = Scripts.clip("adsr(10ms, 20ms, 0.5, 30ms) for 200ms", 0.3, RATE);
        assertEquals(0.5, y[170], 1e-12);
        assertEquals(0.25, y[185], 1e-12);
        assertEquals(0.5 / 30, y[199], 1e-12);
        assertEquals(0.0, y[200], 0);
    }

    @Test
    void exponentialDecayFollowsItsTimeConstant() {
        double[] y = Scripts.clip("decay(100ms)", 0.3, RATE);
        assertEquals(1.0, y[0], 0);
        assertEquals(Math.exp(-1), y[100], 1e-12);
        assertEquals(Math.exp(-2), y[200], 1e-12);
    }

    @Test
    void segmentsRunThroughTheirPoints() {
        double[] y = Scripts.clip("segments((0, 0), (10ms, 1), (50ms, 0.2), (100ms, 0.2), (150ms, 0))", 0.2, RATE);
        assertEquals(0.0, y[0], 1e-12);
        assertEquals(1.0, y[10], 1e-12);
        assertEquals(0.6, y[30], 1e-12);
        assertEquals(0.2, y[50], 1e-12);
        assertEquals(0.2, y[100], 1e-12);
        assertEquals(0.1, y[125], 1e-12);
        assertEquals(0.0, y[150], 1e-12);
        assertEquals(0.0, y[199], 1e-12);
    }

    @Test
    void segmentsHoldTheirEndLevelsAndStepAtEqualTimes() {
        double[] y = Scripts.clip("segments((20ms, 0.3), (40ms, 0.5), (40ms, 0.9))", 0.1, RATE);
        assertEquals(0.3, y[0], 1e-12);
        assertEquals(0.3, y[20], 1e-12);
        assertEquals(0.4, y[30], 1e-12);
        assertEquals(0.9, y[40], 1e-12);
        assertEquals(0.9, y[99], 1e-12);
    }

    @Test
    void fadeRampsInFromTheStartAndOutToTheEnd() {
        double[] y = Scripts.clip("fade(1, 10ms, 20ms)", 0.1, RATE);
        assertEquals(0.0, y[0], 1e-12);
        assertEquals(0.5, y[5], 1e-12);
        assertEquals(1.0, y[10], 1e-12);
        assertEquals(1.0, y[80], 1e-12);
        assertEquals(0.5, y[90], 1e-12);
        assertEquals(0.05, y[99], 1e-12);
    }

    @Test
    void shapingClipsSaturatesAndMixes() {
        double[] y = Scripts.clip("clip(2 * sawup(1Hz))", 1, 8);
        assertEquals(0.5, y[1], 1e-12);
        assertEquals(1.0, y[2], 1e-12);
        assertEquals(-1.0, y[4], 1e-12);
        assertEquals(0.4, Scripts.clip("clip(0.9, 0.4)", 0.01, RATE)[0], 0);
        assertEquals(-0.4, Scripts.clip("clip(-0.9, 0.4)", 0.01, RATE)[0], 0);
        assertEquals(Math.tanh(0.5), Scripts.clip("saturate(0.5)", 0.01, RATE)[0], 1e-15);
        assertEquals(Math.tanh(1.5), Scripts.clip("saturate(0.5, 3)", 0.01, RATE)[0], 1e-15);
        // mix((a, gain), b) = gain·a + b, gains in dB or plain
        assertEquals(0.5 * 0.501187 + 0.25, Scripts.clip("mix((0.5, -6dB), (1, 0.25))", 0.01, RATE)[0], 1e-6);
    }
}
