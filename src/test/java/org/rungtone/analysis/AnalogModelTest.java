package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import org.junit.jupiter.api.Test;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.Signal;

class AnalogModelTest {
    private static final double FS = 8000;
    private static final double PREVIEW = 48000;

    @Test
    void holdDroopsByThreePointNineTwoDbAtHalfTheRate() {
        // |H(f)| = |sinc(f/fs)|: -3.92 dB at fs/2 (Oppenheim & Schafer, Discrete-Time Signal Processing).
        // Measured in the rendered preview at 3990 Hz, 10 Hz short of fs/2 (sinc there: -3.90 dB).
        AnalogModel model = new AnalogModel(ReconstructionFilter.none(), PREVIEW);
        double measured = measuredGainDb(model, 3990);
        assertEquals(-3.92, measured, 0.05);
        assertEquals(AnalogModel.zohResponseDb(3990, FS), measured, 0.005);
        assertEquals(-3.92, AnalogModel.zohResponseDb(FS / 2, FS), 0.005);
        assertEquals(-3.92, model.zohDroopDb(FS), 0.005);
        assertEquals(0.0, measuredGainDb(model, 100), 0.005);
    }

    @Test
    void firstOrderFilterIsThreeDbDownAtItsCutoff() {
        // RC low-pass: |H| = 1/√2 at fc (-3.01 dB), times the hold's sinc (analytic).
        AnalogModel model = new AnalogModel(ReconstructionFilter.firstOrder(1000), PREVIEW);
        double expected = AnalogModel.zohResponseDb(1000, FS) - 10 * Math.log10(2);
        assertEquals(expected, measuredGainDb(model, 1000), 0.05);
        assertEquals(expected, model.responseDb(1000, FS), 1e-12);
        assertEquals(1000, model.passbandTopHz(FS), 0);
    }

    @Test
    void nearlyTransparentFilterStillMatchesTheAnalogResponse() {
        // A 20 kHz RC after 8 kHz codes hardly attenuates the hold images, the worst case for folding on
        // the model's fine grid; the response must still be sinc(f/fs)·|H_RC(f)| (analytic) within 0.01 dB.
        AnalogModel model = new AnalogModel(ReconstructionFilter.firstOrder(20000), PREVIEW);
        for (double hz : new double[] {500, 2000, 3900}) {
            assertEquals(model.responseDb(hz, FS), measuredGainDb(model, hz), 0.01, hz + " Hz");
        }
    }

    @Test
    void secondOrderFilterPeaksByQAtItsNaturalFrequency() {
        // ω0²/(s² + (ω0/Q)s + ω0²) has |H(jω0)| = Q (analytic).
        AnalogModel model = new AnalogModel(ReconstructionFilter.secondOrder(1500, 2.0), PREVIEW);
        double expected = AnalogModel.zohResponseDb(1500, FS) + 20 * Math.log10(2.0);
        assertEquals(expected, measuredGainDb(model, 1500), 0.05);
        // Well above f0 the roll-off is 40 dB per decade: at 3 kHz |H| = 1/|1 − 4 + j·2/2| = 1/√10.
        double atTwice = AnalogModel.zohResponseDb(3000, FS) - 10;
        assertEquals(atTwice, measuredGainDb(model, 3000), 0.05);
    }

    @Test
    void fullScaleSoundsEquallyLoudAtEveryBitDepth() {
        // The normalisation rule: the table's full span is full scale, whatever the depth or the volts.
        AnalogModel model = new AnalogModel(ReconstructionFilter.firstOrder(3400), 44100);
        double a4 = previewAmplitude(model, LevelTable.ideal(4, 5.0), 440);
        double a12 = previewAmplitude(model, LevelTable.ideal(12, 3.3), 440);
        double expected = Math.pow(10, model.responseDb(440, FS) / 20);
        assertEquals(expected, a12, 1e-3);
        assertEquals(a12, a4, 0.02);
    }

    @Test
    void constantTopCodeSettlesAtPlusOne() {
        AnalogModel model = new AnalogModel(ReconstructionFilter.none(), 44100);
        int[] c = new int[800];
        Arrays.fill(c, 15);
        AnalogModel.Preview p = model.render(Codes.of(4, FS, c), LevelTable.ideal(4, 5.0));
        assertEquals(4410, p.signal().length());
        assertEquals(44100, p.signal().sampleRateHz(), 0);
        for (int i = 1000; i < 3000; i++) {
            assertEquals(1.0, p.signal().sample(i), 1e-4);
        }
        // The step from silence rings (Gibbs) above 1: the peak reports it.
        assertTrue(p.peak() > 1.0 && p.peak() < 1.15, "peak " + p.peak());
    }

    @Test
    void unevenRateRatiosKeepToneAndHoldImage() {
        // 22.05 kHz codes to a 48 kHz preview (ratio 160/147). A 5 kHz tone comes out with the hold's
        // sinc(f/fs) and so does its image at fs − f = 17.05 kHz, which an unfiltered DAC really emits
        // (Oppenheim & Schafer): both amplitudes analytic, fitted over exactly one second.
        double fs = 22050;
        AnalogModel model = new AnalogModel(ReconstructionFilter.none(), PREVIEW);
        LevelTable table = LevelTable.ideal(16, 1);
        Codes codes = quantize(TestSignals.sine(0.5, 5000, 0, fs, (int) (1.2 * fs)), table);
        Signal out = model.render(codes, table).signal();
        double[] mid = Arrays.copyOfRange(out.unsafeSamples(), 4800, 52800);
        double tone = SineFit.fitKnownFrequency(mid, PREVIEW, 5000).amplitude();
        double image = SineFit.fitKnownFrequency(mid, PREVIEW, fs - 5000).amplitude();
        assertEquals(AnalogModel.zohResponseDb(5000, fs), 20 * Math.log10(tone / 0.5), 0.01);
        assertEquals(AnalogModel.zohResponseDb(fs - 5000, fs), 20 * Math.log10(image / 0.5), 0.05);
    }

    /** Gain in dB of a 0.5-amplitude tone through 16-bit codes and the model, by a 3-parameter fit. */
    @Test
    void parallelChunksJoinWithoutAGlitch() {
        // The preview is rendered in chunks of 2^17 output samples, each with its own filter warmed up on the
        // preceding input. A resonant filter (Q 2) remembers the most; a 1 kHz tone through it must be the
        // same steady sine across every chunk boundary: its deviation from one fitted sine near a boundary
        // may not exceed the deviation elsewhere (analytic: a linear filter maps a sine to a sine).
        double seconds = 8;
        int n = (int) (FS * seconds);
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = 0.8 * Math.sin(2 * Math.PI * 1000 * i / FS);
        }
        LevelTable table = LevelTable.ideal(16, 5.0);
        AnalogModel model = new AnalogModel(ReconstructionFilter.secondOrder(2500, 2.0), PREVIEW);
        double[] y = model.render(quantize(Signal.wrap(x, FS), table), table).signal().samples();
        int from = (int) PREVIEW;
        SineFit.Result fit = SineFit.fitKnownFrequency(Arrays.copyOfRange(y, from, y.length - from), PREVIEW, 1000);
        double worstNear = 0;
        double worstAway = 0;
        for (int i = from; i < y.length - from; i++) {
            double e = Math.abs(y[i] - fit.valueAt(i - from, PREVIEW));
            int toBoundary = Math.abs((i + (1 << 16)) % (1 << 17) - (1 << 16));
            if (toBoundary < 200) {
                worstNear = Math.max(worstNear, e);
            } else {
                worstAway = Math.max(worstAway, e);
            }
        }
        // away from boundaries only the hold images the filter lets through remain (about 2 % of full scale)
        assertTrue(worstAway < 0.05, "the fitted sine must describe the preview: " + worstAway);
        assertTrue(worstNear > 0 && worstNear <= worstAway * 1.01, worstNear + " near boundaries vs " + worstAway);
    }

    private static double measuredGainDb(AnalogModel model, double hz) {
        return 20 * Math.log10(previewAmplitude(model, LevelTable.ideal(16, 1.0), hz) / 1.0);
    }

    /**
     * Amplitude relative to the input's of a tone rendered from 1.2 s of codes, fitted over exactly the
     * middle second, where the tone and its hold image at fs − f both complete whole cycles.
     */
    private static double previewAmplitude(AnalogModel model, LevelTable table, double hz) {
        double amplitude = 0.5;
        Codes codes = quantize(TestSignals.sine(amplitude, hz, 0.3, FS, (int) (1.2 * FS)), table);
        Signal out = model.render(codes, table).signal();
        double rate = out.sampleRateHz();
        double[] mid = Arrays.copyOfRange(out.unsafeSamples(), (int) (0.1 * rate), (int) (1.1 * rate));
        return SineFit.fitKnownFrequency(mid, rate, hz).amplitude() / amplitude;
    }

    private static Codes quantize(Signal s, LevelTable table) {
        return new Quantizer(table, Dither.NONE, 1).apply(s).codes();
    }
}
