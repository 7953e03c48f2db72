package org.rungtone.quantize;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import org.junit.jupiter.api.Test;
import org.rungtone.analysis.AudioMetrics;
import org.rungtone.analysis.ShapingGain;
import org.rungtone.analysis.Spectrum;
import org.rungtone.analysis.Window;
import org.rungtone.ladder.LevelTable;
import org.rungtone.source.Signal;

class NoiseShapingTest {
    private static final double RATE = 16000;

    @Test
    void firstOrderErrorSpectrumFollowsTwoSineHalfOmegaSquared() {
        // NTF = 1 − z^−1, |NTF|² = (2·sin(ω/2))² (Gerzon & Craven, AES preprint 2822, 1989); with TPDF the
        // quantizer error is white with power LSB²/4 (Lipshitz, Wannamaker, Vanderkooy, JAES 40(5), 1992).
        // Every one of 32 equal bands from DC to rate/2 must hold that power within 1 dB.
        int bits = 8;
        LevelTable table = LevelTable.ideal(bits, 1.0);
        Quantizer q = new Quantizer(table, table.minVolts(), table.maxVolts(), Dither.TPDF,
                ErrorFilter.FIRST_ORDER, 21);
        Signal x = sine(0.6, 437, 1 << 18);
        double[] e = error(q, x);
        Spectrum s = Spectrum.welch(e, RATE, Window.HANN, 4096);
        double lsb = 2.0 / (table.size() - 1);
        double whiteRelativeToFullScale = lsb * lsb / 4 / 0.5;
        int bands = 32;
        for (int b = 0; b < bands; b++) {
            double w0 = Math.PI * b / bands;
            double w1 = Math.PI * (b + 1) / bands;
            // ∫ 4 sin²(ω/2) dω = 2(ω − sin ω); the white power spreads evenly over 0..π.
            double expected = whiteRelativeToFullScale * 2 * ((w1 - Math.sin(w1)) - (w0 - Math.sin(w0))) / Math.PI;
            double f0 = RATE / 2 * b / bands;
            double f1 = RATE / 2 * (b + 1) / bands;
            double measured = s.bandPower(f0 + s.binHz() / 2, f1 + s.binHz() / 2);
            assertEquals(0, 10 * Math.log10(measured / expected), 1.0, "band " + b);
        }
    }

    @Test
    void firstOrderShapingImprovesInBandSnrBelowAnEighthOfTheRate() {
        // In-band error below rate/8 falls by the analytic +7.0 dB of ShapingGain (Gerzon & Craven 1989).
        Signal x = sine(0.7, 300, 1 << 16);
        LevelTable table = LevelTable.ideal(6, 1.0);
        AudioMetrics m = AudioMetrics.of(x, RATE / 8);
        double flat = m.measure("flat", quantize(table, Dither.TPDF, ErrorFilter.NONE, x), table).inBandSnrDb();
        double shaped = m.measure("shaped", quantize(table, Dither.TPDF, ErrorFilter.FIRST_ORDER, x), table)
                .inBandSnrDb();
        assertTrue(shaped > flat + 5, "flat " + flat + " dB, shaped " + shaped + " dB");
        assertEquals(ShapingGain.inBandSnrGainDb(ErrorFilter.FIRST_ORDER, RATE, RATE / 8), shaped - flat, 1.0);
    }

    @Test
    void secondOrderLoopSurvivesAFullScaleSquareWithDither() {
        // Overload: a full-scale square drives the dithered second-order loop past both rails. The clamp of
        // the fed-back error to ±4 LSB bounds |output − input| by (|2| + |−1|)·4 + 1 (dither) + ½ = 13.5 LSB
        // (derived from the loop equation, no outside source), and a quiet passage afterwards must come out
        // as cleanly as when quantized on its own: no runaway, no limit cycle left over. No headroom is kept,
        // so that the loop really overloads.
        int bits = 8;
        LevelTable table = LevelTable.ideal(bits, 1.0);
        int squareLength = 1 << 14;
        int quietLength = 1 << 15;
        double[] x = new double[squareLength + quietLength];
        for (int i = 0; i < squareLength; i++) {
            x[i] = (i / 40) % 2 == 0 ? 1.0 : -1.0;
        }
        double[] quiet = sine(0.3, 523, quietLength).unsafeSamples();
        System.arraycopy(quiet, 0, x, squareLength, quietLength);
        Quantizer q = new Quantizer(table, table.minVolts(), table.maxVolts(), Dither.TPDF,
                ErrorFilter.SECOND_ORDER, 8, Quantizer.Headroom.NONE);
        Signal all = Signal.wrap(x, RATE);
        double[] e = error(q, all);
        double lsb = 2.0 / (table.size() - 1);
        double worst = 0;
        for (double v : e) {
            worst = Math.max(worst, Math.abs(v));
        }
        assertTrue(worst <= 13.5 * lsb, "largest error " + worst / lsb + " LSB");

        int settle = 64;
        double[] tail = Arrays.copyOfRange(x, squareLength + settle, x.length);
        Signal tailSignal = Signal.wrap(tail, RATE);
        Codes codes = q.apply(all).codes();
        int[] tailCodes = Arrays.copyOfRange(codes.unsafeCodes(), squareLength + settle, x.length);
        AudioMetrics m = AudioMetrics.of(tailSignal, RATE / 8);
        double afterOverload = m.measure("after", Codes.of(bits, RATE, tailCodes), table).inBandSnrDb();
        double alone = m.measure("alone", quantize(table, Dither.TPDF, ErrorFilter.SECOND_ORDER, tailSignal),
                table).inBandSnrDb();
        assertEquals(alone, afterOverload, 1.0);
        for (int c : tailCodes) {
            assertTrue(c > 0 && c < table.size() - 1, "a 0.3 amplitude passage reached a rail: code " + c);
        }
    }

    @Test
    void ditherRaisesNoisePowerByTheTheoreticalAmounts() {
        // RPDF (1 LSB p-p) adds LSB²/12: +3.01 dB; TPDF (2 LSB p-p) adds LSB²/6: +4.77 dB over the plain
        // quantizer's LSB²/12 (Lipshitz, Wannamaker, Vanderkooy, JAES 40(5), 1992), within 0.3 dB.
        Signal x = sine(0.7, 441.7, 1 << 16);
        LevelTable table = LevelTable.ideal(10, 1.0);
        AudioMetrics m = AudioMetrics.of(x, RATE / 2);
        double none = m.measure("none", quantize(table, Dither.NONE, ErrorFilter.NONE, x), table).sinadDb();
        double rpdf = m.measure("rpdf", quantize(table, Dither.RPDF, ErrorFilter.NONE, x), table).sinadDb();
        double tpdf = m.measure("tpdf", quantize(table, Dither.TPDF, ErrorFilter.NONE, x), table).sinadDb();
        assertEquals(3.01, none - rpdf, 0.3);
        assertEquals(4.77, none - tpdf, 0.3);
    }

    private static Codes quantize(LevelTable table, Dither dither, ErrorFilter filter, Signal x) {
        return new Quantizer(table, table.minVolts(), table.maxVolts(), dither, filter, 17).apply(x).codes();
    }

    /** Output minus input, in signal units. */
    private static double[] error(Quantizer q, Signal x) {
        Codes c = q.apply(x).codes();
        double[] e = new double[x.length()];
        for (int i = 0; i < e.length; i++) {
            e[i] = q.signalOf(q.table().volts(c.code(i))) - x.sample(i);
        }
        return e;
    }

    private static Signal sine(double amplitude, double hz, int n) {
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = amplitude * Math.sin(2 * Math.PI * hz * i / RATE);
        }
        return Signal.wrap(x, RATE);
    }
}
