package org.rungtone.report;

import java.nio.file.Path;
import java.util.List;
import org.rungtone.analysis.SurveyResult;
import org.rungtone.analysis.SurveyRow;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.source.Signal;
import org.rungtone.source.WavWriter;

/**
 * The files of a survey in its output folder: survey.txt, survey.json and survey-sinad.png, and with
 * previews a 16-bit WAV per cell in previews/ (named by {@link SurveyReport#previewFileName}). Every file is
 * written atomically.
 */
public final class SurveyFiles {
    private static final String TEXT = "survey.txt";
    private static final String JSON = "survey.json";
    private static final String PLOT = "survey-sinad.png";
    private static final String PREVIEWS = "previews";

    private SurveyFiles() {
    }

    /** The report files in {@code folder}, in the order the reports list them: text, JSON, plot. */
    public static List<Path> reports(Path folder) {
        return List.of(folder.resolve(TEXT), folder.resolve(JSON), folder.resolve(PLOT));
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
     * Writes the plot, the JSON report and the text report (in that order) into {@code folder}.
     *
     * @throws org.rungtone.internal.InputError when the folder cannot be written
     */
    public static void write(Path folder, SurveyResult result, SurveyReport.Context context) {
        String json = Json.toJson(SurveyReport.json(result, context));
        String text = SurveyReport.text(result, context);
        AnalysisPlots.writeSurvey(folder.resolve(PLOT), result);
        AtomicFiles.writeString(folder.resolve(JSON), json);
        AtomicFiles.writeString(folder.resolve(TEXT), text);
    }
}
