package org.rungtone.ladder;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.function.IntConsumer;
import org.rungtone.internal.Checks;

/**
 * Everything known about one ladder for its report: the analysis (with a built board's measured levels in
 * place of the modelled ones, when given), the names of the pins that drive it and, when asked for, the
 * spread over simulated boards and a proposal of preferred values. Made by {@link Request#run}.
 *
 * @param analysis the ladder's analysis
 * @param pinNames names of the pins driving bits 0.., bit 0 first
 * @param monteCarlo the spread over simulated boards, when asked for
 * @param design the proposed values and their analysis, when asked for
 */
public record LadderStudy(LadderAnalysis analysis, List<String> pinNames, Optional<MonteCarloResult> monteCarlo,
        Optional<Design> design) {
    /** The most boards one study simulates. */
    public static final int MAX_BOARDS = 2_000_000;

    /** Copies the list and checks there is one pin name per bit. */
    public LadderStudy {
        pinNames = List.copyOf(pinNames);
        Checks.checkArgument(pinNames.size() == analysis.spec().bits(), "%d pin names for %d bits",
                pinNames.size(), analysis.spec().bits());
    }

    /**
     * Preferred values for the ladder and the analysis of the ladder built from them.
     *
     * @param proposal the values: ideal, nearest and proposed
     * @param analysis the analysis of the proposed ladder, with the same pin current limit
     */
    public record Design(DesignProposal proposal, LadderAnalysis analysis) {
    }

    /**
     * What to study about one ladder.
     *
     * @param spec the ladder
     * @param pinNames names of the pins driving bits 0..; empty for D0, D1, ...
     * @param pinLimitAmps the pin current to warn above, or infinity for none
     * @param measured a built board's levels, their origin naming the board, when known
     * @param monteCarlo the boards to simulate, when asked for
     * @param design true to propose preferred values from the ladder's series (default E24)
     */
    public record Request(LadderSpec spec, List<String> pinNames, double pinLimitAmps,
            Optional<LevelTable> measured, Optional<MonteCarlo> monteCarlo, boolean design) {
        /**
         * Copies the list and checks it.
         *
         * @throws IllegalArgumentException when pin names are given but not one per bit, or there are more than
         *     {@value LadderStudy#MAX_BOARDS} boards
         */
        public Request {
            pinNames = List.copyOf(pinNames);
            Checks.checkArgument(pinNames.isEmpty() || pinNames.size() == spec.bits(),
                    "%d pin names for %d bits", pinNames.size(), spec.bits());
            Checks.checkArgument(monteCarlo.map(m -> m.boards() <= MAX_BOARDS).orElse(true),
                    "at most %d boards", MAX_BOARDS);
        }

        /**
         * Analyses the ladder, then runs Monte Carlo and the design proposal when asked for.
         *
         * @param progress told the number of boards simulated so far, from worker threads
         * @throws org.rungtone.internal.InputError when the measured levels have no span
         */
        public LadderStudy run(IntConsumer progress) {
            LadderAnalysis analysis = LadderAnalysis.of(spec, pinLimitAmps);
            if (measured.isPresent()) {
                analysis = analysis.withMeasuredLevels(measured.get());
            }
            Optional<MonteCarloResult> spread = monteCarlo.map(m -> m.run(Ladder.nominal(spec), progress));
            Optional<Design> proposal = Optional.empty();
            if (design) {
                DesignProposal values = LadderDesigner.propose(spec, spec.series().orElse(ESeries.E24));
                proposal = Optional.of(new Design(values, LadderAnalysis.of(values.proposedLadder(), pinLimitAmps)));
            }
            return new LadderStudy(analysis, pinNames.isEmpty() ? defaultPinNames(spec.bits()) : pinNames, spread,
                    proposal);
        }
    }

    /** pin0, pin1, ...: the pins by bit number when the user gave no names (no part's or board's names). */
    static List<String> defaultPinNames(int bits) {
        List<String> names = new ArrayList<>();
        for (int i = 0; i < bits; i++) {
            names.add("pin" + i);
        }
        return names;
    }
}
