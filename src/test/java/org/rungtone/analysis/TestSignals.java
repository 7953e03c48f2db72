package org.rungtone.analysis;

import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.Signal;

/** Signals the analysis tests share. */
final class TestSignals {
    private TestSignals() {
    }

    /** {@code amplitude·sin(2π f t + phase)}. */
    static Signal sine(double amplitude, double hz, double phase, double rate, int n) {
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = amplitude * Math.sin(2 * Math.PI * hz * i / rate + phase);
        }
        return Signal.wrap(x, rate);
    }

    /** The signal quantized onto the ideal N-bit table and mapped back to full scale. */
    static Signal quantized(Signal s, int bits, Dither dither, ErrorFilter shaping, long seed) {
        LevelTable table = LevelTable.ideal(bits, 1.0);
        Quantizer q = new Quantizer(table, table.minVolts(), table.maxVolts(), dither, shaping, seed);
        Codes codes = q.apply(s).codes();
        double[] y = new double[codes.length()];
        for (int i = 0; i < y.length; i++) {
            y[i] = q.signalOf(table.volts(codes.code(i)));
        }
        return Signal.wrap(y, s.sampleRateHz());
    }

    /**
     * The amplitude of the textbook full-scale sine for an N-bit quantizer: its peaks reach the outer
     * decision thresholds, half an LSB beyond the extreme levels. Our quantizer maps [-1, 1] onto the extreme
     * levels themselves ((2^N − 1) steps), so that is 2^N/(2^N − 1) in signal units.
     */
    static double textbookFullScale(int bits) {
        return Math.pow(2, bits) / (Math.pow(2, bits) - 1);
    }

    /** A textbook full-scale 997 Hz sine at 48 kHz, 2^16 samples, through the ideal N-bit quantizer. */
    static Signal quantizedFullScaleSine(int bits) {
        return quantized(sine(textbookFullScale(bits), 997, 0.2, 48000, 1 << 16), bits, Dither.NONE,
                ErrorFilter.NONE, 1);
    }

    /**
     * Bennett's SNR of an ideal N-bit quantizer for a full-scale sine, 6.02·N + 1.76 dB (W. R. Bennett,
     * "Spectra of Quantized Signals", Bell System Technical Journal 27, 1948; Analog Devices MT-001).
     */
    static double bennettDb(int bits) {
        return 6.02 * bits + 1.76;
    }
}
