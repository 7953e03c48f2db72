package org.rungtone.calibrate;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.SplittableRandom;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;
import org.rungtone.ladder.Spread;
import org.rungtone.ladder.Topology;
import org.rungtone.source.Signal;

/**
 * The calibration goals measured over many drawn boards ({@code ./bench calibration [BOARDS]}; the unit tests
 * check the same goals on a few boards). A 10-bit weighted ladder of 5 % parts, ENOB of a full-scale sine
 * quantized to the nearest level of each table (IEEE Std 1241-2010), the loss being the median ENOB with
 * exact knowledge of the levels less the median with the fitted ones:
 * <ul>
 * <li>recording: the sweep of every code held 40 ms, recorded through a card drawn as in
 * {@link RecordingCalibrationTest} (corner 1..20 Hz, either polarity, ±300 ppm, hum, −85 dBFS noise), then a
 * harsher card (−78 dBFS noise, the swing at −20..−12 dBFS, ±500 ppm, hum at −50 dBFS);</li>
 * <li>meter: a 3½-digit autoranging meter (1 mV below 2 V, 10 mV above), before (the default 2·N + 12
 * codes, one resolution for the file) and after (codes chosen for the meter, each reading weighted by its
 * digits), then the same meter also reading 0.1 mV on its 200 mV range and one with 0.3 digit rms noise.</li>
 * </ul>
 */
public final class CalibrationStudy {
    private static final LadderSpec TEN_BITS = LadderSpec.builder().topology(Topology.WEIGHTED).bits(10)
            .tolerance(0.05).build();
    private static final Signal SINE = CompensationTest.sine(8192, 1021);

    private CalibrationStudy() {
    }

    /** Runs the study over {@code args[0]} boards (default 101); {@code args[1]} "harsh" runs that card alone. */
    public static void main(String[] args) {
        int boards = args.length > 0 ? Integer.parseInt(args[0]) : 101;
        if (args.length > 1 && args[1].equals("harsh")) {
            recording(boards, true);
            return;
        }
        System.out.printf(Locale.ROOT, "10-bit weighted ladder of 5 %% parts, %d boards; ENOB loss = median exact"
                + " - median calibrated%n", boards);
        recording(boards, false);
        recording(boards, true);
        meter(boards);
    }

    /** A harsher card than the test's: more noise, a lower level, faster clocks, louder hum. */
    private static SyntheticRecording.Card harsh(SplittableRandom random, double rateHz) {
        double corner = Math.exp(random.nextDouble(Math.log(1), Math.log(20)));
        double swing = Math.pow(10, random.nextDouble(-20, -12) / 20);
        double gain = (random.nextBoolean() ? 1 : -1) * swing / 5.0;
        double hum = (random.nextBoolean() ? 50 : 60) + random.nextDouble(-0.05, 0.05);
        return new SyntheticRecording.Card(rateHz, gain, random.nextDouble(-0.002, 0.002), corner,
                random.nextDouble(-500, 500), random.nextDouble(0.3, 1.5), random.nextDouble(0.2, 1.0),
                Math.pow(10, -78 / 20.0), hum, Math.pow(10, -50 / 20.0), true, random.nextLong());
    }

    private static void recording(int boards, boolean harsh) {
        RecordingCalibration.Request request = RecordingCalibrationTest.request(TEN_BITS, 0.040);
        RecordingSweep sweep = RecordingCalibration.sweep(request);
        double[] exact = new double[boards];
        double[] calibrated = new double[boards];
        double[] loss = new double[boards];
        SplittableRandom random = new SplittableRandom(harsh ? 4242 : 2026);
        List<String> refused = new ArrayList<>();
        int warned = 0;
        long t0 = System.nanoTime();
        for (int b = 0; b < boards; b++) {
            SimulatedBoard board = SimulatedBoard.draw(TEN_BITS, Spread.uniform(), 7000 + b);
            double[] truth = board.levels().levels();
            double rate = b % 2 == 0 ? 48_000 : 44_100;
            SyntheticRecording.Card card = harsh ? harsh(random, rate) : RecordingCalibrationTest.card(random, rate,
                    true);
            exact[b] = enob(board.levels(), truth);
            try {
                RecordingCalibration.Result r = RecordingCalibration.fit(new Recording("bench.wav",
                        SyntheticRecording.record(sweep, truth, card), rate, 16, 1, 1), sweep, request);
                calibrated[b] = enob(r.profile().levels(), truth);
                warned += r.recording().warnings().isEmpty() ? 0 : 1;
            } catch (InputError e) {
                refused.add(e.getMessage());
                calibrated[b] = Double.NaN;
            }
            loss[b] = exact[b] - calibrated[b];
            if (loss[b] > 0.1) {
                System.out.printf(Locale.ROOT, "  board %d lost %.3f bit: %s%n", b, loss[b], card);
            }
        }
        double seconds = (System.nanoTime() - t0) / 1e9;
        System.out.printf(Locale.ROOT, "recording, %s card, %.1f s sweep: median ENOB exact %.3f, calibrated %.3f,"
                + " loss %.3f bit; per board loss median %.3f, 90th percentile %.3f, worst %.3f; %d refused;"
                + " %d warned; %.2f s a board%n", harsh ? "harsh" : "test's", sweep.durationSeconds(),
                CompensationTest.median(exact), median(calibrated), CompensationTest.median(exact)
                - median(calibrated), median(loss), percentile(loss, 0.9), percentile(loss, 1.0), refused.size(),
                warned, seconds / boards);
        refused.stream().limit(3).forEach(m -> System.out.println("  refused: " + m));
    }

    private static void meter(int boards) {
        MeasurementPlan before = MeasurementPlan.of(TEN_BITS.levels());
        MeasurementPlan after = new CodeChoice(false, OptionalInt.empty(), Optional.of(new MeterRanges(2000, true)))
                .plan(TEN_BITS.levels());
        double[] exact = new double[boards];
        double[][] cases = new double[4][boards];
        for (int b = 0; b < boards; b++) {
            SimulatedBoard board = SimulatedBoard.draw(TEN_BITS, Spread.uniform(), 5000 + b);
            double[] truth = board.levels().levels();
            exact[b] = enob(board.levels(), truth);
            SplittableRandom noise = new SplittableRandom(b);
            cases[0][b] = enob(BoardFit.fit(read(before, truth, false, 0, noise), new BoardFit.Settings(1e-3,
                    Double.NaN, Double.NaN)).levels(), truth);
            cases[1][b] = enob(BoardFit.fit(read(after, truth, false, 0, noise), BoardFit.Settings.defaults())
                    .levels(), truth);
            cases[2][b] = enob(BoardFit.fit(read(after, truth, true, 0, noise), BoardFit.Settings.defaults())
                    .levels(), truth);
            cases[3][b] = enob(BoardFit.fit(read(after, truth, false, 0.3, noise), BoardFit.Settings.defaults())
                    .levels(), truth);
        }
        String[] names = {"before: default codes, one resolution", "after: meter's codes, weighted digits",
            "after, 0.1 mV on the 200 mV range", "after, 0.3 digit rms noise"};
        double e = CompensationTest.median(exact);
        for (int i = 0; i < names.length; i++) {
            System.out.printf(Locale.ROOT, "meter, %d readings, %s: median ENOB exact %.3f, calibrated %.3f, loss"
                    + " %.3f bit%n", i == 0 ? before.codes().size() : after.codes().size(), names[i], e,
                    CompensationTest.median(cases[i]), e - CompensationTest.median(cases[i]));
        }
    }

    /**
     * Readings of every planned code: 1 mV below 2 V (0.1 mV below 200 mV when {@code fine}), 10 mV from
     * there, with {@code noiseDigits} rms of the last digit added before rounding.
     */
    private static Measurements read(MeasurementPlan plan, double[] truth, boolean fine, double noiseDigits,
            SplittableRandom random) {
        List<Reading> readings = new ArrayList<>();
        for (PlannedCode c : plan.codes()) {
            double v = truth[c.code()];
            double step = fine && Math.abs(v) < 0.19995 ? 1e-4 : Math.abs(v) < 1.9995 ? 1e-3 : 1e-2;
            double shown = v + noiseDigits * step * random.nextGaussian();
            readings.add(new Reading(c.code(), Math.rint(shown / step) * step, step, 0));
        }
        return Measurements.of(plan.bits(), readings, List.of(), "meter");
    }

    private static double enob(LevelTable table, double[] truth) {
        return CompensationTest.enob(CompensationTest.sinadDb(SINE, CompensationTest.nearest(table, SINE), truth));
    }

    /** The median of the finite values. */
    private static double median(double[] x) {
        return CompensationTest.median(Arrays.stream(x).filter(Double::isFinite).toArray());
    }

    private static double percentile(double[] x, double p) {
        double[] s = Arrays.stream(x).filter(Double::isFinite).sorted().toArray();
        return s.length == 0 ? Double.NaN : s[(int) Math.min(s.length - 1, Math.floor(p * s.length))];
    }
}
