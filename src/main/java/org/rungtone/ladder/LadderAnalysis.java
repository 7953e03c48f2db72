package org.rungtone.ladder;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.rungtone.internal.Checks;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Units;
import org.rungtone.internal.Warning;

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
        List<Warning> warnings) {
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
        List<Warning> w = new ArrayList<>();
        spec.warnings().forEach(text -> w.add(Warning.other(text)));
        int[] inverted = lin.invertedSteps();
        if (!lin.isMonotonic()) {
            int worst = lin.worstDnlCode();
            w.add(new Warning(Warning.Kind.NOT_MONOTONIC, String.format(Locale.ROOT, "not monotonic: %d inverted"
                    + " step%s, worst DNL %+.3f LSB at code %d (DNL > -1 LSB at every step is needed)",
                    inverted.length, inverted.length == 1 ? "" : "s", lin.dnlLsb(worst), worst)));
        }
        for (PinCurrent p : scan.pins()) {
            if (p.sourceAmps() > pinLimitAmps) {
                w.add(pinWarning(p.bit(), "sources", p.sourceAmps(), p.sourceCode(), pinLimitAmps));
            }
            if (p.sinkAmps() > pinLimitAmps) {
                w.add(pinWarning(p.bit(), "sinks", p.sinkAmps(), p.sinkCode(), pinLimitAmps));
            }
        }
        List<Warning> kept = w;
        if (w.size() > MAX_WARNINGS) {
            int more = w.size() - (MAX_WARNINGS - 1);
            kept = new ArrayList<>(w.subList(0, MAX_WARNINGS - 1));
            kept.add(Warning.other("... and " + more + " more warnings"));
        }
        return new LadderAnalysis(ladder, levels, ideal, lin, scan.pins(), scan.minOutputOhms(),
                scan.maxOutputOhms(), pinLimitAmps, kept);
    }

    private static Warning pinWarning(int bit, String verb, double amps, int code, double limit) {
        return new Warning(Warning.Kind.PIN_CURRENT, String.format(Locale.ROOT, "the pin of bit %d %s %s at code"
                + " %d, above the %s limit; use larger resistors and check the part's datasheet", bit, verb,
                Units.format(amps, "A"), code, Units.format(limit, "A")));
    }

    /**
     * This analysis with a built board's measured levels in place of the modelled ones: linearity is
     * recomputed against the same ideal transfer; wiring and pin currents stay modelled. The model's own
     * non-monotonic warning gives way to one about the measured board; {@code measured.origin()} names the
     * board in the warnings.
     *
     * @param measured the board's levels, at this ladder's bit depth
     * @throws InputError when the first and last measured levels are equal (no span to measure against)
     * @throws IllegalArgumentException when the bit depths differ
     */
    public LadderAnalysis withMeasuredLevels(LevelTable measured) {
        Checks.checkArgument(measured.bits() == levels.bits(), "measured levels have %d bits, the ladder %d",
                measured.bits(), levels.bits());
        String name = measured.origin();
        if (measured.volts(0) == measured.volts(measured.size() - 1)) {
            throw new InputError(name + ": the first and last levels are equal; there is no span to"
                    + " measure linearity against");
        }
        Linearity lin = Linearity.of(measured, ideal);
        List<Warning> w = new ArrayList<>();
        w.add(Warning.other("levels, linearity and plots are the measured ones of " + name + "; wiring and pin"
                + " currents are modelled"));
        if (!lin.isMonotonic()) {
            int worst = lin.worstDnlCode();
            w.add(new Warning(Warning.Kind.NOT_MONOTONIC, String.format(Locale.ROOT, "the measured board is not"
                    + " monotonic: %d inverted steps, worst DNL %+.3f LSB at code %d", lin.invertedSteps().length,
                    lin.dnlLsb(worst), worst)));
        }
        for (Warning modelled : warnings) {
            if (!modelled.is(Warning.Kind.NOT_MONOTONIC)) {
                w.add(modelled);
            }
        }
        return new LadderAnalysis(ladder, measured, ideal, lin, pinCurrents, minOutputOhms, maxOutputOhms,
                pinLimitAmps, w.size() > MAX_WARNINGS ? w.subList(0, MAX_WARNINGS) : w);
    }

    /** The description analysed. */
    public LadderSpec spec() {
        return ladder.spec();
    }
}
