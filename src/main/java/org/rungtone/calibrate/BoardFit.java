package org.rungtone.calibrate;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.apache.commons.math3.distribution.FDistribution;
import org.rungtone.internal.Checks;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LevelTable;

/**
 * Fits one board's readings: the superposition model ({@link Superposition}) and, where the readings
 * determine it, the switched-load model ({@link SwitchedLoad}), each by least squares with outlier
 * screening ({@code RobustFit}: studentised residuals against a median-absolute-deviation scale).
 *
 * <p>The richer model is chosen only when it is needed and supported: superposition's residual
 * {@code sqrt(RSS_A/(m − p_A))} must exceed twice the meter's floor {@code sqrt(q²/12 + s²)} (q the meter
 * step, s the repeat spread), and the nested-model F test
 * {@code F = ((RSS_A − RSS_B)/(p_B − p_A)) / (RSS_B/(m − p_B))} must reject superposition at the 0.1 % level
 * (e.g. Draper and Smith, Applied Regression Analysis, 3rd ed., §6.1), both on the codes the switched-load
 * fit kept. The profile's table is the chosen model at every code, clipped to the buffer's swing when given;
 * when every code was read, it is the readings themselves, with a few outliers (at most 2 % of codes)
 * replaced by the model.
 */
public final class BoardFit {
    /** The F test's significance level for choosing the switched-load model. */
    public static final double SIGNIFICANCE = 0.001;
    private static final int LIST_MAX = 12;

    private BoardFit() {
    }

    /**
     * What the fit knows beyond the readings.
     *
     * @param resolutionVolts the meter's step; 0 to take it from the readings' digits
     * @param minVolts the lowest level the board can produce (buffer swing), or NaN
     * @param maxVolts the highest level the board can produce, or NaN
     * @param keepReadings when every code was read, keep every reading in the table, outliers too (readings
     *     a program made, which no typing error can touch; the outliers are still reported)
     */
    public record Settings(double resolutionVolts, double minVolts, double maxVolts, boolean keepReadings) {
        /** Checks the values. */
        public Settings {
            Checks.checkArgument(resolutionVolts >= 0 && Double.isFinite(resolutionVolts),
                    "resolution must be 0 or positive: %s", resolutionVolts);
        }

        /** Settings for readings typed from a meter. */
        public Settings(double resolutionVolts, double minVolts, double maxVolts) {
            this(resolutionVolts, minVolts, maxVolts, false);
        }

        /** Resolution from the readings, no swing limit. */
        public static Settings defaults() {
            return new Settings(0, Double.NaN, Double.NaN);
        }
    }

    /** The switched-load fit, when the readings determine it and it is physical; else why not. */
    private record SwitchedTry(RobustFit.Outcome outcome, String note) {
    }

    private static SwitchedTry trySwitchedLoad(int bits, int[] codes, double[] values, double[] root,
            double floor) {
        int n = codes.length;
        int pb = 2 * bits + 1;
        if (n < pb + 1) {
            return new SwitchedTry(null, String.format(Locale.ROOT, "the switched-load model needs at least %d"
                    + " measured codes (2N + 2), there are %d", pb + 1, n));
        }
        SwitchedLoadFit b = new SwitchedLoadFit(bits, codes, values, root);
        RobustFit.Outcome ob = b.determined(RobustFit.rows(new boolean[n])) ? RobustFit.run(b, values, floor) : null;
        if (ob == null) {
            return new SwitchedTry(null, "the readings do not determine the switched-load model (each bit must also"
                    + " be high together with others)");
        }
        if (!usable((SwitchedLoad) b.model(ob.theta()))) {
            return new SwitchedTry(null, "the switched-load fit is not physical (its denominator reaches zero)");
        }
        return new SwitchedTry(ob, "");
    }

    /**
     * Fits the readings.
     *
     * @throws InputError when the readings do not determine the superposition model (naming the codes that
     *     are missing)
     */
    public static FitReport fit(Measurements m, Settings settings) {
        int bits = m.bits();
        List<CodeMean> means = m.means();
        int n = means.size();
        int[] codes = new int[n];
        double[] values = new double[n];
        double maxAbs = 0;
        for (int i = 0; i < n; i++) {
            codes[i] = means.get(i).code();
            values[i] = means.get(i).meanVolts();
            maxAbs = Math.max(maxAbs, Math.abs(values[i]));
        }
        List<Integer> missingBasis = new ArrayList<>();
        for (int c : basis(bits)) {
            if (!m.has(c)) {
                missingBasis.add(c);
            }
        }
        double q = settings.resolutionVolts() > 0 ? settings.resolutionVolts() : m.resolutionVolts();
        double spread = m.repeatSpreadVolts();
        double meter = Math.sqrt(q * q / 12 + spread * spread);
        double floor = Math.max(meter, 1e-9 * Math.max(maxAbs, 1e-3));
        double[] root = ReadingWeights.rootWeights(m, settings.resolutionVolts(), q, meter);
        double[] weighted = ReadingWeights.scaled(values, root);
        SuperpositionFit a = new SuperpositionFit(bits, codes, weighted, root);
        if (n == 0 || !a.determined(RobustFit.rows(new boolean[n]))) {
            throw new InputError(m.source() + ": cannot fit: no reading of " + describeCodes(missingBasis, bits)
                    + "; the superposition fit needs code 0 and each single-bit code (or other codes that"
                    + " stand in for them)" + alsoMissing(m, missingBasis));
        }

        RobustFit.Outcome oa = RobustFit.run(a, weighted, floor);
        SwitchedTry tried = trySwitchedLoad(bits, codes, weighted, root, floor);
        RobustFit.Outcome ob = tried.outcome();
        String bNote = tried.note();
        Choice choice = choose(a, weighted, ob, bNote, bits, floor);
        RobustFit.Outcome chosen = choice.useB ? ob : oa;
        BoardModel model = chosen.kind().model(chosen.theta());
        List<String> warnings = new ArrayList<>();
        List<CodeResidual> residuals = residuals(means, chosen, model, root);
        List<Integer> outliers = new ArrayList<>();
        for (int i : chosen.outliers()) {
            outliers.add(codes[i]);
        }
        Table table = table(m, model, outliers, settings, warnings);
        double[] levelSigmas = levelSigmas(chosen, m, table.measured, outliers, meter, root);
        uncertaintyWarning(levelSigmas, table, warnings);
        String reason = choice.reason + (table.measured ? "; every code was read, so the readings themselves are"
                + " the profile's table" : "");
        warn(m, missingBasis, residuals, outliers, table, warnings, bits);
        List<Double> sigmas = new ArrayList<>();
        for (double s : LeastSquares.parameterSigmas(chosen.rInverse(), chosen.scale())) {
            sigmas.add(s);
        }
        return new FitReport(m.source(), bits, m.readings().size(), new ArrayList<>(m.unmeasured()), q, spread,
                meter, summary(oa, a.key(), codes, root), ob == null
                        ? new ModelSummary("switched-load", Optional.empty(), 0, Double.NaN, Double.NaN, List.of(),
                                bNote)
                        : summary(ob, "switched-load", codes, root), model, reason, sigmas, residuals, outliers,
                table.levels, table.measured, java.util.Arrays.stream(levelSigmas).boxed().toList(), warnings);
    }

    /**
     * The standard deviation of every level of the table. A fitted level's is the prediction's,
     * {@code s·sqrt(g·(JᵀWJ)⁻¹·gᵀ)} for the model's gradient g at that code and the fit's scale s; a read
     * level's is its own floor (the file's over the square root of its weight) over the square root of its
     * count of readings.
     */
    private static double[] levelSigmas(RobustFit.Outcome o, Measurements m, boolean measured,
            List<Integer> outliers, double floor, double[] root) {
        int n = 1 << m.bits();
        double[] sigma = new double[n];
        for (int k = 0; k < n; k++) {
            sigma[k] = o.scale() * Math.sqrt(LeastSquares.leverage(o.kind().gradientAtCode(o.theta(), k),
                    o.rInverse()));
        }
        if (measured) {
            List<CodeMean> means = m.means();
            for (int i = 0; i < means.size(); i++) {
                CodeMean c = means.get(i);
                if (!outliers.contains(c.code())) {
                    sigma[c.code()] = floor / root[i] / Math.sqrt(c.count());
                }
            }
        }
        return sigma;
    }

    private static void uncertaintyWarning(double[] sigma, Table table, List<String> warnings) {
        if (table.measured) {
            return;
        }
        int worst = 0;
        for (int k = 1; k < sigma.length; k++) {
            worst = sigma[k] > sigma[worst] ? k : worst;
        }
        LevelTable t = table.levels;
        double lsb = (t.maxVolts() - t.minVolts()) / (t.size() - 1);
        if (sigma[worst] > lsb / 4) {
            int bits = t.bits();
            warnings.add(String.format(Locale.ROOT, "the fitted table is uncertain by up to %s (1 sigma) at code"
                    + " %d, more than a quarter LSB (%s); measure more check codes (--verify %d) or read each"
                    + " code several times", mv(sigma[worst]), worst, mv(lsb / 4), 4 * bits));
        }
    }

    /** Code 0, the all-ones code is not needed; each single-bit code is. */
    static int[] basis(int bits) {
        int[] b = new int[bits + 1];
        for (int i = 0; i < bits; i++) {
            b[i + 1] = 1 << i;
        }
        return b;
    }

    private record Choice(boolean useB, String reason) {
    }

    private static Choice choose(SuperpositionFit a, double[] values, RobustFit.Outcome ob, String bNote,
            int bits, double floor) {
        if (ob == null) {
            return new Choice(false, "superposition: " + bNote);
        }
        int[] kept = RobustFit.rows(ob.excluded());
        int pa = bits + 1;
        int pb = 2 * bits + 1;
        int dof = kept.length - pb;
        if (dof < 1) {
            return new Choice(false, "superposition: after leaving out outliers too few readings remain to test"
                    + " the switched-load model");
        }
        double[] thetaA = a.fit(kept);
        double rssA = 0;
        for (int i : kept) {
            double e = values[i] - a.predict(thetaA, i);
            rssA += e * e;
        }
        double rssB = ob.rss();
        double rmsA = Math.sqrt(rssA / (kept.length - pa));
        double rmsB = Math.sqrt(rssB / dof);
        double f = rssB > 0 ? ((rssA - rssB) / (pb - pa)) / (rssB / dof) : Double.POSITIVE_INFINITY;
        double p = f <= 0 ? 1 : Double.isInfinite(f) ? 0
                : 1 - new FDistribution(null, pb - pa, dof).cumulativeProbability(f);
        String test = String.format(Locale.ROOT, "F = %s, p %s", f > 1e6 ? "> 1e6" : fmt(f), p < 1e-6
                ? "< 1e-6" : "= " + String.format(Locale.ROOT, "%.2g", p));
        if (rmsA > 2 * floor && p < SIGNIFICANCE) {
            return new Choice(true, String.format(Locale.ROOT, "switched-load: superposition leaves %s rms, more"
                    + " than twice the meter's floor of %s, and the switched-load model brings it to %s (%s)",
                    mv(rmsA), mv(floor), mv(rmsB), test));
        }
        if (rmsA <= 2 * floor) {
            return new Choice(false, String.format(Locale.ROOT, "superposition: its residual of %s rms is within"
                    + " twice the meter's floor of %s, so the simpler model is kept (switched-load: %s rms, %s)",
                    mv(rmsA), mv(floor), mv(rmsB), test));
        }
        return new Choice(false, String.format(Locale.ROOT, "superposition: it leaves %s rms, but the"
                + " switched-load model does not improve it significantly (%s rms, %s)", mv(rmsA), mv(rmsB),
                test));
    }

    private static boolean usable(SwitchedLoad model) {
        double[] d = model.loadTerms();
        int n = 1 << d.length;
        double[] den = new double[n];
        den[0] = 1;
        for (int k = 1; k < n; k++) {
            den[k] = den[k & (k - 1)] + d[Integer.numberOfTrailingZeros(k)];
            if (!(den[k] > 0.05)) {
                return false;
            }
        }
        return true;
    }

    private static List<CodeResidual> residuals(List<CodeMean> means, RobustFit.Outcome o, BoardModel model,
            double[] root) {
        List<CodeResidual> out = new ArrayList<>();
        for (int i = 0; i < means.size(); i++) {
            CodeMean c = means.get(i);
            double t = o.score()[i];
            CodeResidual.Status status = o.excluded()[i] ? CodeResidual.Status.OUTLIER
                    : o.unchecked()[i] ? CodeResidual.Status.UNCHECKED
                    : Math.abs(t) > RobustFit.THRESHOLD ? CodeResidual.Status.SUSPECT : CodeResidual.Status.OK;
            out.add(new CodeResidual(c.code(), c.meanVolts(), c.count(), c.stdVolts(), model.volts(c.code()),
                    o.residual()[i] / root[i], t, status));
        }
        return out;
    }

    private static ModelSummary summary(RobustFit.Outcome o, String key, int[] codes, double[] root) {
        int kept = o.kept();
        int p = o.theta().length;
        double max = 0;
        for (int i = 0; i < codes.length; i++) {
            if (!o.excluded()[i]) {
                max = Math.max(max, Math.abs(o.residual()[i] / root[i]));
            }
        }
        List<Integer> outliers = new ArrayList<>();
        for (int i : o.outliers()) {
            outliers.add(codes[i]);
        }
        double rms = kept > p ? Math.sqrt(o.rss() / (kept - p)) : Double.NaN;
        return new ModelSummary(key, Optional.of(o.kind().model(o.theta())), kept, rms, max, outliers, "");
    }

    private record Table(LevelTable levels, boolean measured, int replaced) {
    }

    private static Table table(Measurements m, BoardModel model, List<Integer> outliers, Settings s,
            List<String> warnings) {
        int bits = m.bits();
        double[] v = model.levels();
        if (m.everyCode()) {
            double[] measured = new double[v.length];
            for (CodeMean c : m.means()) {
                measured[c.code()] = c.meanVolts();
            }
            int limit = Math.max(1, v.length / 50);
            int replaced = 0;
            if (s.keepReadings()) {
                return new Table(LevelTable.of(bits, measured, "measured"), true, 0);
            }
            if (outliers.size() <= limit) {
                for (int c : outliers) {
                    measured[c] = v[c];
                    replaced++;
                }
            } else {
                warnings.add(String.format(Locale.ROOT, "%d codes do not fit the %s model (more than 2 %%); the"
                        + " table keeps them as read: check the board for clipping or a loose probe",
                        outliers.size(), model.key()));
            }
            return new Table(LevelTable.of(bits, measured, "measured"), true, replaced);
        }
        int clipped = 0;
        for (int k = 0; k < v.length; k++) {
            if (!Double.isNaN(s.minVolts()) && v[k] < s.minVolts()) {
                v[k] = s.minVolts();
                clipped++;
            } else if (!Double.isNaN(s.maxVolts()) && v[k] > s.maxVolts()) {
                v[k] = s.maxVolts();
                clipped++;
            }
        }
        if (clipped > 0) {
            warnings.add(String.format(Locale.ROOT, "the %s model puts %d code%s beyond the buffer's swing of %s"
                    + " .. %s; clipped to it", model.key(), clipped, clipped == 1 ? "" : "s", volts(s.minVolts()),
                    volts(s.maxVolts())));
        }
        return new Table(LevelTable.of(bits, v, "fitted " + model.key()), false, 0);
    }

    private static void warn(Measurements m, List<Integer> missingBasis, List<CodeResidual> residuals,
            List<Integer> outliers, Table table, List<String> warnings, int bits) {
        List<Integer> notRead = new ArrayList<>(m.unmeasured());
        for (int c : missingBasis) {
            if (!notRead.contains(c)) {
                notRead.add(c);
            }
        }
        notRead.sort(null);
        if (!notRead.isEmpty()) {
            warnings.add(0, "not measured: " + describeCodes(notRead, bits) + "; the fit proceeds: every bit is"
                    + " still determined by the " + residuals.size() + " codes that were read");
        }
        if (!outliers.isEmpty()) {
            warnings.add("left out as outlier" + (outliers.size() == 1 ? " (mistyped, or measured at another"
                    + " code?): code " : "s (mistyped, or measured at other codes?): codes ") + list(outliers)
                    + (table.replaced > 0 ? "; the table takes the model's level for " + (outliers.size() == 1
                            ? "it" : "them") : "")
                    + "; measure " + (outliers.size() == 1 ? "it" : "them") + " again to be sure");
        }
        List<Integer> suspects = new ArrayList<>();
        int unchecked = 0;
        for (CodeResidual r : residuals) {
            if (r.status() == CodeResidual.Status.SUSPECT) {
                suspects.add(r.code());
            } else if (r.status() == CodeResidual.Status.UNCHECKED) {
                unchecked++;
            }
        }
        if (!suspects.isEmpty()) {
            warnings.add((suspects.size() == 1 ? "code " + list(suspects) + " does" : "codes " + list(suspects)
                    + " do") + " not fit, but no other reading can stand in for it; measure again");
        }
        if (unchecked == residuals.size()) {
            warnings.add("no reading checks another (as many parameters as codes): a typo would go unnoticed;"
                    + " measure the plan's check codes too");
        }
    }

    /** "0, 8 (all bits low, bit 3 alone)". */
    static String describeCodes(List<Integer> codes, int bits) {
        List<String> roles = new ArrayList<>();
        for (int c : codes) {
            if (roles.size() == LIST_MAX) {
                break;
            }
            if (c == 0) {
                roles.add("all bits low");
            } else if (Integer.bitCount(c) == 1) {
                roles.add("bit " + Integer.numberOfTrailingZeros(c) + " alone");
            }
        }
        String text = "code" + (codes.size() == 1 ? " " : "s ") + list(codes);
        return roles.isEmpty() ? text : text + " (" + String.join(", ", roles) + ")";
    }

    private static String alsoMissing(Measurements m, List<Integer> missingBasis) {
        List<Integer> others = new ArrayList<>(m.unmeasured());
        others.removeAll(missingBasis);
        return others.isEmpty() ? "" : "; also not measured: " + list(others);
    }

    static String list(List<Integer> codes) {
        StringBuilder b = new StringBuilder();
        for (int i = 0; i < codes.size() && i < LIST_MAX; i++) {
            b.append(i == 0 ? "" : ", ").append(codes.get(i));
        }
        if (codes.size() > LIST_MAX) {
            b.append(" and ").append(codes.size() - LIST_MAX).append(" more");
        }
        return b.toString();
    }

    private static String mv(double volts) {
        return String.format(Locale.ROOT, "%.3g mV", 1000 * volts);
    }

    private static String fmt(double x) {
        return String.format(Locale.ROOT, "%.3g", x);
    }

    private static String volts(double v) {
        return Double.isNaN(v) ? "-" : String.format(Locale.ROOT, "%.4g V", v);
    }
}
