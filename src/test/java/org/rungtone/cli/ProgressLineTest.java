package org.rungtone.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.PrintWriter;
import java.io.StringWriter;
import org.junit.jupiter.api.Test;

class ProgressLineTest {
    private final StringWriter text = new StringWriter();

    @Test
    void percentRedrawsOnlyWhenTheWholePercentChangesAndClearsWhenDone() {
        ProgressLine line = new ProgressLine(new PrintWriter(text), true);
        for (int done = 1; done <= 1000; done++) {
            line.showPercent("Monte Carlo", done, 1000, "boards");
        }
        StringBuilder expected = new StringBuilder();
        for (int percent = 0; percent < 100; percent++) {
            expected.append(String.format("\rMonte Carlo: %3d%% of 1000 boards", percent));
        }
        expected.append("\r").append(" ".repeat("Monte Carlo:  99% of 1000 boards".length())).append("\r");
        assertEquals(expected.toString(), text.toString());
    }

    @Test
    void staysSilentWhenOffOrNotWanted() {
        new ProgressLine(new PrintWriter(text), false).showPercent("Monte Carlo", 1, 3, "boards");
        ProgressLine notWanted = new ProgressLine(new PrintWriter(text), true).onlyIf(false);
        notWanted.showPercent("Monte Carlo", 1, 3, "boards");
        notWanted.show("Survey", 1, 3);
        assertEquals("", text.toString());
    }
}
