package org.rungtone.report;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.TreeSet;
import org.rungtone.internal.Units;
import org.rungtone.internal.Warning;
import org.rungtone.ladder.DesignProposal;
import org.rungtone.ladder.LadderAnalysis;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LadderStudy;
import org.rungtone.ladder.Linearity;
import org.rungtone.ladder.MonteCarloResult;
import org.rungtone.ladder.Part;
import org.rungtone.ladder.PinCurrent;
import org.rungtone.ladder.Stats;

/**
 * The ladder report for people: wiring, the level table, linearity, pin currents, the Monte Carlo spread, the
 * design proposal and the warnings, as aligned text. {@link #json} gives the same facts for machines.
 */
public final class LadderReport {
    /** Up to this many codes, the level table shows every code. */
    private static final int ALL_CODES_UP_TO = 64;

    private final StringBuilder sb = new StringBuilder();

    private LadderReport() {
    }

    /**
     * The text report.
     *
     * @param study what to report
     * @param allLevels true to list every code's level, however many
     * @param files the files written, named in the last line
     */
    public static String text(LadderStudy study, boolean allLevels, List<String> files) {
        LadderAnalysis a = study.analysis();
        List<String> pins = study.pinNames();
        LadderReport t = new LadderReport();
        t.header(a);
        t.wiring(a, pins);
        t.levels(a, allLevels);
        t.linearity(a);
        t.pinCurrents(a.pinCurrents(), pins, a.pinLimitAmps());
        study.monteCarlo().ifPresent(t::monteCarlo);
        study.design().ifPresent(d -> t.design(a.spec(), d.proposal(), d.analysis()));
        List<String> warnings = new ArrayList<>(Warning.texts(a.warnings()));
        study.design().ifPresent(d -> d.analysis().warnings().forEach(w -> warnings.add("proposal: " + w.text())));
        if (!warnings.isEmpty()) {
            t.line("\nWarnings");
            for (String w : warnings) {
                t.line("  ! %s", w);
            }
        }
        t.line("\nWrote %s", String.join(", ", files));
        return t.sb.toString();
    }

    /**
     * The JSON report ({@code docs/schema/ladder.schema.json}): insertion-ordered maps with units in the key
     * names.
     *
     * @param study what to report
     * @param files the files written
     * @param outDir the output folder, which the report's paths are relative to
     * @param toolVersion the Rungtone version
     */
    public static String json(LadderStudy study, List<String> files, Path outDir, String toolVersion) {
        return Json.toJson(LadderJson.of(study, files, outDir, toolVersion));
    }

    /** A code as binary digits, the highest bit first. */
    static String binary(int code, int bits) {
        StringBuilder b = new StringBuilder();
        for (int i = bits - 1; i >= 0; i--) {
            b.append((code >> i) & 1);
        }
        return b.toString();
    }

    /** All codes to print in the level table: every code up to 64, else the ends, mid-scale and the worst. */
    static TreeSet<Integer> codesToPrint(LadderAnalysis a, boolean all) {
        int n = a.levels().size();
        TreeSet<Integer> codes = new TreeSet<>();
        if (all || n <= ALL_CODES_UP_TO) {
            for (int k = 0; k < n; k++) {
                codes.add(k);
            }
            return codes;
        }
        for (int k = 0; k < 4; k++) {
            codes.add(k);
            codes.add(n / 2 - 2 + k);
            codes.add(n - 4 + k);
        }
        Linearity lin = a.linearity();
        codes.add(lin.worstDnlCode());
        codes.add(lin.worstInlCode());
        codes.add(lin.worstInlBestFitCode());
        for (int k : lin.invertedSteps()) {
            if (codes.size() < 40) {
                codes.add(k);
            }
        }
        return codes;
    }

    private void line(String format, Object... args) {
        sb.append(String.format(Locale.ROOT, format, args).stripTrailing()).append('\n');
    }

    private void header(LadderAnalysis a) {
        LadderSpec s = a.spec();
        line("Ladder: %s%s", s.describe(), s.series().map(e -> ", " + e + " series").orElse(""));
        line("  pins %s / %s through %s high / %s low; load %s; buffer gain %s, swing %s .. %s",
                v(s.logicLowVolts()), v(s.logicHighVolts()), ohm(s.pinROhmsHigh()), ohm(s.pinROhmsLow()),
                Double.isInfinite(s.loadOhms()) ? "none" : ohm(s.loadOhms()), Units.format(s.buffer().gain(), ""),
                v(s.buffer().outMinVolts()), v(s.buffer().outMaxVolts()));
        line("  output resistance of the ladder %s .. %s over all codes",
                ohm(a.minOutputOhms()), ohm(a.maxOutputOhms()));
    }

    private void wiring(LadderAnalysis a, List<String> pins) {
        boolean r2r = !a.spec().topology().isSumming();
        line("\nWiring, bit 0 (LSB) first%s", r2r ? "; the rung joins the node of this bit to the next" : "");
        line("  %-4s %-8s %-10s %s", "bit", "pin", "leg", r2r ? "rung" : "");
        List<Part> parts = a.ladder().parts();
        int n = a.spec().bits();
        for (int i = 0; i < n; i++) {
            String rung = r2r && i + 1 < n ? ohm(parts.get(n + i).ohms()) : "";
            line("  %-4d %-8s %-10s %s", i, pins.get(i), ohm(parts.get(i).ohms()), rung);
        }
        if (r2r) {
            line("  termination %s from the node of bit 0 to ground; output at the node of bit %d",
                    ohm(parts.get(parts.size() - 1).ohms()), n - 1);
        }
    }

    private void levels(LadderAnalysis a, boolean all) {
        Linearity lin = a.linearity();
        int bits = a.spec().bits();
        line("\nLevels%s", all || a.levels().size() <= ALL_CODES_UP_TO ? ""
                : " (selected codes; every code is in levels.csv)");
        line("  %6s  %-" + Math.max(4, bits) + "s  %10s  %10s  %9s  %9s", "code", "bits", "volts", "ideal",
                "DNL LSB", "INL LSB");
        int previous = -1;
        for (int k : codesToPrint(a, all)) {
            if (previous >= 0 && k != previous + 1) {
                line("  %6s", "...");
            }
            line("  %6d  %-" + Math.max(4, bits) + "s  %10.5f  %10.5f  %9s  %+9.4f", k, binary(k, bits),
                    a.levels().volts(k), a.ideal().volts(k),
                    k == 0 ? "-" : String.format(Locale.ROOT, "%+9.4f", lin.dnlLsb(k)), lin.inlLsb(k));
            previous = k;
        }
    }

    private void linearity(LadderAnalysis a) {
        Linearity lin = a.linearity();
        line("\nLinearity (IEEE 1658)");
        line("  LSB               %s (ideal %s)", v(lin.lsbVolts()), v(lin.idealLsbVolts()));
        line("  offset error      %s (%+.3f LSB)", v(lin.offsetErrorVolts()), lin.offsetErrorLsb());
        line("  gain error        %+.3f %% (%+.3f LSB)", lin.gainErrorPercent(), lin.gainErrorLsb());
        line("  worst DNL         %+.4f LSB at code %d", lin.dnlLsb(lin.worstDnlCode()), lin.worstDnlCode());
        line("  worst INL         %+.4f LSB at code %d (endpoint line)", lin.inlLsb(lin.worstInlCode()),
                lin.worstInlCode());
        line("                    %+.4f LSB at code %d (best-fit line)",
                lin.inlBestFitLsb(lin.worstInlBestFitCode()), lin.worstInlBestFitCode());
        int[] inv = lin.invertedSteps();
        line("  monotonic         %s", lin.isMonotonic() ? "yes"
                : "no, " + inv.length + " inverted step" + (inv.length == 1 ? "" : "s")
                + (inv.length > 0 ? " (first at code " + inv[0] + ")" : ", flat steps"));
    }

    private void pinCurrents(List<PinCurrent> pins, List<String> names, double limit) {
        line("\nPin currents, worst case over all codes%s (model estimates; the datasheet sets the limits)",
                Double.isInfinite(limit) ? "" : ", limit " + Units.format(limit, "A"));
        line("  %-4s %-8s %10s %8s %10s %8s", "bit", "pin", "sources", "at code", "sinks", "at code");
        for (PinCurrent p : pins) {
            line("  %-4d %-8s %10s %8d %10s %8d", p.bit(), names.get(p.bit()), Units.format(p.sourceAmps(), "A"),
                    p.sourceCode(), Units.format(p.sinkAmps(), "A"), p.sinkCode());
        }
    }

    private void monteCarlo(MonteCarloResult mc) {
        line("\nMonte Carlo: %d boards, values %s, seed %d", mc.boards(), mc.spread().describe(mc.tolerance()),
                mc.seed());
        line("  %-22s %9s %9s %9s %9s %9s", "", "median", "p90", "p99", "worst", "mean");
        stat("worst |DNL| (LSB)", mc.worstDnlStats(), false);
        stat("worst |INL| (LSB)", mc.worstInlStats(), false);
        stat("  best-fit line (LSB)", mc.worstInlBestFitStats(), false);
        line("  %-22s %9s %9s %9s %9s %9s", "", "median", "p10", "p1", "worst", "mean");
        stat("SINAD (dB), sine", mc.sinadStats(), true);
        stat("ENOB (bits)", mc.enobStats(), true);
        double[] ci = mc.monotonicInterval95();
        line("  monotonic boards   %.1f %% (%d of %d; 95 %% interval %.1f .. %.1f %%)",
                100 * mc.monotonicFraction(),
                mc.monotonicBoards(), mc.boards(), 100 * ci[0], 100 * ci[1]);
        line("  nominal board SINAD %.2f dB", mc.nominalSinadDb());
    }

    private void stat(String name, Stats s, boolean higherIsBetter) {
        if (higherIsBetter) {
            line("  %-22s %9.3f %9.3f %9.3f %9.3f %9.3f", name, s.p50(), s.p10(), s.p01(), s.min(), s.mean());
        } else {
            line("  %-22s %9.3f %9.3f %9.3f %9.3f %9.3f", name, s.p50(), s.p90(), s.p99(), s.max(), s.mean());
        }
    }

    private void design(LadderSpec s, DesignProposal d, LadderAnalysis proposed) {
        line("\nDesign from %s: nearest values against the proposal", d.series());
        line("  %-14s %10s %10s  %s", "part", "ideal", "nearest", "proposal");
        List<Part> parts = s.parts();
        for (int i = 0; i < parts.size(); i++) {
            line("  %-14s %10s %10s  %s", parts.get(i).label(), ohm(d.idealOhms().get(i)),
                    d.naive().get(i).describe(), d.proposed().get(i).describe());
        }
        Linearity n = d.naiveLinearity();
        Linearity p = d.proposedLinearity();
        line("  %-14s %10s %10.4f  %.4f", "worst |INL|", "LSB", n.maxAbsInlLsb(), p.maxAbsInlLsb());
        line("  %-14s %10s %10.4f  %.4f", "worst |DNL|", "LSB", n.maxAbsDnlLsb(), p.maxAbsDnlLsb());
        line("  %-14s %10s %10s  %s", "monotonic", "", n.isMonotonic() ? "yes" : "no",
                p.isMonotonic() ? "yes" : "no");
        line("  %-14s %10s %10d  %d", "resistors", "", d.naive().size(), d.partCount());
        double worst = 0;
        for (PinCurrent pc : proposed.pinCurrents()) {
            worst = Math.max(worst, pc.worstAmps());
        }
        line("  largest pin current of the proposal %s", Units.format(worst, "A"));
    }

    private static String v(double volts) {
        return Units.format(volts, "V");
    }

    private static String ohm(double ohms) {
        return Units.format(ohms, "");
    }
}
