package org.rungtone.condition;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.rungtone.source.Signal;

/**
 * Going down by more than about two, the resampler halves first; the cascade must still pass the band, stop
 * what a halving stage would fold into it, and stop what lies between the new Nyquist frequency and that.
 */
class KaiserCascadeTest {
    /**
     * 8-bit target: stopband 6.02·8 + 1.76 + 12 = 62 dB, the forBits rule (6.02N + 1.76: Bennett 1948; the
     * 12 dB margin is common practice, no source).
     */
    private static final KaiserResampler EIGHT_BIT = KaiserResampler.forBits(8);

    @ParameterizedTest
    @CsvSource({"44100, 16000, 2", "44100, 8000, 3", "96000, 8000, 4", "48000, 32000, 1", "16000, 44100, 1"})
    void halvesFirstOnlyWhereItSavesWork(double fin, double fout, int stages) {
        assertEquals(stages, EIGHT_BIT.stageCount(fin, fout));
    }

    @org.junit.jupiter.api.Test
    void theReportSaysWhenItHalvesFirst() {
        assertEquals("kaiser polyphase, 62 dB stopband, halving first", EIGHT_BIT.describe(44100, 16000));
        assertEquals("kaiser polyphase, 62 dB stopband, halving 3 times first", EIGHT_BIT.describe(96000, 8000));
        assertEquals("kaiser polyphase, 62 dB stopband", EIGHT_BIT.describe(16000, 44100));
    }

    @ParameterizedTest
    @CsvSource({"44100, 16000", "44100, 8000", "48000, 11025", "96000, 8000"})
    void passesTheBand(double fin, double fout) {
        // flat to 0.9 of the new Nyquist frequency: within a tenth of a decibel
        for (double f : new double[] {200, 0.3 * fout, 0.43 * fout}) {
            Signal out = EIGHT_BIT.resample(ResamplerContractTest.tone(f, fin, 1.0), fout);
            double db = 20 * Math.log10(ResamplerContractTest.amplitudeAt(out, f) / 0.5);
            assertEquals(0, db, 0.1, f + " Hz");
        }
    }

    @ParameterizedTest
    @CsvSource({
        // just above the new Nyquist frequency: only the last stage can stop it
        "44100, 16000, 8300", "44100, 8000, 4200",
        // where a halving stage without enough stopband would fold it onto the band (r/2 - fout/2 .. r/2)
        "44100, 16000, 14500", "44100, 16000, 21000", "44100, 8000, 19000", "96000, 8000, 45000"})
    void stopsWhatWouldAlias(double fin, double fout, double hz) {
        // the tone's alias in the output; it must be at least the 62 dB stopband down (2 dB for the
        // least-squares estimate on a residual this small: common practice, no source)
        double alias = Math.abs(hz - fout * Math.rint(hz / fout));
        Signal out = EIGHT_BIT.resample(ResamplerContractTest.tone(hz, fin, 1.0), fout);
        double db = 20 * Math.log10(ResamplerContractTest.amplitudeAt(out, alias) / 0.5);
        assertTrue(db < -60, hz + " Hz leaks at " + db + " dB (alias at " + alias + " Hz)");
    }
}
