package org.rungtone.quantize;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.zip.CRC32;
import org.junit.jupiter.api.Test;
import org.rungtone.ladder.LevelTable;
import org.rungtone.source.Signal;

class QuantizerHeadroomTest {
    private static final double RATE = 16000;

    @Test
    void plainQuantizationKeepsItsCodes() {
        // CRC-32 of the codes as the quantizer made them before end codes, overload and headroom were added:
        // without shaping not one code may change.
        int n = 200_000;
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = 1.05 * Math.sin(2 * Math.PI * 997 * i / RATE) + 0.01 * Math.sin(i * 0.37);
        }
        Signal s = Signal.wrap(x, RATE);
        LevelTable uneven = LevelTable.of(4, new double[] {0, 0.11, 0.19, 0.33, 0.41, 0.52, 0.6, 0.68, 0.79,
            0.88, 0.97, 1.1, 1.18, 1.3, 1.37, 1.5}, "uneven");
        LevelTable[] tables = {LevelTable.ideal(8, 5.0), LevelTable.ideal(12, 3.3), uneven};
        String[] expected = {"65e1e11c", "50146b20", "48708bb6", "ee5694c8", "bc6eef82", "25231ac4", "34f4a34d",
            "c2074c0c", "8e866d34"};
        int k = 0;
        for (LevelTable t : tables) {
            for (Dither d : Dither.values()) {
                int[] c = new Quantizer(t, t.minVolts(), t.maxVolts(), d, ErrorFilter.NONE, 11).apply(s).codes()
                        .codes();
                CRC32 crc = new CRC32();
                for (int v : c) {
                    crc.update(v);
                    crc.update(v >> 8);
                }
                assertEquals(expected[k++], Long.toHexString(crc.getValue()), t.origin() + " " + d);
            }
        }
    }

    @Test
    void absoluteTapSumBoundsTheFeedback() {
        assertEquals(0, ErrorFilter.NONE.absoluteTapSum());
        assertEquals(1, ErrorFilter.FIRST_ORDER.absoluteTapSum());
        assertEquals(3, ErrorFilter.SECOND_ORDER.absoluteTapSum());
        assertEquals(2.5, ErrorFilter.fir(1.5, -0.5, 0.5).absoluteTapSum());
        // Σ|h|·(q/2 + d) + d on the ideal table (g = q): TPDF d = q: first order 2.5 q, second 5.5 q;
        // no dither: q/2 and 3q/2 (the loop equation bounded term by term, after Gerzon and Craven, 1989).
        LevelTable t = LevelTable.ideal(8, 1.0);
        double q = 1.0 / 256; // LevelTable.ideal: Vref·k/2^N
        assertEquals(2.5 * q, quantizer(t, Dither.TPDF, ErrorFilter.FIRST_ORDER).feedbackExcursionVolts(), 1e-15);
        assertEquals(5.5 * q, quantizer(t, Dither.TPDF, ErrorFilter.SECOND_ORDER).feedbackExcursionVolts(),
                1e-15);
        assertEquals(0.5 * q, quantizer(t, Dither.NONE, ErrorFilter.FIRST_ORDER).feedbackExcursionVolts(), 1e-15);
        assertEquals(1.5 * q, quantizer(t, Dither.NONE, ErrorFilter.SECOND_ORDER).feedbackExcursionVolts(),
                1e-15);
        assertEquals(0, quantizer(t, Dither.TPDF, ErrorFilter.NONE).feedbackExcursionVolts());
    }

    @Test
    void fullScaleSecondOrderShapingOverloadsWithoutHeadroom() {
        LevelTable t = LevelTable.ideal(8, 1.0);
        Signal s = sine(1.0, 437.3, 1 << 16);
        Quantizer.Quantized none = new Quantizer(t, t.minVolts(), t.maxVolts(), Dither.TPDF,
                ErrorFilter.SECOND_ORDER, 5, Quantizer.Headroom.NONE).apply(s);
        assertTrue(none.overloadFraction() > 0.001, "overload " + none.overloadFraction());
        assertTrue(none.endCodeFraction() > 0.05, "end codes " + none.endCodeFraction());
        assertEquals(0.0, none.headroomGainDb());
        assertFalse(none.headroomKept());
        Quantizer.Quantized kept = quantizer(t, Dither.TPDF, ErrorFilter.SECOND_ORDER).apply(s);
        assertEquals(0, kept.overloadSamples());
        // 8-bit ideal table: the overload points lie half a step past the end levels, 128 q from the middle;
        // the feedback and dither need 5.5 q of it, so the peak goes to 122.5 q instead of 127.5 q.
        assertEquals(20 * Math.log10(122.5 / 127.5), kept.headroomGainDb(), 1e-9);
        assertTrue(kept.headroomKept());
    }

    @Test
    void tooFewLevelsForTheHeadroomLeaveTheSignalAlone() {
        // 3 bits, second order, TPDF: the excursion is 5.5 steps, more than the 4 steps from the middle to
        // an overload point, so no gain can make room; the signal is left as it is and said to be so.
        LevelTable t = LevelTable.ideal(3, 1.0);
        Quantizer.Quantized r = quantizer(t, Dither.TPDF, ErrorFilter.SECOND_ORDER).apply(sine(0.5, 437.3, 4096));
        assertEquals(0.0, r.headroomGainDb());
        assertFalse(r.headroomKept());
    }

    @Test
    void worstCaseHeadroomHoldsForSquareWavesEveryFilterAndDither() {
        // The bound is a worst case, so not a single sample may overload, whatever the signal.
        double[] x = new double[1 << 15];
        for (int i = 0; i < x.length; i++) {
            x[i] = (i / 7) % 2 == 0 ? 1.0 : -1.0;
        }
        Signal square = Signal.wrap(x, RATE);
        for (int bits : new int[] {5, 8, 10}) {
            LevelTable t = LevelTable.ideal(bits, 1.0);
            for (Dither d : Dither.values()) {
                for (ErrorFilter f : new ErrorFilter[] {ErrorFilter.FIRST_ORDER, ErrorFilter.SECOND_ORDER,
                    ErrorFilter.fir(1.5, -0.6)}) {
                    Quantizer.Quantized r = quantizer(t, d, f).apply(square);
                    assertEquals(0, r.overloadSamples(), bits + " bits, " + d + ", " + f);
                    assertTrue(r.headroomKept(), bits + " bits, " + d + ", " + f);
                    // first order without dither moves the input by at most half a step: no room needed
                    boolean needsRoom = !(d == Dither.NONE && f == ErrorFilter.FIRST_ORDER);
                    assertEquals(needsRoom, r.headroomGainDb() < 0, bits + " bits, " + d + ", " + f);
                }
            }
        }
    }

    @Test
    void signalsWithRoomToSpareKeepTheirCodes() {
        // -1 dBFS at 8 bits: 113.6 q from the middle, within the 122.5 q that second-order TPDF leaves.
        LevelTable t = LevelTable.ideal(8, 1.0);
        Signal s = sine(Math.pow(10, -1 / 20.0), 437.3, 1 << 15);
        Quantizer.Quantized kept = quantizer(t, Dither.TPDF, ErrorFilter.SECOND_ORDER).apply(s);
        Quantizer.Quantized plain = new Quantizer(t, t.minVolts(), t.maxVolts(), Dither.TPDF,
                ErrorFilter.SECOND_ORDER, 5, Quantizer.Headroom.NONE).apply(s);
        assertEquals(0.0, kept.headroomGainDb());
        assertTrue(kept.headroomKept());
        assertTrue(plain.headroomKept());
        assertArrayEquals(plain.codes().codes(), kept.codes().codes());
    }

    @Test
    void countsEndCodesAndOverload() {
        // 4-bit ideal table, no dither: -1 and +1 land on codes 0 and 15 exactly (end codes, no overload);
        // 1.1 lies 0.75 q past the top level (overload: more than half a step), -1.05 lies 0.375 q below the
        // bottom one (an end code, within half a step).
        LevelTable t = LevelTable.ideal(4, 1.0);
        Signal s = Signal.of(new double[] {-1, 1, 0, 0.5, 1.1, -1.05, 0.99}, 8000);
        Quantizer.Quantized r = new Quantizer(t, Dither.NONE, 1).apply(s);
        assertEquals(5, r.endCodeSamples());
        assertEquals(1, r.overloadSamples());
        assertEquals(2, r.clippedSamples());
        assertEquals(5.0 / 7, r.endCodeFraction(), 1e-12);
    }

    private static Quantizer quantizer(LevelTable t, Dither d, ErrorFilter f) {
        return new Quantizer(t, t.minVolts(), t.maxVolts(), d, f, 5);
    }

    private static Signal sine(double amplitude, double hz, int n) {
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = amplitude * Math.sin(2 * Math.PI * hz * i / RATE);
        }
        return Signal.wrap(x, RATE);
    }
}
