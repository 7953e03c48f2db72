package org.rungtone.ladder;

import java.util.ArrayList;
import java.util.List;

/**
 * Resistor values proposed for a ladder from a preferred-value series, beside the naive choice of the
 * nearest series value to each ideal value, with the linearity of both.
 *
 * @param series the series the values come from
 * @param idealOhms the ideal value of each position (perfect pins), in the order of the spec's parts
 * @param naive the nearest single series value to each ideal value
 * @param naiveLinearity linearity of the naive network
 * @param proposed the proposal: single parts, or pairs where a pair cuts the worst INL
 * @param proposedLinearity linearity of the proposed network
 * @param proposedLadder the proposed network, for levels and pin currents
 */
public record DesignProposal(ESeries series, List<Double> idealOhms, List<PartChoice> naive,
        Linearity naiveLinearity, List<PartChoice> proposed, Linearity proposedLinearity,
        Ladder proposedLadder) {
    /** Copies the lists. */
    public DesignProposal {
        idealOhms = List.copyOf(idealOhms);
        naive = List.copyOf(naive);
        proposed = List.copyOf(proposed);
    }

    /**
     * The ladder built from the proposal: {@code original} with every part's proposed value as its own
     * ({@code resistors}, an r2r ladder's rungs and termination included) and this series. Its levels are
     * those of {@link #proposedLadder()}.
     */
    public LadderSpec spec(LadderSpec original) {
        List<Double> ohms = new ArrayList<>();
        for (PartChoice c : proposed) {
            ohms.add(c.ohms());
        }
        return original.toBuilder().resistors(ohms).series(series).build();
    }

    /** Number of resistors the proposal needs. */
    public int partCount() {
        int n = 0;
        for (PartChoice c : proposed) {
            n += c.partCount();
        }
        return n;
    }
}
