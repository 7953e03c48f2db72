package org.rungtone.codec;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import java.util.stream.IntStream;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.Signal;

class TreadEncoderTest {
    private static final double RATE = 16_000;

    /** Decaying partials over a slow random walk: something between a chime and speech. */
    static Signal material(long seed, int samples) {
        SplittableRandom r = new SplittableRandom(seed);
        double[] f = {r.nextDouble(100, 600), r.nextDouble(600, 2000), r.nextDouble(2000, 5000)};
        double[] x = new double[samples];
        double walk = 0;
        for (int i = 0; i < samples; i++) {
            double t = i / RATE;
            walk = 0.995 * walk + 0.01 * (r.nextDouble() - 0.5);
            x[i] = Math.exp(-2 * t) * (0.5 * Math.sin(2 * Math.PI * f[0] * t) + 0.2 * Math.sin(2 * Math.PI * f[1] * t)
                    + 0.05 * Math.sin(2 * Math.PI * f[2] * t)) + walk;
        }
        return Signal.of(x, RATE);
    }

    /** Sum of squared differences between the decoded levels and the quantizer's targets. */
    static double squaredError(TreadEncoder.Encoded e, Quantizer q, Signal s) {
        int[] c = e.quantized().codes().unsafeCodes();
        double sum = 0;
        for (int i = 0; i < c.length; i++) {
            double d = q.table().volts(c[i]) - q.targetVolts(s.unsafeSamples()[i]);
            sum += d * d;
        }
        return sum;
    }

    static double snrDb(TreadEncoder.Encoded e, Quantizer q, Signal s) {
        double signal = 0;
        for (double v : s.unsafeSamples()) {
            double d = q.targetVolts(v) - q.targetVolts(0);
            signal += d * d;
        }
        return 10 * Math.log10(signal / squaredError(e, q, s));
    }

    static Stream<Object[]> cases() {
        return IntStream.range(0, 12).mapToObj(i -> new Object[] {TreadFormat.values()[i % 3], 6 + i % 5,
            (long) i});
    }

    /** Delayed-decision coding never ends worse than the greedy coder (docs/tread.md; CHECKS.md). */
    @ParameterizedTest(name = "{0} to {1} bits, seed {2}")
    @MethodSource("cases")
    void searchNeverDoesWorseThanTheGreedyCoder(TreadFormat f, int bits, long seed) {
        Signal s = material(seed, 4000);
        Quantizer q = new Quantizer(LevelTable.ideal(bits, 5), Dither.NONE, seed);
        TreadEncoder encoder = new TreadEncoder(f, q, Weighting.flat());
        double searched = squaredError(encoder.encode(s), q, s);
        double greedy = squaredError(encoder.withSearch(1, 1).encode(s), q, s);
        assertTrue(searched <= greedy * (1 + 1e-12), searched + " > " + greedy);
    }

    @Test
    void searchingBeatsTheGreedyCoderOnMusicLikeMaterial() {
        Signal s = material(7, 16_000);
        Quantizer q = new Quantizer(LevelTable.ideal(8, 5), Dither.NONE, 7);
        TreadEncoder encoder = new TreadEncoder(TreadFormat.TREAD3, q, Weighting.flat());
        double gainDb = snrDb(encoder.encode(s), q, s) - snrDb(encoder.withSearch(1, 1).encode(s), q, s);
        assertTrue(gainDb > 1, "search gain " + gainDb + " dB");
    }

    @Test
    void decodedCodesAreTheReferenceDecodersOutput() {
        Signal s = material(3, 3000);
        Quantizer q = new Quantizer(LevelTable.ideal(10, 5), Dither.TPDF, 3);
        TreadEncoder.Encoded e = new TreadEncoder(TreadFormat.TREAD4, q, Weighting.aWeighted(RATE, RATE / 2))
                .encode(s);
        TreadStream stream = e.stream();
        assertArrayEquals(new TreadDecoder(TreadFormat.TREAD4, 10).decode(stream.start(), stream.codes()),
                e.quantized().codes().codes());
        assertEquals(3000, stream.length());
        assertEquals(RATE, e.quantized().codes().sampleRateHz());
    }

    @Test
    void moreBitsPerSampleFollowTheTargetCloser() {
        Signal s = material(11, 8000);
        Quantizer q = new Quantizer(LevelTable.ideal(10, 5), Dither.NONE, 1);
        double two = snrDb(new TreadEncoder(TreadFormat.TREAD2, q, Weighting.flat()).encode(s), q, s);
        double three = snrDb(new TreadEncoder(TreadFormat.TREAD3, q, Weighting.flat()).encode(s), q, s);
        double four = snrDb(new TreadEncoder(TreadFormat.TREAD4, q, Weighting.flat()).encode(s), q, s);
        assertTrue(two + 3 < three && three + 3 < four, two + " / " + three + " / " + four + " dB");
        assertTrue(four > 35, "tread4 to 10 bits: " + four + " dB");
    }

    @Test
    void sameSeedSameStreamAndTheDitherFollowsTheSeed() {
        Signal s = material(5, 2000);
        LevelTable t = LevelTable.ideal(8, 5);
        TreadStream a = new TreadEncoder(TreadFormat.TREAD3, new Quantizer(t, Dither.TPDF, 9), Weighting.flat())
                .encode(s).stream();
        TreadStream b = new TreadEncoder(TreadFormat.TREAD3, new Quantizer(t, Dither.TPDF, 9), Weighting.flat())
                .encode(s).stream();
        TreadStream c = new TreadEncoder(TreadFormat.TREAD3, new Quantizer(t, Dither.TPDF, 10), Weighting.flat())
                .encode(s).stream();
        assertEquals(a, b);
        assertNotEquals(a, c);
    }

    @Test
    void compensationFollowsTheBoardsRealLevels() {
        // a ladder whose levels wander by up to 1.5 average steps: encoding onto them beats encoding onto the
        // ideal ladder and playing those codes on the board
        SplittableRandom r = new SplittableRandom(4);
        double[] volts = new double[256];
        for (int c = 0; c < volts.length; c++) {
            volts[c] = 5.0 * c / 255 + 1.5 * 5.0 / 255 * (r.nextDouble() * 2 - 1);
        }
        LevelTable board = LevelTable.of(8, volts, "test board");
        LevelTable ideal = LevelTable.ideal(8, 5);
        Signal s = material(2, 8000);
        Quantizer onBoard = new Quantizer(board, board.minVolts(), board.maxVolts(), Dither.NONE, ErrorFilter.NONE,
                1);
        Quantizer onIdeal = new Quantizer(ideal, board.minVolts(), board.maxVolts(), Dither.NONE, ErrorFilter.NONE,
                1);
        TreadEncoder.Encoded compensated = new TreadEncoder(TreadFormat.TREAD4, onBoard, Weighting.flat()).encode(s);
        TreadEncoder.Encoded plain = new TreadEncoder(TreadFormat.TREAD4, onIdeal, Weighting.flat()).encode(s);
        // both played on the board, against the same targets
        double comp = squaredError(compensated, onBoard, s);
        double uncompensated = squaredError(plain, onBoard, s);
        assertTrue(comp < 0.8 * uncompensated, comp + " vs " + uncompensated);
    }

    @Test
    void noiseShapingWorksThroughTheDecodedLevels() {
        // first-order error feedback (Gerzon and Craven, AES preprint 2822, 1989) moves error from low
        // frequencies to high ones: the error's low-passed power falls
        Signal s = material(6, 16_000);
        LevelTable t = LevelTable.ideal(10, 5);
        Quantizer flat = new Quantizer(t, t.minVolts(), t.maxVolts(), Dither.NONE, ErrorFilter.NONE, 1);
        Quantizer shaped = new Quantizer(t, t.minVolts(), t.maxVolts(), Dither.NONE, ErrorFilter.FIRST_ORDER, 1);
        double plainLow = lowBandError(new TreadEncoder(TreadFormat.TREAD4, flat, Weighting.flat()).encode(s), flat,
                s);
        double shapedLow = lowBandError(new TreadEncoder(TreadFormat.TREAD4, shaped, Weighting.flat()).encode(s),
                flat, s);
        assertTrue(shapedLow < plainLow, shapedLow + " vs " + plainLow);
    }

    /** Power of the error through a 32-sample moving average (its band up to about rate/64). */
    private static double lowBandError(TreadEncoder.Encoded e, Quantizer q, Signal s) {
        int[] c = e.quantized().codes().unsafeCodes();
        double[] err = new double[c.length];
        for (int i = 0; i < c.length; i++) {
            err[i] = q.table().volts(c[i]) - q.targetVolts(s.unsafeSamples()[i]);
        }
        double sum = 0;
        for (int i = 32; i < c.length; i++) {
            double m = 0;
            for (int k = 0; k < 32; k++) {
                m += err[i - k];
            }
            sum += (m / 32) * (m / 32);
        }
        return sum;
    }
}
