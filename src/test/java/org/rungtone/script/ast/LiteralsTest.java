package org.rungtone.script.ast;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Unit suffixes, decibels and note names. */
class LiteralsTest {
    private static final Pos HERE = new Pos(3, 7);

    @ParameterizedTest
    @CsvSource({
        "440, 440", "440Hz, 440", "2.5kHz, 2500", "1.5MHz, 1500000", "1.2s, 1.2", "250ms, 0.25",
        "125us, 0.000125", "125\u00b5s, 0.000125", "125\u03bcs, 0.000125", "25%, 0.25", "20k, 20000",
        "1e3, 1000", "2.5e-3s, 0.0025", ".5, 0.5", "3., 3"})
    void scalesUnitSuffixesToSiUnits(String text, double expected) {
        assertEquals(expected, Literals.number(text, HERE), Math.abs(expected) * 1e-15);
    }

    @Test
    void suggestsTheUnitForAWrongLetterCase() {
        ScriptProblem p = assertThrows(ScriptProblem.class, () -> Literals.number("2khz", HERE));
        assertEquals("unknown unit 'khz' in '2khz'; did you mean 'kHz'?", p.getMessage());
        assertEquals(new Pos(3, 8), p.pos());
    }

    @Test
    void listsTheUnitsWhenNothingIsClose() {
        ScriptProblem p = assertThrows(ScriptProblem.class, () -> Literals.number("12volts", HERE));
        assertEquals("unknown unit 'volts' in '12volts'; expected one of Hz, kHz, MHz, s, ms, us, %, k or dB",
                p.getMessage());
        assertEquals(new Pos(3, 9), p.pos());
    }

    @Test
    void refusesNumbersBeyondDoubleRange() {
        ScriptProblem p = assertThrows(ScriptProblem.class, () -> Literals.number("1e999", HERE));
        assertEquals("number '1e999' is too large; expected at most about 1e308", p.getMessage());
    }

    @Test
    void convertsDecibelsToAmplitudeFactors() {
        // 20·log10(0.5) = −6.0206 dB: an amplitude ratio of one half (IEC 60027-3 level of a field quantity).
        assertEquals(0.5, Literals.dbToFactor(Literals.decibels("-6.0206dB", HERE)), 1e-5);
        assertEquals(0.1, Literals.dbToFactor(-20), 1e-15);
        assertEquals(10.0, Literals.dbToFactor(Literals.decibels("+20dB", HERE)), 1e-14);
        assertEquals(1.0, Literals.dbToFactor(0), 0);
    }

    @ParameterizedTest
    @CsvSource({
        // Equal temperament with A4 = 440 Hz (ISO 16:1975): f = 440 · 2^((m − 69)/12), m the MIDI number.
        "A4, 440.0", "A0, 27.5", "A5, 880.0", "C4, 261.6255653005986", "C#5, 554.3652619537442",
        "Db5, 554.3652619537442", "Bb3, 233.0818807590449", "B#3, 261.6255653005986",
        "Cb4, 246.94165062806206", "C8, 4186.009044809578", "E2, 82.40688922821748"})
    void givesEqualTemperedNoteFrequencies(String name, double hz) {
        assertEquals(hz, Literals.noteHz(name), hz * 1e-14);
    }

    @Test
    void middleCIsAbout261Point626Hertz() {
        assertEquals(261.626, Literals.noteHz("C4"), 0.0005);
    }
}
