package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;
import org.rungtone.ladder.LadderAnalysis;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LadderStudy;
import org.rungtone.ladder.Topology;

class LadderReportTest {
    /** Legs the wrong way round: code 1 gives 3.75 V and code 2 gives 1.25 V (Millman's theorem). */
    private static final LadderSpec SWAPPED = LadderSpec.builder().topology(Topology.CUSTOM)
            .resistors(10e3, 30e3).pinROhms(0).build();

    static LadderStudy study(LadderSpec spec, double pinLimitAmps, boolean design) {
        return new LadderStudy.Request(spec, List.of(), pinLimitAmps, Optional.empty(), Optional.empty(), design)
                .run(n -> { });
    }

    @Test
    void textListsWiringLevelsAndWarnings() {
        String text = LadderReport.text(study(SWAPPED, 100e-6, false), false, List.of("out/levels.csv"));
        assertTrue(text.startsWith("Ladder: custom 2-bit, 5% parts\n"), text);
        assertTrue(text.contains("\n  0    pin0     10k\n  1    pin1     30k\n"), text);
        assertTrue(text.contains("\n       2  10       1.25000"), text);
        assertTrue(text.contains("\n  monotonic         no, 1 inverted step (first at code 2)\n"), text);
        assertTrue(text.contains("\nWarnings\n  ! not monotonic: 1 inverted step, worst DNL -2.500 LSB at code 2"),
                text);
        assertTrue(text.endsWith("\nWrote out/levels.csv\n"), text);
    }

    @Test
    void proposalWarningsAreMarked() {
        String text = LadderReport.text(study(SWAPPED, 100e-6, true), false, List.of());
        assertTrue(text.contains("\n  ! proposal: the pin of bit 0 sources"), text);
        assertTrue(text.contains("\nDesign from E24: nearest values against the proposal\n"), text);
    }

    @Test
    void jsonGivesWarningTextsAndTheWiring() {
        JsonObject json = JsonParser.parseString(LadderReport.json(study(SWAPPED, 100e-6, true),
                List.of(Path.of("out", "a.csv").toString()), Path.of("out"), "9.9")).getAsJsonObject();
        assertEquals("ladder", json.get("report").getAsString());
        JsonArray warnings = json.getAsJsonArray("warnings");
        assertEquals(5, warnings.size());
        assertTrue(warnings.get(0).getAsString().startsWith("not monotonic: 1 inverted step"), warnings.toString());
        assertEquals("pin1", json.getAsJsonArray("wiring").get(1).getAsJsonObject().get("pin").getAsString());
        assertEquals(4, json.getAsJsonObject("design").getAsJsonArray("proposal_warnings").size());
        assertEquals("a.csv", json.getAsJsonArray("files").get(0).getAsString());
    }

    @Test
    void longTablesShowTheEndsMidScaleAndTheWorstCodes() {
        LadderAnalysis a = study(LadderSpec.builder().topology(Topology.R2R).bits(8).build(),
                Double.POSITIVE_INFINITY, false).analysis();
        TreeSet<Integer> codes = LadderReport.codesToPrint(a, false);
        for (int k : new int[] {0, 3, 126, 129, 252, 255, a.linearity().worstDnlCode(), a.linearity().worstInlCode()}) {
            assertTrue(codes.contains(k), k + " in " + codes);
        }
        assertTrue(codes.size() <= 15, codes.toString());
        assertEquals(256, LadderReport.codesToPrint(a, true).size());
    }

    @Test
    void binaryWritesTheHighestBitFirst() {
        assertEquals("0101", LadderReport.binary(5, 4));
        assertEquals("1", LadderReport.binary(1, 1));
    }
}
