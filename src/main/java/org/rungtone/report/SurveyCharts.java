package org.rungtone.report;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.function.ToDoubleFunction;
import java.util.function.ToLongFunction;
import org.rungtone.analysis.SurveyResult;
import org.rungtone.analysis.SurveyRow;
import org.rungtone.analysis.SurveyTarget;

/**
 * The survey's two charts, one line per sample rate: quality against bit depth, and quality against the
 * flash bytes each cell needs (as the survey counts them, packed or not). The quality is the figure the
 * target was given in (ENOB re full scale for an ENOB target, else SINAD); the target, the flash budget and
 * the chosen cell are marked.
 */
public final class SurveyCharts {
    /** Share of a y range left free above and below, so that no line runs along the frame. */
    private static final double PAD = 0.04;

    private SurveyCharts() {
    }

    /** Which figure the charts draw: the target's, SINAD when there is none. */
    public enum Figure {
        /** Full-band SINAD, dB. */
        SINAD("SINAD", "SINAD (dB)", "dB", SurveyRow::sinadDb),
        /** ENOB re full scale, bits. */
        ENOB("ENOB", "ENOB (re full scale, bits)", "bits", SurveyRow::enobFullScaleBits);

        private final String shortName;
        private final String axisLabel;
        private final String unit;
        private final ToDoubleFunction<SurveyRow> value;

        Figure(String shortName, String axisLabel, String unit, ToDoubleFunction<SurveyRow> value) {
            this.shortName = shortName;
            this.axisLabel = axisLabel;
            this.unit = unit;
            this.value = value;
        }

        /** The figure of a survey: its target's, else SINAD. */
        public static Figure of(SurveyResult result) {
            SurveyTarget t = result.target();
            return t != null && t.kind() == SurveyTarget.Kind.ENOB_BITS ? ENOB : SINAD;
        }

        /** The figure's value in a cell. */
        public double of(SurveyRow row) {
            return value.applyAsDouble(row);
        }

        /** Lower case, for file names: "sinad", "enob". */
        public String fileStem() {
            return shortName.toLowerCase(Locale.ROOT);
        }
    }

    /** The figure against bit depth, one line per rate. */
    public static Plots.Chart againstBits(SurveyResult result) {
        Figure f = Figure.of(result);
        int lo = result.rows().stream().mapToInt(SurveyRow::bits).min().orElse(1);
        int hi = result.rows().stream().mapToInt(SurveyRow::bits).max().orElse(1);
        PlotAxis x = PlotAxis.integers("bit depth (bits)", lo - 0.5, hi + 0.5);
        List<Plots.Series> series = lines(result, f, SurveyRow::bits, false);
        List<Plots.Reference> refs = target(result, f);
        PlotAxis y = yAxis(f, series, refs);
        return new Plots.Chart("Survey: " + f.shortName + " against bit depth", x, y, series, refs, f.shortName
                + " against bit depth, " + lo + " to " + hi + " bits, one line per sample rate"
                + marked(result, false));
    }

    /** The figure against flash bytes, one line per rate, with the budget when there is one. */
    public static Plots.Chart againstFlash(SurveyResult result) {
        Figure f = Figure.of(result);
        ToLongFunction<SurveyRow> bytes = result.packed() ? SurveyRow::flashBytesPacked
                : SurveyRow::flashBytesUnpacked;
        List<Plots.Series> series = lines(result, f, bytes, true);
        List<Plots.Reference> refs = new ArrayList<>();
        if (result.flashBudgetBytes() != null) {
            refs.add(Plots.Reference.vertical(String.format(Locale.ROOT, "flash budget %,d bytes",
                    result.flashBudgetBytes()), result.flashBudgetBytes()));
        }
        refs.addAll(target(result, f));
        double most = Plots.span(series, refs, Plots.Direction.VERTICAL, true).high();
        PlotAxis x = PlotAxis.rounded("flash (bytes" + (result.packed() ? ", bit-packed" : "") + ")", 0, most);
        PlotAxis y = yAxis(f, series, refs);
        return new Plots.Chart("Survey: " + f.shortName + " against flash", x, y, series, refs, f.shortName
                + " against flash bytes" + (result.packed() ? " (bit-packed)" : "") + ", 0 to " + x.format(x.max())
                + " bytes, one line per sample rate" + marked(result, true));
    }

    /** One series per rate, in the order the survey lists rates, points sorted along x; then the chosen cell. */
    private static List<Plots.Series> lines(SurveyResult result, Figure f, ToLongFunction<SurveyRow> x,
            boolean sortByX) {
        List<Double> rates = result.rows().stream().map(SurveyRow::rateHz).distinct().toList();
        List<Plots.Series> series = new ArrayList<>();
        for (double rate : rates) {
            List<SurveyRow> rows = new ArrayList<>(result.rowsAtRate(rate));
            rows.sort(sortByX ? Comparator.comparingLong(x) : Comparator.comparingInt(SurveyRow::bits));
            double[] xs = new double[rows.size()];
            double[] ys = new double[rows.size()];
            for (int i = 0; i < rows.size(); i++) {
                xs[i] = x.applyAsLong(rows.get(i));
                ys[i] = f.of(rows.get(i));
            }
            series.add(new Plots.Series(AnalysisPlots.plain(rate / 1000) + " kHz", xs, ys,
                    Plots.Style.LINE_AND_MARKERS));
        }
        result.chosen().ifPresent(c -> series.add(new Plots.Series("chosen: " + c.bits() + " bits at "
                + AnalysisPlots.plain(c.rateHz() / 1000) + " kHz", new double[] {x.applyAsLong(c)},
                new double[] {f.of(c)}, Plots.Style.MARKERS)));
        return series;
    }

    /** The target line, when the survey has a target (it is in the charts' figure by construction). */
    private static List<Plots.Reference> target(SurveyResult result, Figure f) {
        SurveyTarget t = result.target();
        if (t == null) {
            return List.of();
        }
        return List.of(Plots.Reference.horizontal("target " + AnalysisPlots.plain(t.value()) + " " + f.unit,
                t.value()));
    }

    private static PlotAxis yAxis(Figure f, List<Plots.Series> series, List<Plots.Reference> refs) {
        PlotAxis.Span s = Plots.span(series, refs, Plots.Direction.HORIZONTAL, false).padded(PAD);
        return PlotAxis.rounded(f.axisLabel, s.low(), s.high());
    }

    /** ", with the target (SINAD >= 40 dB), the flash budget and the chosen setting marked", or "". */
    private static String marked(SurveyResult result, boolean budget) {
        List<String> things = new ArrayList<>();
        if (result.target() != null) {
            things.add("the target (" + result.target().describe() + ")");
        }
        if (budget && result.flashBudgetBytes() != null) {
            things.add("the flash budget");
        }
        result.chosen().ifPresent(c -> things.add("the chosen setting"));
        if (things.isEmpty()) {
            return "";
        }
        String last = things.remove(things.size() - 1);
        return ", with " + (things.isEmpty() ? "" : String.join(", ", things) + " and ") + last + " marked";
    }
}
