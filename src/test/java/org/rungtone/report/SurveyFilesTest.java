package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.analysis.SurveyResult;
import org.rungtone.analysis.SurveyRow;
import org.rungtone.analysis.SurveyTarget;
import org.rungtone.source.Signal;
import org.rungtone.source.WavReader;
import org.rungtone.testing.FactsFixture;

class SurveyFilesTest {
    @TempDir
    Path dir;

    private static SurveyRow row(int bits, double rate, double sinad) {
        int n = (int) rate;
        return new SurveyRow(bits, rate, n, sinad, sinad, sinad, (sinad - 1.76) / 6.02, 0,
                SurveyRow.unpackedBytes(n, bits), SurveyRow.packedBytes(n, bits), true, sinad >= 40, false, Double.NaN,
                Double.NaN, Optional.empty());
    }

    @Test
    void writesThePlotTheJsonAndTheTextAndNothingElse() throws IOException {
        SurveyResult result = new SurveyResult(List.of(row(4, 8000, 25.8), row(8, 8000, 49.9)),
                SurveyTarget.sinadDb(40), null, false);
        SurveyReport.Context context = new SurveyReport.Context("9.9", Path.of("chime.wav"), "PCM 16-bit",
                "DC removed", "kaiser", "ideal", "tpdf", "none", 1, "none", false, SurveyFiles.reports(dir, result),
                List.of(), FactsFixture.survey(Path.of("chime.wav"), 8, dir));
        SurveyFiles.write(dir, result, context);
        assertEquals(SurveyReport.text(result, context), Files.readString(dir.resolve("survey.txt")));
        assertEquals(Json.toJson(SurveyReport.json(result, context)), Files.readString(dir.resolve("survey.json")));
        for (String plot : List.of("survey-sinad.png", "survey-sinad-flash.png")) {
            byte[] png = Files.readAllBytes(dir.resolve(plot));
            assertArrayEquals(new byte[] {(byte) 0x89, 'P', 'N', 'G'}, Arrays.copyOf(png, 4));
            assertEquals(Plots.png(plot.endsWith("flash.png") ? SurveyCharts.againstFlash(result)
                    : SurveyCharts.againstBits(result)).length, png.length, plot);
        }
        try (Stream<Path> s = Files.list(dir)) {
            assertEquals(List.of("survey-sinad-flash.png", "survey-sinad.png", "survey.json", "survey.txt"),
                    s.map(p -> p.getFileName().toString()).sorted().toList(), "no temporary files left behind");
        }
    }

    @Test
    void listsTheReportsTextFirstAndNamesThePlotsByTheirFigure() {
        SurveyResult sinad = new SurveyResult(List.of(row(4, 8000, 25.8)), SurveyTarget.sinadDb(40), null, false);
        assertEquals(List.of(dir.resolve("survey.txt"), dir.resolve("survey.json"), dir.resolve("survey-sinad.png"),
                dir.resolve("survey-sinad-flash.png")), SurveyFiles.reports(dir, sinad));
        SurveyResult none = new SurveyResult(List.of(row(4, 8000, 25.8)), null, null, false);
        assertEquals(dir.resolve("survey-sinad.png"), SurveyFiles.reports(dir, none).get(2));
        SurveyResult enob = new SurveyResult(List.of(row(4, 8000, 25.8)), SurveyTarget.enobBits(5), null, true);
        assertEquals(List.of(dir.resolve("survey-enob.png"), dir.resolve("survey-enob-flash.png")),
                SurveyFiles.reports(dir, enob).subList(2, 4));
        assertEquals(dir.resolve("previews"), SurveyFiles.previews(dir));
    }

    @Test
    void writesAPreviewUnderTheCellsName() {
        SurveyFiles.preparePreviews(dir);
        double[] samples = new double[441];
        for (int i = 0; i < samples.length; i++) {
            samples[i] = 0.5 * Math.sin(2 * Math.PI * 1000 * i / 44_100.0);
        }
        SurveyFiles.writePreview(dir, row(6, 16000, 37.9), Signal.wrap(samples, 44_100));
        WavReader.Decoded d = WavReader.read(dir.resolve("previews").resolve("b06-r16000.wav"), 0);
        assertEquals(44_100, d.signal().sampleRateHz(), 0);
        assertEquals(441, d.signal().length());
        // 16-bit PCM: within half an LSB of 2^-15 full scale
        assertEquals(0.5 * Math.sin(2 * Math.PI * 1000 * 10 / 44_100.0), d.signal().unsafeSamples()[10], 0.5 / 32768);
    }
}
