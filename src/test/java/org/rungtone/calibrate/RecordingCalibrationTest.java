package org.rungtone.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.time.LocalDate;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;
import org.rungtone.ladder.Spread;
import org.rungtone.ladder.Topology;
import org.rungtone.source.Signal;

/**
 * Boards calibrated from synthetic sound-card recordings of the recording sweep (boards and cards drawn at
 * random; the fit is told neither). The card: a line input's coupling corner drawn log-uniformly over 1..20 Hz,
 * a gain that puts the full swing at −10..−4 dBFS with either polarity, the board's clock ±300 ppm off the
 * card's, mains hum at 50 or 60 Hz (a little off) at −60 dBFS with two harmonics, and white noise at −85 dBFS
 * rms. The noise: consumer codecs specify their line input's dynamic range at about 90 dB, A-weighted; an
 * unweighted white floor a few dB above that is common practice, no source. The hum: a ground loop between a
 * PC and a bench supply, common practice, no source.
 */
class RecordingCalibrationTest {
    static final LadderSpec TEN_BIT_WEIGHTED = LadderSpec.builder().topology(Topology.WEIGHTED).bits(10)
            .tolerance(0.05).build();
    static final double NOISE_RMS = Math.pow(10, -85 / 20.0);
    static final double HUM_RMS = Math.pow(10, -60 / 20.0);

    /** A card drawn from {@code random}: the parameters of the class comment. */
    static SyntheticRecording.Card card(SplittableRandom random, double rateHz, boolean filtered) {
        double corner = Math.exp(random.nextDouble(Math.log(1), Math.log(20)));
        double swing = Math.pow(10, random.nextDouble(-10, -4) / 20);
        double gain = (random.nextBoolean() ? 1 : -1) * swing / 5.0;
        double ppm = random.nextDouble(-300, 300);
        double hum = (random.nextBoolean() ? 50 : 60) + random.nextDouble(-0.05, 0.05);
        return new SyntheticRecording.Card(rateHz, gain, random.nextDouble(-0.002, 0.002), corner, ppm,
                random.nextDouble(0.3, 1.5), random.nextDouble(0.2, 1.0), NOISE_RMS, hum, HUM_RMS, filtered,
                random.nextLong());
    }

    static RecordingCalibration.Request request(LadderSpec ladder, double holdSeconds) {
        return new RecordingCalibration.Request(Path.of("bench.wav"), ladder, new CodeChoice(false,
                OptionalInt.empty()), holdSeconds, Optional.of("bench"), LocalDate.of(2026, 5, 1),
                OptionalDouble.empty());
    }

    @Test
    void tenBitWeightedLadderFromAMinuteOfRecordingKeepsEnobNearExactKnowledge() {
        RecordingCalibration.Request request = request(TEN_BIT_WEIGHTED, 0.040);
        RecordingSweep sweep = RecordingCalibration.sweep(request);
        assertTrue(sweep.durationSeconds() <= 60, "the sweep takes " + sweep.durationSeconds() + " s");
        Signal sine = CompensationTest.sine(8192, 1021);
        int boards = 11;
        double[] exact = new double[boards];
        double[] calibrated = new double[boards];
        SplittableRandom random = new SplittableRandom(2026);
        for (int b = 0; b < boards; b++) {
            SimulatedBoard board = SimulatedBoard.draw(TEN_BIT_WEIGHTED, Spread.uniform(), 7000 + b);
            double[] truth = board.levels().levels();
            SyntheticRecording.Card card = card(random, b % 2 == 0 ? 48_000 : 44_100, true);
            double[] y = SyntheticRecording.record(sweep, truth, card);
            RecordingCalibration.Result r = RecordingCalibration.fit(new Recording("bench.wav", y, card.rateHz(),
                    16, 1, 1), sweep, request);
            LevelTable fitted = r.profile().levels();
            exact[b] = CompensationTest.enob(CompensationTest.sinadDb(sine, CompensationTest.nearest(board.levels(),
                    sine), truth));
            calibrated[b] = CompensationTest.enob(CompensationTest.sinadDb(sine, CompensationTest.nearest(fitted,
                    sine), truth));
        }
        double loss = CompensationTest.median(exact) - CompensationTest.median(calibrated);
        System.out.printf(Locale.ROOT, "[calibrate] 10-bit weighted, 5%%, %.1f s recordings: median ENOB exact %.3f,"
                + " calibrated %.3f, loss %.3f bit%n", sweep.durationSeconds(), CompensationTest.median(exact),
                CompensationTest.median(calibrated), loss);
        assertTrue(loss <= 0.05, "median ENOB loss " + loss + " bit");
    }

    @Test
    void refusesTheRecordingOfOneCodeMoreWhoseStepsDoNotFitThePlan() {
        LadderSpec ladder = LadderSpec.builder().topology(Topology.R2R).bits(8).tolerance(0.01).build();
        RecordingSweep every = RecordingSweep.of(MeasurementPlan.everyCode(ladder.levels()), 0.020);
        // the basis and 245 checks: one code fewer; the patterns' distance differs by 20 ms in 5.74 s, within
        // what the clocks may stretch, so only the steps tell
        RecordingSweep checks = RecordingSweep.of(MeasurementPlan.of(ladder.levels(), 245), 0.020);
        assertEquals(every.durationSeconds() - 0.020, checks.durationSeconds(), 1e-12);
        double[] y = SyntheticRecording.record(every, ladder.levels().levels(), SyntheticRecording.card(48_000, 0.5,
                NOISE_RMS, 0.4, 0.3));
        InputError e = assertThrows(InputError.class, () -> RecordingCalibration.fit(new Recording("bench.wav", y,
                48_000, 16, 1, 1), checks, request(ladder, 0.020)));
        assertEquals("bench.wav: the recording does not fit this plan's 255 codes held 20 ms: the fit leaves 4508 times"
                + " the recording's own noise; is it of another sweep (give the plan's options: ladder, codes, --hold),"
                + " or does something else sound in the input?", e.getMessage());
    }

    @Test
    void refusesTheRecordingOfOtherCodesInAsManySteps() {
        LadderSpec ladder = LadderSpec.builder().topology(Topology.R2R).bits(8).tolerance(0.01).build();
        // a meter's plan and a plain one: the basis and 40 checks each, but not the same checks
        MeasurementPlan meter = MeasurementPlan.of(ladder.levels(), 40, Optional.of(new MeterRanges(2000, true)));
        MeasurementPlan plain = MeasurementPlan.of(ladder.levels(), 40);
        RecordingSweep recorded = RecordingSweep.of(meter, 0.020);
        RecordingSweep told = RecordingSweep.of(plain, 0.020);
        double[] y = SyntheticRecording.record(recorded, ladder.levels().levels(), SyntheticRecording.card(48_000,
                0.5, NOISE_RMS, 0.4, 0.3));
        InputError e = assertThrows(InputError.class, () -> RecordingCalibration.fit(new Recording("bench.wav", y,
                48_000, 16, 1, 1), told, request(ladder, 0.020)));
        assertEquals("bench.wav: the recording does not follow the ladder: code 191 sits at 0.953 of the full swing,"
                + " the model at 0.749 (parts of 1 % keep it within 0.050); is it of another sweep (give the plan's"
                + " options: ladder, codes, --hold) or is the board not built as described?", e.getMessage());
    }

    @Test
    void findsTheCornerTheClocksAndThePolarityOfTheCard() {
        LadderSpec ladder = LadderSpec.builder().topology(Topology.R2R).bits(8).tolerance(0.01).build();
        RecordingCalibration.Request request = request(ladder, 0.030);
        RecordingSweep sweep = RecordingCalibration.sweep(request);
        SplittableRandom random = new SplittableRandom(17);
        for (int i = 0; i < 3; i++) {
            SyntheticRecording.Card card = card(random, 48_000, false);
            double[] truth = SimulatedBoard.draw(ladder, Spread.uniform(), 300 + i).levels().levels();
            RecordingResult r = RecordingFit.fit(new Recording("bench.wav", SyntheticRecording.record(sweep, truth,
                    card), 48_000, 16, 1, 1), sweep);
            assertEquals(card.cornerHz(), r.cornerHz(), 0.01 * card.cornerHz(), "corner");
            assertEquals(card.clockPpm(), r.clock().mismatchPpm(), 2, "clock mismatch, ppm");
            assertEquals(card.gain() > 0, r.upright(), "polarity");
            assertEquals(card.humHz(), r.humHz(), 0.01, "hum");
            double swing = card.gain() * (truth[255] - truth[0]);
            assertEquals(swing, r.swing(), 0.002 * Math.abs(swing), "full swing");
        }
    }
}
