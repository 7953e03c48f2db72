package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.Signal;

class AudioMetricsTest {
    private static final double RATE = 16000;

    @ParameterizedTest
    @ValueSource(ints = {6, 8, 12, 16})
    void idealQuantizerErrorFollowsBennett(int bits) {
        // Bennett 1948 / Analog Devices MT-001: 6.02·N + 1.76 dB for a textbook full-scale sine. ENOB
        // measures the error against our full scale [-1, 1], which spans (2^N − 1) LSB rather than 2^N, so
        // the ideal quantizer reads N + log2(1 − 2^−N) bits (IEEE Std 1241-2010 form, our full scale).
        Signal ref = TestSignals.sine(TestSignals.textbookFullScale(bits), 997, 0.2, 48000, 1 << 16);
        QualityReport r = AudioMetrics.measure("ideal", ref, TestSignals.quantizedFullScaleSine(bits), 24000);
        assertEquals(TestSignals.bennettDb(bits), r.sinadDb(), 0.2);
        assertEquals(bits + Math.log(1 - Math.pow(2, -bits)) / Math.log(2), r.enobFullScaleBits(), 0.05);
        assertEquals(r.sinadDb(), r.inBandSnrDb(), 1e-9);
    }

    @Test
    void enobReSignalFallsByTheLevelBelowFullScale() {
        // The same ideal 10-bit quantizer on a sine 12.04 dB below the textbook full scale: the error stays
        // q²/12 (Bennett 1948), so ENOB re full scale (IEEE Std 1241-2010) stays N + log2(1 − 2^−N) while
        // ENOB re signal, (SINAD − 1.76)/6.02, falls by 12.04/6.02 = 2 bits.
        int bits = 10;
        Signal ref = TestSignals.sine(TestSignals.textbookFullScale(bits) / 4, 997, 0.2, 48000, 1 << 16);
        Signal out = TestSignals.quantized(ref, bits, Dither.NONE, ErrorFilter.NONE, 1);
        QualityReport r = AudioMetrics.measure("quarter", ref, out, 24000);
        double fullScale = bits + Math.log(1 - Math.pow(2, -bits)) / Math.log(2);
        assertEquals(fullScale, r.enobFullScaleBits(), 0.05);
        assertEquals(bits - 2, r.enobSignalBits(), 0.05);
        assertEquals((r.sinadDb() - 1.76) / 6.02, r.enobSignalBits(), 1e-12);
    }

    @Test
    void gainAndOffsetAreNotCountedAsNoise() {
        Signal ref = TestSignals.sine(0.5, 440, 0, RATE, 20000);
        SplittableRandom random = new SplittableRandom(11);
        double[] out = new double[ref.length()];
        double[] noise = new double[ref.length()];
        double pn = 0;
        for (int i = 0; i < out.length; i++) {
            noise[i] = 1e-3 * (random.nextDouble() - 0.5);
            pn += noise[i] * noise[i];
            out[i] = 2.5 + 0.3 * (ref.sample(i) + noise[i]);
        }
        pn /= out.length;
        QualityReport r = AudioMetrics.of(ref, RATE / 2).measure("scaled", out);
        // The noise is independent of the reference: SNR = (0.5²/2) / P_noise, analytic.
        assertEquals(10 * Math.log10(0.125 / pn), r.sinadDb(), 0.05);
        assertEquals(0.3, r.alignmentGain(), 1e-4);
        assertEquals(2.5, r.alignmentOffset(), 1e-4);
    }

    @Test
    void inBandFigureCountsOnlyTheNoiseBelowTheCutoff() {
        // White error: the share below the cutoff is cutoff/(rate/2), so in-band SNR exceeds SINAD by
        // 10·log10((rate/2)/cutoff) (analytic; the reference tone lies wholly in band).
        Signal ref = TestSignals.sine(0.9, 300, 0, RATE, 1 << 17);
        Signal out = TestSignals.quantized(ref, 8, Dither.TPDF, ErrorFilter.NONE, 5);
        QualityReport r = AudioMetrics.measure("tpdf", ref, out, 2000);
        assertEquals(10 * Math.log10(8000.0 / 2000), r.inBandSnrDb() - r.sinadDb(), 0.2);
        assertEquals(2000, r.inBandCutoffHz(), 0);
    }

    @Test
    void aWeightedFigureWeighsWhiteNoiseByTheMeanOfTheCurve() {
        // For a white error the A-weighted share is the mean of 10^(A(f)/10) over 0 .. rate/2 (IEC 61672-1
        // curve), here integrated independently by Simpson's rule.
        Signal ref = TestSignals.sine(0.9, 1000, 0, RATE, 1 << 17);
        Signal out = TestSignals.quantized(ref, 8, Dither.TPDF, ErrorFilter.NONE, 9);
        QualityReport r = AudioMetrics.measure("tpdf", ref, out, RATE / 2);
        int steps = 4000;
        double h = RATE / 2 / steps;
        double integral = 0;
        for (int i = 0; i <= steps; i++) {
            double w = i == 0 || i == steps ? 1 : i % 2 == 1 ? 4 : 2;
            integral += w * AWeighting.powerGain(i * h);
        }
        double mean = integral * h / 3 / (RATE / 2);
        assertEquals(-10 * Math.log10(mean), r.aWeightedSnrDb() - r.sinadDb(), 0.2);
    }

    @Test
    void codesThroughATableMeasureLikeTheirVolts() {
        Signal ref = TestSignals.sine(0.8, 523.25, 0.1, RATE, 8000);
        LevelTable table = LevelTable.ideal(6, 3.3);
        Codes codes = new Quantizer(table, Dither.TPDF, 3).apply(ref).codes();
        AudioMetrics m = AudioMetrics.of(ref, 3000);
        QualityReport fromCodes = m.measure("ideal", codes, table);
        QualityReport fromVolts = m.measure("ideal", Signal.wrap(AudioMetrics.volts(codes, table), RATE));
        assertEquals(fromVolts, fromCodes);
        // Volts span 0 .. 3.3·63/64 for a full scale of 2 units: gain = 3.3·63/64/2 V per unit.
        assertEquals(3.3 * 63 / 64 / 2, fromCodes.alignmentGain(), 0.01);
        // the aligned error's mean square is the error figure: 10·log10(mean(e²) / ½) dBFS
        double[] e = m.alignedError(AudioMetrics.volts(codes, table));
        double ms = 0;
        for (double v : e) {
            ms += v * v;
        }
        assertEquals(fromCodes.errorRmsDbfs(), 10 * Math.log10(ms / e.length / 0.5), 1e-9);
    }

    @Test
    void rejectsAConstantReference() {
        InputError e = assertThrows(InputError.class,
                () -> AudioMetrics.of(Signal.wrap(new double[100], RATE), 4000));
        assertEquals("the reference signal is constant, so there is no sound to measure quality against; "
                + "use a source with some signal in it", e.getMessage());
    }

    @Test
    void codesAreMeasuredExactlyAsTheirVoltsWould() {
        // The codes path computes the error on the fly; it must give the figures of the stored-volts path.
        double[] x = new double[40_000];
        for (int i = 0; i < x.length; i++) {
            x[i] = 0.7 * Math.sin(2 * Math.PI * 0.0123 * i) + 0.1 * Math.sin(2 * Math.PI * 0.31 * i);
        }
        Signal ref = Signal.wrap(x, 16000);
        double[] v = new double[64];
        for (int k = 0; k < v.length; k++) {
            v[k] = 0.05 * k + 0.0004 * k * k;
        }
        LevelTable bent = LevelTable.of(6, v, "bent");
        Codes codes = new Quantizer(LevelTable.ideal(6, 3.2), 0, 3.15, Dither.TPDF, ErrorFilter.NONE, 3)
                .apply(ref).codes();
        AudioMetrics m = AudioMetrics.of(ref, 5000);
        AudioMetrics.Measured fromCodes = m.measureWithSpectrum("codes", codes, bent);
        AudioMetrics.Measured fromVolts = m.measureWithSpectrum("volts", AudioMetrics.volts(codes, bent));
        assertEquals(fromVolts.report().sinadDb(), fromCodes.report().sinadDb(), 1e-12);
        assertEquals(fromVolts.report().inBandSnrDb(), fromCodes.report().inBandSnrDb(), 1e-12);
        assertEquals(fromVolts.report().aWeightedSnrDb(), fromCodes.report().aWeightedSnrDb(), 1e-12);
        assertArrayEquals(fromVolts.errorSpectrum().powers(), fromCodes.errorSpectrum().powers(), 1e-18);
    }
}
