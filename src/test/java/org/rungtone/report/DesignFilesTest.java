package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.rungtone.internal.Units;
import org.rungtone.ladder.DesignProposal;
import org.rungtone.ladder.ESeries;
import org.rungtone.ladder.LadderFile;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LadderStudy;
import org.rungtone.ladder.PartChoice;
import org.rungtone.testing.Cli;

/**
 * {@code ladder --design} writes its proposal as a ladder file that {@code --ladder} reads back to exactly the
 * proposed levels, and as a parts list that names every resistor to fit.
 */
class DesignFilesTest {
    @TempDir
    Path dir;

    private static LadderStudy design(String example) {
        Path file = Path.of("examples/ladders", example);
        return design(LadderSpec.fromToml(LadderFile.readTable(file), file));
    }

    private static LadderStudy design(LadderSpec spec) {
        return new LadderStudy.Request(spec, List.of(), Double.POSITIVE_INFINITY, Optional.empty(),
                Optional.empty(), true).run(done -> { });
    }

    @ParameterizedTest
    @ValueSource(strings = {"door-chime-weighted.toml", "freezer-alarm-custom.toml", "sweep-generator-r2r.toml"})
    void theLadderFileReadsBackToTheProposedLevels(String example) {
        LadderStudy study = design(example);
        LadderStudy.Design d = study.design().orElseThrow();
        List<String> files = LadderFiles.write(dir, study);
        assertEquals(List.of(dir.resolve("proposal.toml").toString(), dir.resolve("proposal-parts.csv").toString()),
                files.subList(files.size() - 2, files.size()));
        Path toml = dir.resolve(DesignFiles.LADDER_FILE);
        LadderSpec back = LadderSpec.fromToml(LadderFile.readTable(toml), toml);
        assertEquals(study.analysis().spec().topology(), back.topology());
        assertEquals(study.analysis().spec().bits(), back.bits());
        assertEquals(Optional.of(d.proposal().series()), back.series());
        assertArrayEquals(d.proposal().proposedLadder().ohms(), back.ohms(), 0, "every part's value, exactly");
        assertArrayEquals(d.analysis().levels().levels(), back.levels().levels(), 0, "the same levels, exactly");
    }

    @Test
    void theCommandReadsTheProposalBackAndItsLevelsAreTheProposals() throws IOException {
        Path first = dir.resolve("first");
        Cli.Run r = Cli.run("ladder", "--ladder", "examples/ladders/freezer-alarm-custom.toml", "--design",
                "--series", "E12", "--out", first.toString());
        assertEquals(0, r.exitCode(), r.err());
        assertTrue(r.out().contains(first.resolve("proposal.toml") + ", " + first.resolve("proposal-parts.csv")),
                r.out());
        Path second = dir.resolve("second");
        Cli.Run back = Cli.run("ladder", "--ladder", first.resolve("proposal.toml").toString(), "--out",
                second.toString());
        assertEquals(0, back.exitCode(), back.err());
        Path file = Path.of("examples/ladders/freezer-alarm-custom.toml");
        LadderStudy study = design(LadderSpec.fromToml(LadderFile.readTable(file), file).toBuilder()
                .series(ESeries.E12).build());
        assertEquals(LadderFiles.levelsCsv(study.design().orElseThrow().analysis()),
                Files.readString(second.resolve("levels.csv")));
    }

    @Test
    void thePartsListNamesEveryResistorToFit() {
        LadderStudy study = design("freezer-alarm-custom.toml");
        DesignProposal d = study.design().orElseThrow().proposal();
        String csv = DesignFiles.partsCsv(study.analysis().spec(), d);
        List<String> lines = csv.lines().toList();
        assertEquals("position,value,series,tolerance,quantity", lines.get(0));
        int quantity = 0;
        for (String line : lines.subList(1, lines.size())) {
            String[] f = line.split(",");
            assertEquals(5, f.length, line);
            assertTrue(ESeries.E24.contains(Units.parse(f[1], "ohm")), line);
            assertEquals("E24", f[2], "the series the design used (the ladder names none: E24)");
            assertEquals("5%", f[3]);
            quantity += Integer.parseInt(f[4]);
        }
        assertEquals(d.partCount(), quantity, "one row per part value, quantities adding up to the part count");
        // every pair's parts are listed at its position
        for (int i = 0; i < d.proposed().size(); i++) {
            PartChoice c = d.proposed().get(i);
            String label = study.analysis().spec().parts().get(i).label();
            if (c.kind() == PartChoice.Kind.SINGLE) {
                assertTrue(csv.contains("\n" + label + "," + Units.format(c.first(), "") + ",E24,5%,1\n"), label);
            } else {
                String position = label + " (" + c.kind().name().toLowerCase(java.util.Locale.ROOT) + " pair)";
                assertTrue(csv.contains("\n" + position + "," + Units.format(c.first(), "") + ","), position);
                assertTrue(csv.contains("\n" + position + "," + Units.format(c.second(), "") + ","), position);
            }
        }
    }
}
