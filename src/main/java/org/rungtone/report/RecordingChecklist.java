package org.rungtone.report;

import static org.rungtone.report.TextLines.line;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;
import org.rungtone.calibrate.LineInputDivider;
import org.rungtone.calibrate.MeasurementPlan;
import org.rungtone.calibrate.MeterRanges;
import org.rungtone.calibrate.PlannedCode;
import org.rungtone.calibrate.RecordingSweep;
import org.rungtone.internal.Units;
import org.rungtone.ladder.LevelTable;

/**
 * The parts of a plan's checklist for a sound card's recording (the sweep, the divider, how to record, what
 * never to connect) and for a meter of known count (which codes it reads on which range).
 */
final class RecordingChecklist {
    private RecordingChecklist() {
    }

    /** The recording checklist of {@code sweep}, the sweep of {@code plan}'s codes. */
    static void text(StringBuilder b, RecordingSweep sweep, MeasurementPlan plan) {
        LevelTable model = plan.expected();
        double patternSeconds = sweep.patternSteps() * RecordingSweep.PATTERN_TICKS / 1000.0;
        line(b, "Recording the sweep with a sound card's line input");
        String codes = plan.everyCode() ? String.format(Locale.ROOT, "every code from 0 to %d", model.size() - 1)
                : String.format(Locale.ROOT, "the %d codes of plan.csv in its order", plan.codes().size());
        TextLines.wrap(b, "  ", String.format(Locale.ROOT, "The sweep: a start pattern (%s), %s, each held %d ms%s,"
                + " an end pattern (%s): %s in all.", Units.format(patternSeconds, "s"), codes, sweep.holdTicks(),
                sweep.returns() == 0 ? "" : String.format(Locale.ROOT, ", with %d returns to code 0 among them",
                        sweep.returns()), Units.format(patternSeconds, "s"), Units.format(sweep.durationSeconds(),
                                "s")));
        LineInputDivider d = LineInputDivider.forSwing(model.maxVolts() - model.minVolts());
        line(b, "  A line input takes about 1-2 V peak before it clips (common practice, no source); the board swings"
                + " %s.", Units.format(d.swingVolts(), "V"));
        if (d.direct()) {
            line(b, "  That fits: connect the output to the input's tip through %s, ground to its sleeve.",
                    Units.format(d.bottomOhms(), ""));
        } else {
            line(b, "  Divide it: %s from the board's output to the input's tip, %s from the tip to ground (the"
                    + " sleeve):", Units.format(d.topOhms(), ""), Units.format(d.bottomOhms(), ""));
            line(b, "  the full swing arrives as about %s. Any ratio near it does: the fit finds the gain.",
                    Units.format(d.inputVolts(), "V"));
        }
        line(b, "  Record at 44.1 or 48 kHz with 16 bits or more; switch off the input's effects (automatic gain,");
        line(b, "  noise suppression). Start recording, then start the sweep (reset the board); stop a second after");
        line(b, "  it ends. Set the input's level so the sweep peaks near -6 dBFS: clipped or faint recordings are");
        line(b, "  refused. One meter reading of the all-ones code (%s expected) scales the levels to volts:",
                Units.format(model.maxVolts(), "V"));
        line(b, "  give it as --full-scale-reading.");
        line(b, "  ! Never connect a speaker amplifier's output: it carries far more than a line level, and in a");
        line(b, "    bridged amplifier neither terminal is ground.");
        line(b, "  ! Never connect equipment referenced to the mains (a board on a non-isolated supply, an");
        line(b, "    earthed bench instrument) to the PC: power the board from USB or a battery while recording.");
    }

    /** The recording's JSON fields. */
    static Map<String, Object> json(RecordingSweep sweep, LevelTable model) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("duration_s", sweep.durationSeconds());
        m.put("hold_ms", sweep.holdTicks());
        m.put("pattern_steps", sweep.patternSteps());
        m.put("pattern_step_ms", RecordingSweep.PATTERN_TICKS);
        LineInputDivider d = LineInputDivider.forSwing(model.maxVolts() - model.minVolts());
        m.put("divider_top_ohm", d.topOhms());
        m.put("divider_bottom_ohm", d.bottomOhms());
        m.put("input_swing_v", d.inputVolts());
        return m;
    }

    /** Which of the plan's codes a meter of known count reads on which of its ranges. */
    static void meterLine(StringBuilder b, MeterRanges meter, MeasurementPlan plan) {
        double maxAbs = Math.max(Math.abs(plan.expected().minVolts()), Math.abs(plan.expected().maxVolts()));
        Map<Double, Integer> bySteps = new java.util.TreeMap<>();
        for (PlannedCode c : plan.codes()) {
            bySteps.merge(meter.stepVolts(c.expectedVolts(), maxAbs), 1, Integer::sum);
        }
        StringBuilder ranges = new StringBuilder();
        bySteps.forEach((step, count) -> ranges.append(ranges.length() == 0 ? "" : ", ").append(count)
                .append(" codes on its ").append(Units.format(meter.counts() * step, "V")).append(" range (")
                .append(Units.format(step, "V")).append(" steps)"));
        line(b, "The codes for a %d-count %s meter", meter.counts(), meter.autoranging() ? "autoranging"
                : "one-range");
        TextLines.wrap(b, "  ", "It reads " + ranges + ". Write every digit it shows, trailing zeros too: the fit"
                + " weights each reading by them.");
        line(b, "");
    }
}
