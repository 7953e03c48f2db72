package org.rungtone.ladder;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.rungtone.internal.Units;

/**
 * Everything the ladder report shows about one network: levels against the ideal transfer, linearity, the
 * worst-case pin currents, the range of output resistance, and the collected warnings (the spec's own, a
 * non-monotonic transfer, pins above a given current limit).
 *
 * @param ladder the network analysed
 * @param levels its buffered output levels
 * @param ideal the ideal transfer of its topology
 * @param linearity linearity of levels against ideal
 * @param pinCurrents worst-case current of each pin, bit 0 first
 * @param minOutputOhms lowest Thévenin resistance at the ladder output over all codes
 * @param maxOutputOhms highest Thévenin resistance at the ladder output over all codes
 * @param pinLimitAmps the pin current limit checked, or infinity for none
 * @param warnings what deserves attention, at most {@value #MAX_WARNINGS} lines
 */
public record LadderAnalysis(Ladder ladder, LevelTable levels, LevelTable ideal, Linearity linearity,
        List<PinCurrent> pinCurrents, double minOutputOhms, double maxOutputOhms, double pinLimitAmps,
        List<String> warnings) {
    /** The most warnings kept; a last line says how many more there were. */
    public static final int MAX_WARNINGS = 20;

    /** Copies the lists. */
    public LadderAnalysis {
        pinCurrents = List.copyOf(pinCurrents);
        warnings = List.copyOf(warnings);
    }

    /** Analyses the nominal network of {@code spec}; {@code pinLimitAmps} may be infinite for no check. */
    public static LadderAnalysis of(LadderSpec spec, double pinLimitAmps) {
        return of(Ladder.nominal(spec), pinLimitAmps);
    }

    /** Analyses a network; {@code pinLimitAmps} may be infinite for no check. */
    public static LadderAnalysis of(Ladder ladder, double pinLimitAmps) {
        LadderSpec spec = ladder.spec();
        LevelTable levels = ladder.levels();
        LevelTable ideal = spec.idealLevels();
        Linearity lin = Linearity.of(levels, ideal);
        Ladder.DcScan scan = ladder.scan();
        List<String> w = new ArrayList<>(spec.warnings());
        int[] inverted = lin.invertedSteps();
        if (!lin.isMonotonic()) {
            int worst = lin.worstDnlCode();
            w.add(String.format(Locale.ROOT, "not monotonic: %d inverted step%s, worst DNL %+.3f LSB at code %d"
                    + " (DNL > -1 LSB at every step is needed)", inverted.length, inverted.length == 1 ? "" : "s",
                    lin.dnlLsb(worst), worst));
        }
        for (PinCurrent p : scan.pins()) {
            if (p.sourceAmps() > pinLimitAmps) {
                w.add(pinWarning(p.bit(), "sources", p.sourceAmps(), p.sourceCode(), pinLimitAmps));
            }
            if (p.sinkAmps() > pinLimitAmps) {
                w.add(pinWarning(p.bit(), "sinks", p.sinkAmps(), p.sinkCode(), pinLimitAmps));
            }
        }
        if (w.size() > MAX_WARNINGS) {
            int more = w.size() - (MAX_WARNINGS - 1);
            w = new ArrayList<>(w.subList(0, MAX_WARNINGS - 1));
            w.add("... and " + more + " more warnings");
        }
        return new LadderAnalysis(ladder, levels, ideal, lin, scan.pins(), scan.minOutputOhms(),
                scan.maxOutputOhms(), pinLimitAmps, w);
    }

    private static String pinWarning(int bit, String verb, double amps, int code, double limit) {
        return String.format(Locale.ROOT, "the pin of bit %d %s %s at code %d, above the %s limit;"
                + " use larger resistors and check the part's datasheet", bit, verb, Units.format(amps, "A"),
                code, Units.format(limit, "A"));
    }

    /** The description analysed. */
    public LadderSpec spec() {
        return ladder.spec();
    }
}
