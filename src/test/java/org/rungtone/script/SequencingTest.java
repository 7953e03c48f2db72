package org.rungtone.script;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import org.rungtone.script.ast.Literals;

/** Parts placed in time: values around boundaries and total lengths; at 1 kHz sample k is at k ms. */
class SequencingTest {
    private static final double RATE = 1000;

    @Test
    void sequencePlaysPartsOneAfterAnother() {
        double[] y = Scripts.clip("sequence(1 for 200ms, 2 for 300ms, 3 for 500ms)", 1.2, RATE);
        assertEquals(1, y[0]);
        assertEquals(1, y[199]);
        assertEquals(2, y[201]);
        assertEquals(2, y[499]);
        assertEquals(3, y[501]);
        assertEquals(3, y[999]);
        assertEquals(0, y[1000]);
        assertEquals(0, y[1199]);
    }

    @Test
    void sequenceLengthIsTheSumOfItsParts() {
        // Repeating the sequence shows its length: the second copy starts at 0.2 + 0.3 = 0.5 s.
        double[] y = Scripts.clip("sequence(1 for 200ms, 2 for 300ms) repeat 2", 1.2, RATE);
        assertEquals(2, y[499]);
        assertEquals(1, y[501]);
        assertEquals(2, y[999]);
        assertEquals(0, y[1001]);
    }

    @Test
    void eachPartHasItsOwnClock() {
        double[] y = Scripts.clip("sequence(t for 100ms, t for 100ms)", 0.2, RATE);
        assertEquals(0.050, y[50], 1e-12);
        assertEquals(0.050, y[150], 1e-12);
    }

    @Test
    void atStartsAPartLater() {
        double[] y = Scripts.clip("(1 for 100ms) at 250ms + 0.5 * (t at 500ms)", 0.7, RATE);
        assertEquals(0, y[249]);
        assertEquals(1, y[251]);
        assertEquals(1, y[349]);
        assertEquals(0, y[351]);
        assertEquals(0, y[499]);
        assertEquals(0.5 * 0.1, y[600], 1e-12);
    }

    @Test
    void repeatPlaysAPartSeveralTimes() {
        double[] y = Scripts.clip("(t for 100ms) repeat 3", 0.4, RATE);
        assertEquals(0.05, y[50], 1e-12);
        assertEquals(0.05, y[150], 1e-12);
        assertEquals(0.05, y[250], 1e-12);
        assertEquals(0, y[350]);
    }

    @Test
    void everyRestartsAPartForever() {
        double[] y = Scripts.clip("t every 100ms", 2, RATE);
        assertEquals(0.05, y[150], 1e-12);
        assertEquals(0.034, y[1234], 1e-12);
    }

    @Test
    void durIsTheLengthOfTheEnclosingPart() {
        assertEquals(2.0, Scripts.clip("dur", 2, RATE)[0]);
        assertEquals(0.3, Scripts.clip("dur for 300ms", 1, RATE)[0], 1e-15);
        assertEquals(0.5, Scripts.clip("dur every 500ms", 1, RATE)[0]);
    }

    @Test
    void notesPlayTheVoiceAtEachPitchForEachLength() {
        // The voice 'pitch' outputs the current note's frequency; 'dur' its length.
        double[] y = Scripts.clip("notes(pitch, 250ms, C4, D4, (E4, 500ms), rest) repeat 2", 2.6, RATE);
        double c4 = Literals.noteHz("C4");
        assertEquals(c4, y[100], 1e-9);
        assertEquals(Literals.noteHz("D4"), y[300], 1e-9);
        assertEquals(Literals.noteHz("E4"), y[600], 1e-9);
        assertEquals(Literals.noteHz("E4"), y[999], 1e-9);
        assertEquals(0, y[1100]);                  // the rest
        assertEquals(c4, y[1300], 1e-9);           // second time round: 4 steps = 1.25 s
        assertEquals(0, y[2550]);                  // after 2 × 1.25 s
        double[] lengths = Scripts.clip("notes(dur, 250ms, C4, (E4, 500ms))", 1, RATE);
        assertEquals(0.25, lengths[100], 1e-15);
        assertEquals(0.5, lengths[600], 1e-15);
    }

    @Test
    void voiceRestartsAtEveryNote() {
        double[] y = Scripts.clip("notes(t, 100ms, A4, A4, A4)", 0.4, RATE);
        assertEquals(0.05, y[50], 1e-12);
        assertEquals(0.05, y[150], 1e-12);
        assertEquals(0.05, y[250], 1e-12);
        assertEquals(0, y[350]);
    }
}
