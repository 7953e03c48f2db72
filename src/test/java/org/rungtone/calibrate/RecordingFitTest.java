package org.rungtone.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.List;
import java.util.OptionalInt;
import org.junit.jupiter.api.Test;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.Topology;

/** The recording fit's refusals, each one line naming the file, on short synthetic recordings. */
class RecordingFitTest {
    private static final LadderSpec SIX_BITS = LadderSpec.builder().topology(Topology.R2R).bits(6).tolerance(0.01)
            .build();
    private static final double[] LEVELS = SIX_BITS.levels().levels();
    private static final RecordingSweep SWEEP = RecordingSweep.of(MeasurementPlan.everyCode(SIX_BITS.levels()),
            0.020);

    /** A clean card: 48 kHz, 4 Hz corner, the full swing (5 V) at {@code swing} full scale, 100 ppm. */
    private static SyntheticRecording.Card card(double swing, double lead, double tail) {
        return new SyntheticRecording.Card(48_000, swing / 5, 0, 4, 100, lead, tail, RecordingCalibrationTest.NOISE_RMS,
                0, 0, false, 3);
    }

    private static String refusal(double[] y, RecordingSweep sweep) {
        return assertThrows(InputError.class, () -> RecordingFit.fit(new Recording("bench.wav", y, 48_000, 16, 1,
                1), sweep)).getMessage();
    }

    @Test
    void fitsACleanRecording() {
        RecordingResult r = RecordingFit.fit(new Recording("bench.wav", SyntheticRecording.record(SWEEP, LEVELS,
                card(0.5, 0.4, 0.3)), 48_000, 16, 1, 1), SWEEP);
        assertEquals(64, r.relativeLevels().length);
        assertEquals(1.0, r.relativeLevels()[63], 1e-12);
        assertEquals(0.0, r.relativeLevels()[0], 1e-12);
        // an R-2R ladder of 1 % parts: code 32 is half the swing within about 1 %
        assertEquals(0.5, r.relativeLevels()[32], 0.01);
    }

    @Test
    void timesThePatternEdgesWhenTheFindIsOffByTheJumpWindowsPlateau() {
        // a 14 Hz corner biases the find towards the early end of the jump windows' plateau (half a millisecond),
        // and -470 ppm moves the last pattern edge 0.3 ms further: every edge is still timed, the clocks exactly
        SyntheticRecording.Card card = new SyntheticRecording.Card(44_100, -0.045, 5e-4, 14, -470, 1.1, 0.4,
                RecordingCalibrationTest.NOISE_RMS, 60, RecordingCalibrationTest.HUM_RMS, true, 8);
        RecordingResult r = RecordingFit.fit(new Recording("bench.wav", SyntheticRecording.record(SWEEP, LEVELS,
                card), 44_100, 16, 1, 1), SWEEP);
        assertEquals(23, r.clock().edgesTimed());
        assertEquals(-470, r.clock().mismatchPpm(), 5);
        assertEquals(List.of(), r.warnings());
    }

    @Test
    void warnsOfResidualsAboveTheRecordingsOwnNoise() {
        // a 170 Hz whine at -73 dBFS rms that the model has no term for: the fit goes through and says so
        double[] y = SyntheticRecording.record(SWEEP, LEVELS, card(0.5, 0.4, 0.3));
        for (int i = 0; i < y.length; i++) {
            y[i] += 3e-4 * Math.sin(2 * Math.PI * 170 * i / 48_000.0);
        }
        RecordingResult r = RecordingFit.fit(new Recording("bench.wav", y, 48_000, 16, 1, 1), SWEEP);
        assertEquals(1, r.warnings().size(), r.warnings()::toString);
        assertTrue(r.warnings().get(0).startsWith("the fit leaves 20."), r.warnings().get(0));
    }

    @Test
    void refusesAClippedRecording() {
        double[] y = SyntheticRecording.record(SWEEP, LEVELS, card(1.3, 0.4, 0.3));
        assertEquals("bench.wav: the recording clips at 0.50 s (samples at full scale): turn the line input's level"
                + " down, or the divider's ratio up, so the sweep's full swing stays near -6 dBFS", refusal(y, SWEEP));
    }

    @Test
    void refusesARecordingTooQuietToFindOrToResolve() {
        double[] silent = SyntheticRecording.record(SWEEP, LEVELS, card(0.001, 0.4, 0.3));
        assertEquals("bench.wav: the recording is too quiet: its peak is -59.2 dBFS; turn the line input's level up"
                + " (or the divider's ratio down) so the sweep's full swing reaches about -6 dBFS",
                refusal(silent, SWEEP));
        double[] faint = SyntheticRecording.record(SWEEP, LEVELS, new SyntheticRecording.Card(48_000, 0.012 / 5, 0,
                4, 0, 0.4, 0.3, 1e-3, 0, 0, false, 3));
        assertEquals("bench.wav: the recording is too quiet for 6-bit levels: their noise is 0.29 LSB (at most 0.25);"
                + " turn the line input's level up so the full swing reaches about -6 dBFS, or hold each code longer",
                refusal(faint, SWEEP));
    }

    @Test
    void refusesARecordingShorterThanTheSweep() {
        double[] y = SyntheticRecording.record(SWEEP, LEVELS, card(0.5, 0.4, 0.3));
        assertEquals("bench.wav: the recording is 1.50 s long, shorter than the sweep of this plan (2.58 s): record"
                + " the whole sweep, from before the board starts it to after it ends",
                refusal(Arrays.copyOf(y, 72_000), SWEEP));
        double[] late = SyntheticRecording.record(SWEEP, LEVELS, card(0.5, 1.5, 0.3));
        assertEquals("bench.wav: the recording ends 1.33 s after the sweep's start, but this plan's sweep takes 2.58"
                + " s: record the whole sweep", refusal(Arrays.copyOf(late, 136_000), SWEEP));
    }

    @Test
    void refusesTheRecordingOfAnotherSweep() {
        RecordingSweep slower = RecordingSweep.of(MeasurementPlan.everyCode(SIX_BITS.levels()), 0.025);
        double[] y = SyntheticRecording.record(SWEEP, LEVELS, card(0.5, 0.4, 1.0));
        assertEquals("bench.wav: the recording is of another sweep: its codes take 1.34 s between the patterns, this"
                + " plan's 64 codes held 25 ms take 1.67 s; give the plan's options (ladder, codes, --hold) as for"
                + " 'calibrate plan'", refusal(y, slower));
        RecordingSweep fewer = RecordingSweep.of(new CodeChoice(false, OptionalInt.of(20)).plan(SIX_BITS.levels()),
                0.020);
        assertEquals("bench.wav: the recording is of another sweep: its codes take 1.34 s between the patterns, this"
                + " plan's 28 codes held 20 ms take 0.58 s; give the plan's options (ladder, codes, --hold) as for"
                + " 'calibrate plan'", refusal(y, fewer));
    }

    @Test
    void refusesARecordingWithoutItsPatterns() {
        double[] tone = new double[200_000];
        for (int i = 0; i < tone.length; i++) {
            tone[i] = 0.3 * Math.sin(2 * Math.PI * 440 * i / 48_000.0);
        }
        assertEquals("bench.wav: the recording holds no start pattern of a recording sweep: is the board's output on"
                + " the line input, running the sweep of 'calibrate plan --recording'?", refusal(tone, SWEEP));
        double[] y = SyntheticRecording.record(SWEEP, LEVELS, card(0.5, 0.4, 0.5));
        assertEquals("bench.wav: the recording has the sweep's end pattern (at 1.61 s) but not its start pattern:"
                + " start the recorder before the board starts the sweep",
                refusal(Arrays.copyOfRange(y, 36_000, y.length), SWEEP));
    }
}
