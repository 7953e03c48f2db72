package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.rungtone.condition.Conditioner;
import org.rungtone.condition.Conditioning;
import org.rungtone.condition.KaiserResampler;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.SampleSource;
import org.rungtone.source.Signal;

class ListenerMetricsTest {
    private static final double SOURCE_RATE = 44_100;
    private static final double PREVIEW = 44_100;
    private static final double LOW_HZ = 1000.3;
    private static final double HIGH_HZ = 6000.7;
    /** The treble tone's amplitude relative to the low one: −12 dB. */
    private static final double HIGH = Math.pow(10, -12 / 20.0);

    /** 0.5·(sin 1 kHz + (−12 dB)·sin 6 kHz), 2 s at 44.1 kHz. */
    private static Signal twoTones() {
        int n = (int) (2 * SOURCE_RATE);
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            double t = i / SOURCE_RATE;
            x[i] = 0.5 * (Math.sin(2 * Math.PI * LOW_HZ * t) + HIGH * Math.sin(2 * Math.PI * HIGH_HZ * t + 0.4));
        }
        return Signal.wrap(x, SOURCE_RATE);
    }

    private static ListenerMetrics prepared(Signal source) {
        return ListenerMetrics.prepare(SampleSource.of(source), ListenerMetrics.Span.all(source.length()),
                new AnalogModel(ReconstructionFilter.none(), PREVIEW));
    }

    @Test
    void noiseAddedToADelayedScaledCopyIsAllThatCounts() {
        // The output is the source delayed by 3.37 samples, scaled by 0.7, plus white noise: gain and delay
        // are not errors, so the SNR is the source's power over the noise's share of 20 Hz .. 20 kHz
        // (white noise spreads evenly over 0 .. 22.05 kHz), and the A-weighted figure weights that noise
        // by A(f) (IEC 61672-1, integrated over the band).
        Signal source = twoTones();
        int n = source.length();
        double noiseRms = 1e-3;
        SplittableRandom random = new SplittableRandom(4);
        double[] delayed = new FractionalDelay(3.37, SOURCE_RATE, 20_000, 120).apply(source.unsafeSamples(), n);
        double[] out = new double[n];
        for (int i = 0; i < n; i++) {
            out[i] = 0.7 * delayed[i] + 0.7 * noiseRms * Math.sqrt(12) * (random.nextDouble() - 0.5);
        }
        ListenerReport r = prepared(source).measure(Signal.wrap(out, PREVIEW));
        double signal = 0.25 * (1 + HIGH * HIGH) / 2;
        double inBand = (20_000 - 20) / (SOURCE_RATE / 2);
        assertEquals(10 * Math.log10(signal / (noiseRms * noiseRms * inBand)), r.snrDb(), 0.2);
        double weighted = 0;
        int steps = 20_000;
        for (int k = 0; k < steps; k++) {
            double f = 20 + (k + 0.5) * (20_000 - 20) / steps;
            weighted += AWeighting.powerGain(f) / steps;
        }
        assertEquals(10 * Math.log10(signal / (noiseRms * noiseRms * inBand * weighted)), r.aWeightedSnrDb(), 0.2);
        assertEquals(3.37 / SOURCE_RATE, r.delaySeconds(), 0.01 / SOURCE_RATE);
        assertEquals(20, r.bandLowHz());
        assertEquals(20_000, r.bandTopHz());
        assertEquals(2.0, r.analysedSeconds(), 1e-9);
    }

    @Test
    void aDelayedCopyMeasuresFarBeyondSixteenBits() {
        // Without noise only the method's own floor is left: the delay found to a small fraction of a
        // sample and undone by the band-limited delay, so nothing of the copy reads as error.
        Signal source = twoTones();
        double[] out = new FractionalDelay(-1.61, SOURCE_RATE, 20_000, 120).apply(source.unsafeSamples(),
                source.length());
        ListenerReport r = prepared(source).measure(Signal.wrap(out, PREVIEW));
        assertTrue(r.snrDb() > 100, "floor " + r.snrDb());
        assertEquals(-1.61 / SOURCE_RATE, r.delaySeconds(), 0.002 / SOURCE_RATE);
    }

    @Test
    void treblePastHalfTheRateIsLostAndImagesAreHeard() {
        // The same two tones conditioned to 8, 16 and 22.05 kHz, 8-bit TPDF, played through the hold with no
        // filter. The hold's response is sinc(f/fs) at f and at its images m·fs ± f (Oppenheim & Schafer,
        // Discrete-Time Signal Processing); at 8 kHz the 6 kHz tone is gone before quantizing (the
        // anti-alias filter), at 16 and 22.05 kHz its images at 10 and 16.05 kHz are heard. With one gain g
        // for both tones the listener SNR is g²·ΣP/ΣE (see ListenerMetrics), computed here from those
        // responses: 9.7, 16.2 and 21.3 dB; the 8-bit noise (about -39 dB here) hardly adds. The
        // quantization-only SINAD, against the source at the target rate, stays alike and cannot see any of it.
        Signal source = twoTones();
        ListenerMetrics listener = prepared(source);
        double[] rates = {8000, 16000, 22050};
        double[] listened = new double[rates.length];
        double[] sinad = new double[rates.length];
        for (int i = 0; i < rates.length; i++) {
            Signal ref = new Conditioner(KaiserResampler.forBits(8)).apply(source, new Conditioning(false,
                    java.util.OptionalDouble.empty(), rates[i], java.util.OptionalDouble.empty(),
                    java.util.OptionalDouble.empty(), 0, 0)).signal();
            LevelTable table = LevelTable.ideal(8, 1.0);
            Codes codes = new Quantizer(table, Dither.TPDF, 9).apply(ref).codes();
            listened[i] = listener.measure(codes, table).snrDb();
            sinad[i] = AudioMetrics.measure("q", ref, Signal.wrap(AudioMetrics.volts(codes, table), rates[i]),
                    rates[i] / 2).sinadDb();
            assertEquals(expectedListenerSnrDb(rates[i]), listened[i], 0.5, "rate " + rates[i]);
        }
        assertTrue(listened[0] < listened[1] && listened[1] < listened[2], java.util.Arrays.toString(listened));
        for (double s : sinad) {
            assertEquals(sinad[2], s, 0.5, java.util.Arrays.toString(sinad));
        }
    }

    /** g²·ΣP/ΣE for the two tones through a hold at {@code fs}, images up to 20 kHz counted. */
    private static double expectedListenerSnrDb(double fs) {
        double[] f = {LOW_HZ, HIGH_HZ};
        double[] p = {1, HIGH * HIGH};
        double sumP = 0;
        double sumS = 0;
        double images = 0;
        double[] h = new double[2];
        for (int k = 0; k < 2; k++) {
            sumP += p[k];
            boolean kept = f[k] < fs / 2;
            h[k] = kept ? sinc(f[k] / fs) : 0;
            sumS += h[k] * p[k];
            for (int m = 1; kept && m * fs - f[k] <= 20_000; m++) {
                for (double image : new double[] {m * fs - f[k], m * fs + f[k]}) {
                    if (image <= 20_000) {
                        images += p[k] * Math.pow(sinc(image / fs), 2);
                    }
                }
            }
        }
        double g = sumS / sumP;
        double error = images;
        for (int k = 0; k < 2; k++) {
            error += Math.pow(h[k] - g, 2) * p[k];
        }
        return 10 * Math.log10(g * g * sumP / error);
    }

    private static double sinc(double x) {
        return Math.sin(Math.PI * x) / (Math.PI * x);
    }
}
