package org.rungtone.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeSet;
import java.util.concurrent.Callable;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Units;
import org.rungtone.ladder.DesignProposal;
import org.rungtone.ladder.ESeries;
import org.rungtone.ladder.Ladder;
import org.rungtone.ladder.LadderAnalysis;
import org.rungtone.ladder.LadderDesigner;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.Linearity;
import org.rungtone.ladder.MonteCarlo;
import org.rungtone.ladder.MonteCarloResult;
import org.rungtone.ladder.Part;
import org.rungtone.ladder.PinCurrent;
import org.rungtone.ladder.Spread;
import org.rungtone.ladder.Stats;
import org.rungtone.project.Boards;
import org.rungtone.report.Json;
import org.rungtone.report.Plots;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;

/** {@code rungtone ladder}: analyse or design a resistor-ladder DAC. */
@Command(name = "ladder",
        header = "Model a ladder: every level, linearity, Monte Carlo spread, resistor picks.",
        mixinStandardHelpOptions = true, sortOptions = false,
        versionProvider = Version.Provider.class,
        description = {
            "Models a resistor-ladder DAC exactly, pins, load and buffer included, and prints its wiring,"
                + " the level of every code, linearity after IEEE 1658 (LSB, offset and gain error, DNL, INL,"
                + " monotonicity) and worst-case pin currents; with --monte-carlo, the spread over boards"
                + " built from real parts; with --design, preferred values that keep INL low. Writes"
                + " levels.csv and transfer, DNL and INL plots to --out."},
        footer = {"",
            "Example, a bench sweep generator (6-bit R-2R, 1%% parts, 3.3 V pins):",
            "  rungtone ladder --topology r2r --bits 6 --base-r 10k --tolerance 1%% \\",
            "      --logic-high 3.3V --monte-carlo 2000 --seed 7 \\",
            "      --design --series E24 --pin-limit 8mA --out sweep-ladder",
            "prints the wiring, every level, INL and DNL, the share of 2000 boards",
            "that are monotonic, and E24 values with the lowest INL; writes",
            "levels.csv and PNG plots into sweep-ladder/.",
            "From a file:",
            "  rungtone ladder --ladder examples/ladders/door-chime-weighted.toml",
            "",
            "Pin currents are model estimates for the DC state of each code. GPIO",
            "current limits (per pin and per port) differ between parts: the",
            "microcontroller's datasheet is the authority; --pin-limit only compares",
            "against the figure you give it."})
public final class LadderCommand implements Callable<Integer> {
    private static final int MAX_BOARDS = 2_000_000;

    @Mixin
    CommonOptions common;

    @Mixin
    LadderOptions ladder;

    @Mixin
    UnitOptions unit;

    @Option(names = "--bits", paramLabel = "N", description = "Bit depth 1..16 (default: the ladder's, else 8).")
    int bits;

    @Option(names = "--pin-names", split = ",", paramLabel = "NAME",
            description = "Names of the pins driving bits 0.. for the wiring table, e.g. PB0,PB1 (default D0..).")
    List<String> pinNames;

    @Option(names = "--all-levels", description = "Print every code's level (default: all up to 64 codes).")
    boolean allLevels;

    @Option(names = "--monte-carlo", paramLabel = "K",
            description = "Simulate K boards with resistor values drawn within tolerance.")
    Integer boards;

    @Option(names = "--seed", paramLabel = "N", description = "Seed of the Monte Carlo draws (default 1).")
    long seed = 1;

    @Option(names = "--gaussian-sigma", paramLabel = "<percent>",
            description = "Draw values from a Gaussian of this relative sigma instead of uniform within tolerance.")
    String gaussianSigma;

    @Option(names = "--design", description = "Propose values from --series (default E24) that minimise worst INL.")
    boolean design;

    @Option(names = "--pin-limit", paramLabel = "<amps>",
            description = "Warn when a pin sources or sinks more than this, such as 20mA; see the part's datasheet.")
    String pinLimit;

    @Option(names = "--out", paramLabel = "DIR", description = "Output folder (default ${DEFAULT-VALUE}).")
    Path out = Path.of("rungtone-out", "ladder");

    @Option(names = "--json", description = "Print JSON instead of text.")
    boolean json;

    @picocli.CommandLine.Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        double limit = pinLimit == null ? Double.POSITIVE_INFINITY : positive("--pin-limit", pinLimit, "A");
        Spread spread = gaussianSigma == null ? Spread.uniform() : gaussian();
        if (boards != null && (boards < 1 || boards > MAX_BOARDS)) {
            throw new InputError("--monte-carlo: need 1.." + MAX_BOARDS + " boards, got " + boards);
        }
        AtomicFiles.checkFolderUsable(out);
        Boards.Board board = unit.resolve(bits, ladder, true);
        LadderSpec ladderSpec = board.spec().orElseThrow();
        List<String> pins = pins(ladderSpec.bits());
        LadderAnalysis analysis = LadderAnalysis.of(ladderSpec, limit);
        if (board.profile().isPresent()) {
            analysis = UnitOptions.withLevels(analysis, board.profile().get());
            if (!common.quiet) {
                board.warnings().forEach(w -> spec.commandLine().getErr().println("rungtone: warning: " + w));
            }
        }
        MonteCarloResult mc = boards == null ? null
                : new MonteCarlo(boards, seed, spread).run(Ladder.nominal(ladderSpec),
                        new Progress(boards, (long) boards << ladderSpec.bits()));
        DesignProposal proposal = design
                ? LadderDesigner.propose(ladderSpec, ladderSpec.series().orElse(ESeries.E24)) : null;
        LadderAnalysis proposed = proposal == null ? null : LadderAnalysis.of(proposal.proposedLadder(), limit);
        List<String> files = writeFiles(analysis, mc);
        PrintWriter o = spec.commandLine().getOut();
        if (json) {
            o.print(Json.toJson(JsonView.of(analysis, pins, mc, proposal, proposed, files)));
        } else if (!common.quiet) {
            o.print(Text.of(analysis, pins, allLevels, mc, proposal, proposed, files));
        }
        o.flush();
        return 0;
    }

    private Spread gaussian() {
        if (!gaussianSigma.trim().endsWith("%")) {
            throw new InputError("--gaussian-sigma: write it as a percentage, e.g. 1.7%");
        }
        double sigma = positive("--gaussian-sigma", gaussianSigma, "%");
        if (sigma > 0.5) {
            throw new InputError("--gaussian-sigma: must be at most 50%, got " + gaussianSigma);
        }
        return Spread.gaussian(sigma);
    }

    private static double positive(String option, String text, String unit) {
        double v;
        try {
            v = Units.parse(text, unit);
        } catch (InputError e) {
            throw new InputError(option + ": " + e.getMessage(), e);
        }
        if (!(v > 0) || Double.isInfinite(v)) {
            throw new InputError(option + ": must be a positive value, got " + text);
        }
        return v;
    }

    private List<String> pins(int n) {
        if (pinNames == null) {
            List<String> names = new ArrayList<>();
            for (int i = 0; i < n; i++) {
                names.add("D" + i);
            }
            return names;
        }
        if (pinNames.size() != n) {
            throw new InputError("--pin-names: expected " + n + " names for " + n + " bits, bit 0 first, got "
                    + pinNames.size());
        }
        return List.copyOf(pinNames);
    }

    private List<String> writeFiles(LadderAnalysis a, MonteCarloResult mc) {
        AtomicFiles.prepareFolder(out);
        List<String> files = new ArrayList<>();
        Path csv = out.resolve("levels.csv");
        AtomicFiles.writeString(csv, csv(a));
        files.add(csv.toString());
        for (Plots.Chart chart : Charts.of(a, mc)) {
            Path png = out.resolve(Charts.fileName(chart));
            // the transfer curve rises to the right: keep its legend out of the way
            Plots.write(png, chart, chart.title().startsWith("Transfer") ? Plots.Legend.BOTTOM_RIGHT
                    : Plots.Legend.TOP_RIGHT);
            files.add(png.toString());
        }
        return files;
    }

    private static String csv(LadderAnalysis a) {
        Linearity lin = a.linearity();
        StringBuilder sb = new StringBuilder();
        CSVFormat format = CSVFormat.DEFAULT.builder().setRecordSeparator("\n")
                .setHeader("code", "bits", "volts", "ideal_volts", "dnl_lsb", "inl_lsb", "inl_best_fit_lsb")
                .build();
        try (CSVPrinter p = new CSVPrinter(sb, format)) {
            int n = a.levels().size();
            for (int k = 0; k < n; k++) {
                p.printRecord(k, Text.binary(k, a.spec().bits()),
                        String.format(Locale.ROOT, "%.9f", a.levels().volts(k)),
                        String.format(Locale.ROOT, "%.9f", a.ideal().volts(k)),
                        String.format(Locale.ROOT, "%.6f", lin.dnlLsb(k)),
                        String.format(Locale.ROOT, "%.6f", lin.inlLsb(k)),
                        String.format(Locale.ROOT, "%.6f", lin.inlBestFitLsb(k)));
            }
        } catch (IOException e) {
            throw new IllegalStateException("CSV to memory failed", e);
        }
        return sb.toString();
    }

    /** Prints Monte Carlo progress on a terminal; silent when output is piped or quiet. */
    private final class Progress implements java.util.function.IntConsumer {
        private final int total;
        private final boolean show;
        private int shownPercent = -1;

        /** Shows progress when the run is long: about a second or more of level evaluations. */
        Progress(int total, long codeEvaluations) {
            this.total = total;
            this.show = System.console() != null && !common.quiet && !json && codeEvaluations >= 1L << 26;
        }

        @Override
        public synchronized void accept(int done) {
            if (!show) {
                return;
            }
            int percent = (int) (100L * done / total);
            if (percent != shownPercent) {
                shownPercent = percent;
                PrintWriter err = spec.commandLine().getErr();
                err.print(done == total ? "\r                                        \r"
                        : String.format(Locale.ROOT, "\rMonte Carlo: %3d%% of %d boards", percent, total));
                err.flush();
            }
        }
    }

    /** The text report. */
    static final class Text {
        private final StringBuilder sb = new StringBuilder();

        private Text line(String format, Object... args) {
            sb.append(String.format(Locale.ROOT, format, args).stripTrailing()).append('\n');
            return this;
        }

        static String of(LadderAnalysis a, List<String> pins, boolean all, MonteCarloResult mc,
                DesignProposal d, LadderAnalysis proposed, List<String> files) {
            Text t = new Text();
            t.header(a);
            t.wiring(a, pins);
            t.levels(a, all);
            t.linearity(a);
            t.pinCurrents(a.pinCurrents(), pins, a.pinLimitAmps());
            if (mc != null) {
                t.monteCarlo(mc);
            }
            if (d != null) {
                t.design(a.spec(), d, proposed);
            }
            List<String> warnings = new ArrayList<>(a.warnings());
            if (proposed != null) {
                for (String w : proposed.warnings()) {
                    warnings.add("proposal: " + w);
                }
            }
            if (!warnings.isEmpty()) {
                t.line("\nWarnings");
                for (String w : warnings) {
                    t.line("  ! %s", w);
                }
            }
            t.line("\nWrote %s", String.join(", ", files));
            return t.sb.toString();
        }

        static String binary(int code, int bits) {
            StringBuilder b = new StringBuilder();
            for (int i = bits - 1; i >= 0; i--) {
                b.append((code >> i) & 1);
            }
            return b.toString();
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
            line("\nLevels%s", all || a.levels().size() <= 64 ? "" : " (selected codes; every code is in levels.csv)");
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

    /** All codes to print in the level table: every code up to 64, else the ends, mid-scale and the worst. */
    static TreeSet<Integer> codesToPrint(LadderAnalysis a, boolean all) {
        int n = a.levels().size();
        TreeSet<Integer> codes = new TreeSet<>();
        if (all || n <= 64) {
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

    /** The JSON report: insertion-ordered maps with units in the key names. */
    static final class JsonView {
        private JsonView() {
        }

        static Map<String, Object> of(LadderAnalysis a, List<String> pins, MonteCarloResult mc,
                DesignProposal d, LadderAnalysis proposed, List<String> files) {
            LadderSpec s = a.spec();
            Map<String, Object> root = new LinkedHashMap<>();
            Map<String, Object> desc = new LinkedHashMap<>();
            desc.put("topology", s.topology().key());
            desc.put("bits", s.bits());
            desc.put("series", s.series().map(Enum::name).orElse("none"));
            desc.put("tolerance", s.tolerance());
            desc.put("logic_high_v", s.logicHighVolts());
            desc.put("logic_low_v", s.logicLowVolts());
            desc.put("pin_r_high_ohm", s.pinROhmsHigh());
            desc.put("pin_r_low_ohm", s.pinROhmsLow());
            desc.put("load_ohm", s.loadOhms());
            Map<String, Object> buffer = new LinkedHashMap<>();
            buffer.put("gain", s.buffer().gain());
            buffer.put("out_min_v", s.buffer().outMinVolts());
            buffer.put("out_max_v", s.buffer().outMaxVolts());
            desc.put("buffer", buffer);
            root.put("ladder", desc);
            List<Map<String, Object>> wiring = new ArrayList<>();
            for (Part p : a.ladder().parts()) {
                Map<String, Object> m = new LinkedHashMap<>();
                m.put("part", p.label());
                m.put("bit", p.bit());
                m.put("pin", p.role() == Part.Role.LEG ? pins.get(p.bit()) : null);
                m.put("ohm", p.ohms());
                wiring.add(m);
            }
            root.put("wiring", wiring);
            root.put("levels_v", a.levels().levels());
            root.put("ideal_v", a.ideal().levels());
            root.put("linearity", linearity(a.linearity()));
            Map<String, Object> outOhm = new LinkedHashMap<>();
            outOhm.put("min", a.minOutputOhms());
            outOhm.put("max", a.maxOutputOhms());
            root.put("output_ohm", outOhm);
            root.put("pin_limit_a", a.pinLimitAmps());
            root.put("pin_currents", pinJson(a.pinCurrents(), pins));
            if (mc != null) {
                root.put("monte_carlo", monteCarlo(mc));
            }
            if (d != null) {
                root.put("design", design(s, d, proposed));
            }
            root.put("warnings", a.warnings());
            root.put("files", files);
            return root;
        }

        private static Map<String, Object> linearity(Linearity lin) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("lsb_v", lin.lsbVolts());
            m.put("ideal_lsb_v", lin.idealLsbVolts());
            m.put("offset_error_v", lin.offsetErrorVolts());
            m.put("offset_error_lsb", lin.offsetErrorLsb());
            m.put("gain_error_percent", lin.gainErrorPercent());
            m.put("gain_error_lsb", lin.gainErrorLsb());
            m.put("worst_dnl_lsb", lin.dnlLsb(lin.worstDnlCode()));
            m.put("worst_dnl_code", lin.worstDnlCode());
            m.put("worst_inl_lsb", lin.inlLsb(lin.worstInlCode()));
            m.put("worst_inl_code", lin.worstInlCode());
            m.put("worst_inl_best_fit_lsb", lin.inlBestFitLsb(lin.worstInlBestFitCode()));
            m.put("worst_inl_best_fit_code", lin.worstInlBestFitCode());
            m.put("monotonic", lin.isMonotonic());
            m.put("inverted_steps", lin.invertedSteps());
            return m;
        }

        private static Map<String, Object> monteCarlo(MonteCarloResult mc) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("boards", mc.boards());
            m.put("seed", mc.seed());
            m.put("spread", mc.spread().describe(mc.tolerance()));
            m.put("worst_dnl_lsb", statsJson(mc.worstDnlStats()));
            m.put("worst_inl_lsb", statsJson(mc.worstInlStats()));
            m.put("worst_inl_best_fit_lsb", statsJson(mc.worstInlBestFitStats()));
            m.put("sinad_db", statsJson(mc.sinadStats()));
            m.put("enob_bits", statsJson(mc.enobStats()));
            m.put("monotonic_fraction", mc.monotonicFraction());
            m.put("monotonic_interval_95", mc.monotonicInterval95());
            m.put("nominal_sinad_db", mc.nominalSinadDb());
            return m;
        }

        private static Map<String, Object> design(LadderSpec s, DesignProposal d, LadderAnalysis proposed) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("series", d.series().name());
            List<Map<String, Object>> parts = new ArrayList<>();
            for (int i = 0; i < s.parts().size(); i++) {
                Map<String, Object> p = new LinkedHashMap<>();
                p.put("part", s.parts().get(i).label());
                p.put("ideal_ohm", d.idealOhms().get(i));
                p.put("nearest", d.naive().get(i).describe());
                p.put("proposal", d.proposed().get(i).describe());
                p.put("proposal_ohm", d.proposed().get(i).ohms());
                parts.add(p);
            }
            m.put("parts", parts);
            m.put("nearest_worst_inl_lsb", d.naiveLinearity().maxAbsInlLsb());
            m.put("nearest_worst_dnl_lsb", d.naiveLinearity().maxAbsDnlLsb());
            m.put("proposal_worst_inl_lsb", d.proposedLinearity().maxAbsInlLsb());
            m.put("proposal_worst_dnl_lsb", d.proposedLinearity().maxAbsDnlLsb());
            m.put("proposal_monotonic", d.proposedLinearity().isMonotonic());
            m.put("proposal_resistors", d.partCount());
            m.put("proposal_warnings", proposed.warnings());
            return m;
        }
    }

    /** Pin currents as a list of maps for JSON. */
    static List<Map<String, Object>> pinJson(List<PinCurrent> pins, List<String> names) {
        List<Map<String, Object>> out = new ArrayList<>();
        for (PinCurrent p : pins) {
            Map<String, Object> m = new LinkedHashMap<>();
            m.put("bit", p.bit());
            m.put("pin", names.get(p.bit()));
            m.put("source_a", p.sourceAmps());
            m.put("source_code", p.sourceCode());
            m.put("sink_a", p.sinkAmps());
            m.put("sink_code", p.sinkCode());
            out.add(m);
        }
        return out;
    }

    /** Summary statistics for JSON. */
    static Map<String, Object> statsJson(Stats s) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("mean", s.mean());
        m.put("std_dev", s.stdDev());
        m.put("min", s.min());
        m.put("p01", s.p01());
        m.put("p10", s.p10());
        m.put("p50", s.p50());
        m.put("p90", s.p90());
        m.put("p99", s.p99());
        m.put("max", s.max());
        return m;
    }

    /** The PNG charts: transfer curve, DNL, INL and, after Monte Carlo, the share of boards per worst INL. */
    static final class Charts {
        private Charts() {
        }

        static String fileName(Plots.Chart chart) {
            return chart.title().startsWith("Transfer") ? "transfer.png" : chart.title().startsWith("DNL")
                    ? "dnl.png" : chart.title().startsWith("INL") ? "inl.png" : "monte-carlo.png";
        }

        static List<Plots.Chart> of(LadderAnalysis a, MonteCarloResult mc) {
            int n = a.levels().size();
            Plots.Style style = n <= 64 ? Plots.Style.LINE_AND_MARKERS : Plots.Style.LINE;
            Linearity lin = a.linearity();
            String what = " (" + a.spec().describe() + ")";
            List<Plots.Chart> charts = new ArrayList<>();
            charts.add(new Plots.Chart("Transfer curve" + what, "code", "output (V)", false, List.of(
                    envelope("modelled", a.levels().levels(), style),
                    envelope("ideal", a.ideal().levels(), Plots.Style.DASHED))));
            charts.add(new Plots.Chart("DNL" + what, "code", "DNL (LSB)", false, List.of(
                    envelope("DNL", lin.dnlLsb(), style))));
            charts.add(new Plots.Chart("INL" + what, "code", "INL (LSB)", false, List.of(
                    envelope("endpoint line", lin.inlLsb(), style),
                    envelope("best-fit line", lin.inlBestFitLsb(), Plots.Style.DASHED))));
            if (mc != null) {
                charts.add(new Plots.Chart("Monte Carlo, " + mc.boards() + " boards" + what, "worst |error| (LSB)",
                        "boards at or below (%)", false, List.of(
                        share("worst |INL|", mc.worstInlLsb()), share("worst |DNL|", mc.worstDnlLsb()))));
            }
            return charts;
        }

        /**
         * A series over codes; above 2048 codes, each of 1024 runs of codes keeps only its lowest and highest
         * point, so spikes survive and the chart stays quick to draw.
         */
        static Plots.Series envelope(String name, double[] y, Plots.Style style) {
            int n = y.length;
            if (n <= 2048) {
                double[] x = new double[n];
                for (int k = 0; k < n; k++) {
                    x[k] = k;
                }
                return new Plots.Series(name, x, y, style);
            }
            int run = (n + 1023) / 1024;
            double[] xs = new double[2 * ((n + run - 1) / run)];
            double[] ys = new double[xs.length];
            int m = 0;
            for (int start = 0; start < n; start += run) {
                int lo = start;
                int hi = start;
                for (int k = start; k < Math.min(n, start + run); k++) {
                    lo = y[k] < y[lo] ? k : lo;
                    hi = y[k] > y[hi] ? k : hi;
                }
                for (int k : lo == hi ? new int[] {lo} : new int[] {Math.min(lo, hi), Math.max(lo, hi)}) {
                    xs[m] = k;
                    ys[m++] = y[k];
                }
            }
            return new Plots.Series(name, java.util.Arrays.copyOf(xs, m), java.util.Arrays.copyOf(ys, m), style);
        }

        /** Percent of boards: uneven steps that show the tails (and keep XChart's ticks readable). */
        private static final double[] SHARES = {0, 0.1, 0.5, 1, 2, 5, 10, 20, 30, 40, 50, 60, 70, 80, 90, 95,
            98, 99, 99.5, 99.9, 100};

        /** The empirical distribution: the nearest-rank value at each share of boards. */
        private static Plots.Series share(String name, double[] values) {
            double[] sorted = values.clone();
            java.util.Arrays.sort(sorted);
            int n = sorted.length;
            double[] x = new double[SHARES.length];
            for (int i = 0; i < x.length; i++) {
                int rank = (int) Math.ceil(SHARES[i] / 100 * n) - 1;
                x[i] = sorted[Math.max(0, Math.min(n - 1, rank))];
            }
            return new Plots.Series(name, x, SHARES.clone(), Plots.Style.LINE);
        }
    }
}
