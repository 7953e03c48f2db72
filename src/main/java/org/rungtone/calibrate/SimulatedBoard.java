package org.rungtone.calibrate;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.rungtone.internal.Checks;
import org.rungtone.internal.Setting;
import org.rungtone.ladder.Ladder;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;
import org.rungtone.ladder.Part;
import org.rungtone.ladder.Spread;

/**
 * A board that stands in for the bench: one set of resistor values drawn around a ladder's nominal ones, as
 * {@link org.rungtone.ladder.MonteCarlo} draws them (uniform within the tolerance, or Gaussian with a relative
 * sigma; pins, load and buffer nominal), solved exactly ({@link Ladder#levels()}), and "measured" by a meter
 * that adds Gaussian noise and rounds to its step. Reproducible: the same seeds give the same board and
 * readings.
 */
public final class SimulatedBoard {
    private final Ladder ladder;
    private final long seed;

    private SimulatedBoard(Ladder ladder, long seed) {
        this.ladder = ladder;
        this.seed = seed;
    }

    /**
     * A meter: Gaussian noise of {@code noiseVolts} rms, readings rounded to {@code stepVolts} (0 for none),
     * {@code repeats} readings of each code.
     *
     * @param noiseVolts rms noise added to each reading
     * @param stepVolts the meter's resolution, 0 for exact readings
     * @param repeats readings per code, 1 or more
     */
    public record Meter(double noiseVolts, double stepVolts, int repeats) {
        /** Checks the values. */
        public Meter {
            Checks.checkInput(Double.isFinite(noiseVolts) && noiseVolts >= 0, "meter noise must be 0 or positive:"
                    + " %s", noiseVolts);
            Setting.RESOLUTION.check(stepVolts >= 0 && stepVolts < 10, "must be 0 (exact) or a positive voltage"
                    + " below 10 V: %s", stepVolts);
            Checks.checkInput(repeats >= 1 && repeats <= 100, "readings per code must be 1..100: %d", repeats);
        }

        /** An exact meter: no noise, no rounding, one reading. */
        public static Meter exact() {
            return new Meter(0, 0, 1);
        }

        /** Decimal places that show the step: 3 for 1 mV. */
        int decimals() {
            return stepVolts == 0 ? 9 : Math.max(0, (int) Math.ceil(-Math.log10(stepVolts) - 1e-9));
        }
    }

    /** One board of {@code spec} with values drawn by {@code spread} from {@code seed}. */
    public static SimulatedBoard draw(LadderSpec spec, Spread spread, long seed) {
        SplittableRandom random = new SplittableRandom(seed);
        List<Part> parts = spec.parts();
        double[] ohms = new double[parts.size()];
        for (int i = 0; i < ohms.length; i++) {
            ohms[i] = parts.get(i).ohms() * Math.max(1e-6, 1 + spread.deviation(random, spec.tolerance()));
        }
        return new SimulatedBoard(Ladder.of(spec, ohms), seed);
    }

    /** A board with known resistor values (a chosen mismatch, say) instead of drawn ones. */
    public static SimulatedBoard of(Ladder ladder) {
        return new SimulatedBoard(ladder, 0);
    }

    /** The drawn network. */
    public Ladder ladder() {
        return ladder;
    }

    /** The seed it was drawn with. */
    public long seed() {
        return seed;
    }

    /** The levels the board really produces. */
    public LevelTable levels() {
        return ladder.levels().withOrigin("simulated board, seed " + seed);
    }

    /** Readings of the plan's codes, in plan order, each repeated {@code meter.repeats()} times. */
    public Measurements measure(MeasurementPlan plan, Meter meter, long meterSeed) {
        List<Reading> readings = new ArrayList<>();
        for (List<Reading> perCode : readingsPerCode(plan, meter, meterSeed)) {
            readings.addAll(perCode);
        }
        return Measurements.of(plan.bits(), readings, List.of(), "simulated board " + seed);
    }

    /**
     * The plan's CSV with the measured column filled in: the readings as a meter of that step displays them.
     */
    public String filledCsv(MeasurementPlan plan, Meter meter, long meterSeed) {
        List<List<String>> texts = new ArrayList<>();
        for (List<Reading> perCode : readingsPerCode(plan, meter, meterSeed)) {
            List<String> t = new ArrayList<>();
            for (Reading r : perCode) {
                t.add(String.format(Locale.ROOT, "%." + meter.decimals() + "f", r.volts()));
            }
            texts.add(t);
        }
        return plan.csv(texts);
    }

    private List<List<Reading>> readingsPerCode(MeasurementPlan plan, Meter meter, long meterSeed) {
        double[] truth = ladder.levels().levels();
        SplittableRandom random = new SplittableRandom(meterSeed);
        List<List<Reading>> out = new ArrayList<>();
        for (PlannedCode c : plan.codes()) {
            List<Reading> perCode = new ArrayList<>();
            for (int r = 0; r < meter.repeats(); r++) {
                double v = truth[c.code()] + (meter.noiseVolts() > 0 ? meter.noiseVolts() * random.nextGaussian() : 0);
                if (meter.stepVolts() > 0) {
                    v = Math.rint(v / meter.stepVolts()) * meter.stepVolts();
                }
                perCode.add(new Reading(c.code(), v, meter.stepVolts(), 0));
            }
            out.add(perCode);
        }
        return out;
    }
}
