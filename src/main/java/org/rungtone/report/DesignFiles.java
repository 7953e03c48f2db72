package org.rungtone.report;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.Units;
import org.rungtone.ladder.DesignProposal;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LadderToml;
import org.rungtone.ladder.Linearity;
import org.rungtone.ladder.Part;
import org.rungtone.ladder.PartChoice;

/**
 * The files of a ladder design proposal: {@code proposal.toml}, a ladder file that {@code --ladder} reads back
 * to the proposed levels, and {@code proposal-parts.csv}, the parts to buy and fit (position, value, series,
 * tolerance, quantity).
 */
public final class DesignFiles {
    /** The proposal as a ladder file. */
    public static final String LADDER_FILE = "proposal.toml";
    /** The proposal's parts list. */
    public static final String PARTS_FILE = "proposal-parts.csv";

    private DesignFiles() {
    }

    /**
     * Writes both files into {@code folder}.
     *
     * @param original the ladder the proposal was made for
     * @return the files written, in order
     */
    public static List<String> write(Path folder, LadderSpec original, DesignProposal proposal) {
        Path toml = folder.resolve(LADDER_FILE);
        AtomicFiles.writeString(toml, ladderText(original, proposal));
        Path csv = folder.resolve(PARTS_FILE);
        AtomicFiles.writeString(csv, partsCsv(original, proposal));
        return List.of(toml.toString(), csv.toString());
    }

    /** The proposal as a {@code [ladder]} table, each part's comment naming its position and parts. */
    static String ladderText(LadderSpec original, DesignProposal d) {
        LadderSpec spec = d.spec(original);
        Linearity lin = d.proposedLinearity();
        List<String> header = List.of(
                String.format(Locale.ROOT, "Resistor values from %s proposed by 'rungtone ladder --design' for the"
                        + " %s", d.series(), original.describe()),
                String.format(Locale.ROOT, "(worst |INL| %.4f LSB, worst |DNL| %.4f LSB, %s, %d resistors).",
                        lin.maxAbsInlLsb(), lin.maxAbsDnlLsb(), lin.isMonotonic() ? "monotonic" : "not monotonic",
                        d.partCount()),
                "A position built from two parts holds their combined value; its comment names the parts.",
                "Read it back with: rungtone ladder --ladder " + LADDER_FILE,
                "The parts to buy and fit are in " + PARTS_FILE + ".");
        List<String> notes = new ArrayList<>();
        List<Part> parts = original.parts();
        for (int i = 0; i < parts.size(); i++) {
            PartChoice c = d.proposed().get(i);
            notes.add(parts.get(i).label() + ": " + c.describe() + kind(c));
        }
        return LadderToml.text(spec, header, notes);
    }

    /**
     * One row per part value at each position: a single part, both parts of a pair (one row with quantity 2
     * when they are equal).
     */
    static String partsCsv(LadderSpec original, DesignProposal d) {
        String tolerance = Units.format(original.tolerance() * 100, "") + "%";
        String series = d.series().name();
        StringBuilder sb = new StringBuilder();
        CSVFormat format = CSVFormat.DEFAULT.builder().setRecordSeparator("\n")
                .setHeader("position", "value", "series", "tolerance", "quantity").build();
        try (CSVPrinter p = new CSVPrinter(sb, format)) {
            List<Part> parts = original.parts();
            for (int i = 0; i < parts.size(); i++) {
                PartChoice c = d.proposed().get(i);
                String position = parts.get(i).label() + kind(c).replace(")", " pair)");
                if (c.kind() == PartChoice.Kind.SINGLE || c.first() == c.second()) {
                    p.printRecord(position, Units.format(c.first(), ""), series, tolerance, c.partCount());
                } else {
                    p.printRecord(position, Units.format(c.first(), ""), series, tolerance, 1);
                    p.printRecord(position, Units.format(c.second(), ""), series, tolerance, 1);
                }
            }
        } catch (IOException e) {
            throw new IllegalStateException("CSV to memory failed", e);
        }
        return sb.toString();
    }

    /** " (series)" or " (parallel)" for a pair, else nothing. */
    private static String kind(PartChoice c) {
        return c.kind() == PartChoice.Kind.SINGLE ? "" : " (" + c.kind().name().toLowerCase(Locale.ROOT) + ")";
    }
}
