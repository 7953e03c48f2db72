package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.analysis.AudioMetrics;
import org.rungtone.analysis.Spectrum;
import org.rungtone.analysis.Survey;
import org.rungtone.analysis.SurveyResult;
import org.rungtone.analysis.SurveySpec;
import org.rungtone.analysis.SurveyTarget;
import org.rungtone.analysis.ToneAnalysis;
import org.rungtone.analysis.ToneReport;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.Signal;

class AnalysisPlotsTest {
    private static final double RATE = 16000;

    private static Signal sine(double rate, int n) {
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = 0.9 * Math.sin(2 * Math.PI * 1001.3 * i / rate);
        }
        return Signal.wrap(x, rate);
    }

    @Test
    void spectrumChartMarksHarmonicsAndTheIdealFloor() {
        LevelTable table = LevelTable.ideal(8, 1);
        Codes codes = new Quantizer(table, Dither.NONE, 1).apply(sine(RATE, 1 << 14)).codes();
        double[] v = AudioMetrics.volts(codes, table);
        for (int i = 0; i < v.length; i++) {
            v[i] = 2 * v[i] / (table.maxVolts() - table.minVolts()) - 1;
        }
        Signal out = Signal.wrap(v, RATE);
        ToneReport tone = ToneAnalysis.analyze(out);
        Spectrum s = ToneAnalysis.spectrum(out);
        Plots.Chart c = AnalysisPlots.spectrumChart(s, tone, 8);
        assertEquals(3, c.series().size());
        assertTrue(c.series().get(0).x().length <= 2048);
        // Floor: -(1.76 + 20·log10(255)) dBFS over M/2 bins, read like a tone (Bennett 1948).
        double floor = -(1.76 + 20 * Math.log10(255)) + 10 * Math.log10(s.enbwBins() / (s.fftLength() / 2.0));
        assertEquals(floor, c.series().get(1).y()[0], 1e-9);
        assertEquals(tone.harmonics().size() + 1, c.series().get(2).x().length);
        assertEquals(tone.fundamentalHz(), c.series().get(2).x()[0], 0);
        byte[] png = Plots.png(c);
        assertArrayEquals(new byte[] {(byte) 0x89, 'P', 'N', 'G'}, Arrays.copyOf(png, 4));
        assertArrayEquals(png, Plots.png(AnalysisPlots.spectrumChart(s, tone, 8)));
    }

    @Test
    void errorAndSurveyChartsAreWritten(@TempDir Path dir) throws Exception {
        Signal ref = sine(RATE, 8000);
        LevelTable table = LevelTable.ideal(6, 1);
        Codes codes = new Quantizer(table, Dither.TPDF, 1).apply(ref).codes();
        AudioMetrics m = AudioMetrics.of(ref, 3400);
        Path error = dir.resolve("error.png");
        AnalysisPlots.writeErrorSpectrum(error, m.errorSpectrum(AudioMetrics.volts(codes, table)), 3400);
        assertTrue(Files.size(error) > 1000);

        SurveyResult result = Survey.run(SurveySpec.builder().bitDepths(List.of(4, 6, 8))
                .ratesHz(List.of(8000.0, 16000.0)).target(SurveyTarget.sinadDb(30)).build(),
                rate -> sine(rate, (int) (rate / 4)));
        Plots.Chart c = AnalysisPlots.surveyChart(result);
        assertEquals(List.of("8 kHz", "16 kHz", "target 30 dB", "chosen: 6 bits at 8 kHz"),
                c.series().stream().map(Plots.Series::name).toList());
        Path survey = dir.resolve("survey.png");
        AnalysisPlots.writeSurvey(survey, result);
        assertTrue(Files.size(survey) > 1000);
    }
}
