package org.rungtone.report;

import java.nio.file.Path;
import java.util.List;
import org.rungtone.analysis.SurveyResult;
import org.rungtone.analysis.SurveyRow;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.source.Signal;
import org.rungtone.source.WavWriter;

/**
 * The files of a survey in its output folder: survey.txt, survey.json and two plots named by the figure they
 * draw ({@link SurveyCharts.Figure}): survey-sinad.png (against bit depth) and survey-sinad-flash.png
 * (against flash bytes), or survey-enob*.png for an ENOB target; and with previews a 16-bit WAV per cell in
 * previews/ (named by {@link SurveyReport#previewFileName}). Every file is written atomically.
 */
public final class SurveyFiles {
    private static final String TEXT = "survey.txt";
    private static final String JSON = "survey.json";
    private static final String PREVIEWS = "previews";

    private SurveyFiles() {
    }

    /**
     * The report files of {@code result} in {@code folder}, in the order the reports list them: text, JSON,
     * the plot against bit depth, the plot against flash bytes.
     */
    public static List<Path> reports(Path folder, SurveyResult result) {
        String stem = "survey-" + SurveyCharts.Figure.of(result).fileStem();
        return List.of(folder.resolve(TEXT), folder.resolve(JSON), folder.resolve(stem + ".png"),
                folder.resolve(stem + "-flash.png"));
    }

    /** The folder of the preview WAV files. */
    public static Path previews(Path folder) {
        return folder.resolve(PREVIEWS);
    }

    /**
     * Creates the previews folder.
     *
     * @throws org.rungtone.internal.InputError when it cannot be created or written
     */
    public static void preparePreviews(Path folder) {
        AtomicFiles.prepareFolder(previews(folder));
    }

    /**
     * Writes one cell's preview (the analog output, full scale [-1, 1]) as a 16-bit WAV file; safe to call
     * for several cells at once.
     */
    public static void writePreview(Path folder, SurveyRow row, Signal preview) {
        WavWriter.write(previews(folder).resolve(SurveyReport.previewFileName(row)), preview,
                WavWriter.Format.PCM16);
    }

    /**
     * Writes the plots, the JSON report and the text report (in that order) into {@code folder}.
     *
     * @throws org.rungtone.internal.InputError when the folder cannot be written
     */
    public static void write(Path folder, SurveyResult result, SurveyReport.Context context) {
        String json = Json.toJson(SurveyReport.json(result, context));
        String text = SurveyReport.text(result, context);
        List<Path> files = reports(folder, result);
        Plots.write(files.get(2), SurveyCharts.againstBits(result));
        Plots.write(files.get(3), SurveyCharts.againstFlash(result));
        AtomicFiles.writeString(folder.resolve(JSON), json);
        AtomicFiles.writeString(folder.resolve(TEXT), text);
    }
}
