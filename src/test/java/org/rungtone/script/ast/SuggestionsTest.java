package org.rungtone.script.ast;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;

import java.util.List;
import org.junit.jupiter.api.Test;

/** Nearest-name suggestions by edit distance. */
class SuggestionsTest {
    @Test
    void picksTheClosestCandidateOrNone() {
        List<String> names = List.of("sine", "square", "sawup", "decay");
        assertEquals("sine", Suggestions.nearest("sien", names));
        assertEquals("square", Suggestions.nearest("sqare", names));
        assertEquals("decay", Suggestions.nearest("deacy", names));
        assertNull(Suggestions.nearest("volume", names));
        assertNull(Suggestions.nearest("x", List.of("t", "n")));
    }
}
