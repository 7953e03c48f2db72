package org.rungtone.cli.shell;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;

class SpellingTest {
    private static final List<String> OPTIONS = List.of("--bits", "--rate", "--dither", "--normalize", "--pin-r-high",
            "--pin-r-low", "--templates", "--tolerance", "-q", "--quiet");

    @Test
    void suggestsTheNearestOptionIgnoringDashesAndCase() {
        assertEquals(List.of("--bits"), Spelling.nearest("--bitz", OPTIONS));
        assertEquals(List.of("--bits"), Spelling.nearest("-bits", OPTIONS));
        assertEquals(List.of("--normalize"), Spelling.nearest("--normalise", OPTIONS));
        assertEquals(List.of("--dither"), Spelling.nearest("--DITHR", OPTIONS));
    }

    @Test
    void namesEveryOptionAtTheSameDistance() {
        assertEquals(List.of("--out-min", "--out-max"), Spelling.nearest("--out-m", List.of("--out-min", "--out-max")));
        assertEquals(List.of("--pin-r-high"), Spelling.nearest("--pin-r-hihg", OPTIONS));
    }

    @Test
    void fallsBackToTheOneOptionTheTextBegins() {
        assertEquals(List.of("--templates"), Spelling.nearest("--templ", OPTIONS));
        assertEquals(List.of("--tolerance"), Spelling.nearest("--toler", OPTIONS));
        // a single letter is too little to guess from, and "--te" begins more than one
        assertEquals(List.of(), Spelling.nearest("--t", OPTIONS));
        assertEquals(List.of(), Spelling.nearest("-x", OPTIONS));
    }

    @Test
    void suggestsNothingForAWordFarFromAll() {
        assertEquals(List.of(), Spelling.nearest("--colour", OPTIONS));
        assertEquals(List.of(), Spelling.nearest("--xyz", OPTIONS));
    }
}
