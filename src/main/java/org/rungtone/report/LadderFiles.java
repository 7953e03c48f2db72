package org.rungtone.report;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.ladder.LadderAnalysis;
import org.rungtone.ladder.LadderStudy;
import org.rungtone.ladder.Linearity;

/**
 * The ladder report's files: every code's level in {@code levels.csv}, the PNG charts and, with a design
 * proposal, its ladder file and parts list ({@link DesignFiles}).
 */
public final class LadderFiles {
    private LadderFiles() {
    }

    /**
     * Writes {@code levels.csv} and the charts into {@code folder}, creating it.
     *
     * @return the files written, in order
     */
    public static List<String> write(Path folder, LadderStudy study) {
        AtomicFiles.prepareFolder(folder);
        List<String> files = new ArrayList<>();
        Path csv = folder.resolve("levels.csv");
        AtomicFiles.writeString(csv, levelsCsv(study.analysis()));
        files.add(csv.toString());
        for (LadderCharts.Figure figure : LadderCharts.of(study.analysis(), study.monteCarlo())) {
            Path png = folder.resolve(figure.kind().fileName());
            Plots.write(png, figure.chart());
            files.add(png.toString());
        }
        study.design().ifPresent(d -> files.addAll(DesignFiles.write(folder, study.analysis().spec(),
                d.proposal())));
        return files;
    }

    /** Every code: its bits, modelled and ideal volts, DNL and INL (endpoint and best-fit line). */
    static String levelsCsv(LadderAnalysis a) {
        Linearity lin = a.linearity();
        StringBuilder sb = new StringBuilder();
        CSVFormat format = CSVFormat.DEFAULT.builder().setRecordSeparator("\n")
                .setHeader("code", "bits", "volts", "ideal_volts", "dnl_lsb", "inl_lsb", "inl_best_fit_lsb")
                .build();
        try (CSVPrinter p = new CSVPrinter(sb, format)) {
            int n = a.levels().size();
            for (int k = 0; k < n; k++) {
                p.printRecord(k, LadderReport.binary(k, a.spec().bits()),
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
}
