package org.rungtone.ladder;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Warning;
import org.rungtone.internal.Warning.Kind;

class LadderAnalysisTest {
    /**
     * Two summing legs the wrong way round (10k on bit 0, 30k on bit 1), ideal pins, no load: by Millman's
     * theorem code 1 gives 5 V · (1/10k)/(1/10k + 1/30k) = 3.75 V and code 2 gives 1.25 V, an inverted step.
     */
    static final LadderSpec SWAPPED = LadderSpec.builder().topology(Topology.CUSTOM).resistors(10e3, 30e3)
            .pinROhms(0).build();

    private static List<Kind> kinds(LadderAnalysis a) {
        return a.warnings().stream().map(Warning::kind).toList();
    }

    @Test
    void warningsCarryTheirKind() {
        LadderAnalysis a = LadderAnalysis.of(SWAPPED, 100e-6);
        assertArrayEquals(new double[] {0, 3.75, 1.25, 5}, a.levels().levels(), 1e-12);
        // every pin drives 1.25 V across its leg at some code: 125 µA, above the 100 µA limit
        assertEquals(List.of(Kind.NOT_MONOTONIC, Kind.PIN_CURRENT, Kind.PIN_CURRENT, Kind.PIN_CURRENT,
                Kind.PIN_CURRENT), kinds(a));
        // LSB = 5 V / 3; DNL at code 2 = (1.25 − 3.75)/LSB − 1 = −2.5
        assertEquals("not monotonic: 1 inverted step, worst DNL -2.500 LSB at code 2 (DNL > -1 LSB at every step"
                + " is needed)", a.warnings().get(0).text());
        assertTrue(a.warnings().get(1).text().startsWith("the pin of bit 0 sources 125µA at code 1, above the"
                + " 100µA limit"), a.warnings().get(1).text());
    }

    @Test
    void measuredLevelsReplaceTheModelsAndItsMonotonicWarning() {
        LadderAnalysis model = LadderAnalysis.of(SWAPPED, 100e-6);
        LevelTable measured = LevelTable.of(2, new double[] {0, 1.25, 2.5, 3.75}, "unit bench-2 (2026-01-02)");
        LadderAnalysis a = model.withMeasuredLevels(measured);
        assertArrayEquals(measured.levels(), a.levels().levels(), 0);
        assertTrue(a.linearity().isMonotonic());
        assertEquals(List.of(Kind.OTHER, Kind.PIN_CURRENT, Kind.PIN_CURRENT, Kind.PIN_CURRENT, Kind.PIN_CURRENT),
                kinds(a));
        assertEquals("levels, linearity and plots are the measured ones of unit bench-2 (2026-01-02); wiring and"
                + " pin currents are modelled", a.warnings().get(0).text());
        assertEquals(model.warnings().subList(1, 5), a.warnings().subList(1, 5));
        assertEquals(model.pinCurrents(), a.pinCurrents());
    }

    @Test
    void aNonMonotonicMeasuredBoardIsFlagged() {
        LadderSpec r2r = LadderSpec.builder().topology(Topology.R2R).bits(2).build();
        LevelTable measured = LevelTable.of(2, new double[] {0, 2, 1, 3}, "unit bench-3 (2026-01-02)");
        LadderAnalysis a = LadderAnalysis.of(r2r, Double.POSITIVE_INFINITY).withMeasuredLevels(measured);
        // LSB = 3 V / 3 = 1 V; DNL at code 2 = (1 − 2)/1 − 1 = −2
        assertEquals(List.of(Kind.OTHER, Kind.NOT_MONOTONIC), kinds(a));
        assertEquals("the measured board is not monotonic: 1 inverted steps, worst DNL -2.000 LSB at code 2",
                a.warnings().get(1).text());
    }

    @Test
    void rejectsMeasuredLevelsWithoutSpan() {
        LevelTable flat = LevelTable.of(2, new double[] {1, 0, 2, 1}, "unit bench-4 (2026-01-02)");
        LadderAnalysis a = LadderAnalysis.of(SWAPPED, Double.POSITIVE_INFINITY);
        InputError e = assertThrows(InputError.class, () -> a.withMeasuredLevels(flat));
        assertEquals("unit bench-4 (2026-01-02): the first and last levels are equal; there is no span to measure"
                + " linearity against", e.getMessage());
    }

    @Test
    void keepsAtMostTwentyWarnings() {
        LadderSpec r2r = LadderSpec.builder().topology(Topology.R2R).bits(12).pinROhms(0).build();
        LadderAnalysis a = LadderAnalysis.of(r2r, 1e-9);
        // an ideal ladder whose 12 pins each source and sink above 1 nA: 24 warnings, 19 kept and a count
        assertEquals(LadderAnalysis.MAX_WARNINGS, a.warnings().size());
        assertTrue(a.warnings().subList(0, 19).stream().allMatch(w -> w.is(Kind.PIN_CURRENT)));
        assertEquals(Warning.other("... and 5 more warnings"), a.warnings().get(19));
    }
}
