package org.rungtone.cli.shell;

import java.util.ArrayList;
import java.util.List;
import org.rungtone.firmware.SampleStorage;
import org.rungtone.firmware.TargetFamily;
import org.rungtone.ladder.ESeries;
import org.rungtone.ladder.Topology;

/**
 * The fixed words of options typed as text, for picocli's {@code completionCandidates}: the option keeps its
 * own checks and messages, and completion still offers its words.
 */
public final class Choices {
    private Choices() {
    }

    /** Ladder topologies: weighted, r2r, custom. */
    public static final class Topologies extends ArrayList<String> {
        private static final long serialVersionUID = 1L;

        /** Every topology's key. */
        public Topologies() {
            for (Topology t : Topology.values()) {
                add(t.key());
            }
        }
    }

    /** The topologies a starter project can begin with: weighted, r2r. */
    public static final class StarterTopologies extends ArrayList<String> {
        private static final long serialVersionUID = 1L;

        /** The two a starter file describes. */
        public StarterTopologies() {
            super(List.of(Topology.WEIGHTED.key(), Topology.R2R.key()));
        }
    }

    /** The Tread stores a survey can add as rows: tread2, tread3, tread4. */
    public static final class TreadStores extends ArrayList<String> {
        private static final long serialVersionUID = 1L;

        /** Every Tread storage's option spelling. */
        public TreadStores() {
            for (SampleStorage s : SampleStorage.values()) {
                if (s.codec().isPresent()) {
                    add(s.optionName());
                }
            }
        }
    }

    /** Target families: generic, avr, cortexm, rp2040. */
    public static final class Targets extends ArrayList<String> {
        private static final long serialVersionUID = 1L;

        /** Every family's option spelling. */
        public Targets() {
            for (TargetFamily f : TargetFamily.values()) {
                add(f.folder());
            }
        }
    }

    /** Preferred-value series: E6, E12, E24, E48, E96, E192. */
    public static final class Series extends ArrayList<String> {
        private static final long serialVersionUID = 1L;

        /** Every series' name. */
        public Series() {
            for (ESeries s : ESeries.values()) {
                add(s.name());
            }
        }
    }
}
