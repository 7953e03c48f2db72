package org.rungtone.cli.shell;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.PrintWriter;
import java.io.StringWriter;
import org.junit.jupiter.api.Test;

/** The progress line on a pretend terminal, with a clock the test moves. */
class ProgressMeterTest {
    private static final long SECOND = 1_000_000_000L;

    private final StringWriter text = new StringWriter();
    private long now = 7 * SECOND;

    private ProgressMeter meter(boolean terminal) {
        return new ProgressMeter(new PrintWriter(text), terminal, () -> now, 80);
    }

    @Test
    void showsElapsedTimeAndTheTimeLeftFromTheShareDone() {
        ProgressMeter m = meter(true);
        now += 2 * SECOND;
        m.show("Monte Carlo", "2000 boards", 0.25);
        // 2 s for a quarter: 6 s more for the rest
        assertEquals("\rMonte Carlo: 2000 boards  25%  0:02 elapsed, about 0:06 left", text.toString());
    }

    @Test
    void workThatEndsWithinHalfASecondShowsNothing() {
        ProgressMeter m = meter(true);
        now += SECOND / 4;
        m.show("survey", "", 0.5);
        m.close();
        assertEquals("", text.toString());
    }

    @Test
    void estimatesOnlyAfterASecondOfATask() {
        ProgressMeter m = meter(true);
        now += SECOND * 3 / 4;
        m.show("survey", "", 0.5);
        assertEquals("\rsurvey  50%  0:00 elapsed", text.toString());
    }

    @Test
    void aNewTaskStartsANewEstimateButTheElapsedTimeRunsOn() {
        ProgressMeter m = meter(true);
        now += 10 * SECOND;
        m.show("reading", "", 1);
        m.show("survey", "", 0);
        text.getBuffer().setLength(0);
        now += 2 * SECOND;
        m.show("survey", "", 0.5);
        assertEquals("\rsurvey  50%  0:12 elapsed, about 0:02 left", text.toString());
    }

    @Test
    void redrawsOnlyWhenTheLineChangesAndBlanksWhatAShorterLineLeaves() {
        ProgressMeter m = meter(true);
        now += SECOND;
        m.show("building chime", "condition done", 0.54);
        m.show("building chime", "condition done", 0.541);
        String first = "building chime: condition done  54%  0:01 elapsed, about 0:01 left";
        assertEquals("\r" + first, text.toString());
        now += SECOND;
        m.show("building chime", "analyze done", 0.77);
        String second = "building chime: analyze done  77%  0:02 elapsed, about 0:01 left";
        assertEquals("\r" + first + "\r" + second + " ".repeat(first.length() - second.length()), text.toString());
    }

    @Test
    void aShareReportedOutOfTurnDoesNotMoveTheLineBack() {
        ProgressMeter m = meter(true);
        now += SECOND;
        m.show("Monte Carlo", "", 0.06);
        m.show("Monte Carlo", "", 0.05);
        assertEquals("\rMonte Carlo  6%  0:01 elapsed, about 0:16 left", text.toString());
    }

    @Test
    void theClockMovesOnBetweenReports() {
        ProgressMeter m = meter(true);
        now += SECOND;
        m.show("building chime", "open done", Double.NaN);
        now += 65 * SECOND;
        m.tick();
        assertEquals("\rbuilding chime: open done  0:01 elapsed\rbuilding chime: open done  1:06 elapsed",
                text.toString());
    }

    @Test
    void closingClearsTheLineAndLaterReportsShowNothing() {
        ProgressMeter m = meter(true);
        now += SECOND;
        m.show("survey", "", 0.5);
        m.close();
        m.show("previews", "", 0.5);
        m.tick();
        String line = "survey  50%  0:01 elapsed, about 0:01 left";
        assertEquals("\r" + line + "\r" + " ".repeat(line.length()) + "\r", text.toString());
    }

    @Test
    void offItWritesNothingAtAll() {
        ProgressMeter m = meter(false);
        now += 5 * SECOND;
        m.show("Monte Carlo", "2000 boards", 0.5);
        m.tick();
        m.close();
        assertEquals("", text.toString());
    }

    @Test
    void aLineStaysWithinTheTerminalsWidth() {
        ProgressMeter m = new ProgressMeter(new PrintWriter(text), true, () -> now, 40);
        now += SECOND;
        m.show("building a_sound_with_a_long_name", "condition done", 0.5);
        assertEquals("\rbuilding a_sound_with_a_long_name: cond", text.toString());
    }

    @Test
    void clockReadsMinutesAndSecondsThenHours() {
        assertEquals("0:00", ProgressMeter.clock(0));
        assertEquals("1:05", ProgressMeter.clock(65));
        assertEquals("59:59", ProgressMeter.clock(3599));
        assertEquals("1:00:00", ProgressMeter.clock(3600));
    }
}
