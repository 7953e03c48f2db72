package org.rungtone.calibrate;

import java.util.Objects;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.Spread;

/**
 * The work of {@code calibrate simulate}: one board drawn from a ladder's tolerance (resistors uniform within
 * it) and read at a plan's codes by a meter with noise and a step, so the fit can be tried without a bench.
 */
public final class BoardSimulation {
    private BoardSimulation() {
    }

    /**
     * What to simulate.
     *
     * @param ladder the described ladder the board is drawn from
     * @param codes the codes to read
     * @param meter the meter's noise, step and readings per code
     * @param seed seed of the board and of the meter noise
     */
    public record Request(LadderSpec ladder, CodeChoice codes, SimulatedBoard.Meter meter, long seed) {
        /** Checks that every part is there. */
        public Request {
            Objects.requireNonNull(ladder, "ladder");
            Objects.requireNonNull(codes, "codes");
            Objects.requireNonNull(meter, "meter");
        }
    }

    /**
     * A simulated board and its readings.
     *
     * @param request what was simulated
     * @param plan the codes read, in plan order
     * @param board the drawn board
     * @param readingsCsv the plan's CSV with the measured column filled in
     */
    public record Result(Request request, MeasurementPlan plan, SimulatedBoard board, String readingsCsv) {
    }

    /** Draws the board and reads it at the chosen codes. */
    public static Result run(Request r) {
        MeasurementPlan plan = r.codes().plan(r.ladder().levels());
        SimulatedBoard board = SimulatedBoard.draw(r.ladder(), Spread.uniform(), r.seed());
        // the meter's noise gets a stream of its own, still fixed by the one seed
        return new Result(r, plan, board, board.filledCsv(plan, r.meter(), r.seed() * 31 + 7));
    }
}
