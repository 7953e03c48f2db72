package org.rungtone.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.analysis.AudioMetrics;
import org.rungtone.analysis.Spectrum;
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

    /** A 0.9-amplitude sine quantized to {@code bits} with {@code dither}: its plot data. */
    private static SoundPlots.Data tone(String name, int bits, Dither dither) {
        Signal ref = sine(RATE, 1 << 14);
        LevelTable table = LevelTable.ideal(bits, 1);
        Codes codes = new Quantizer(table, dither, 1).apply(ref).codes();
        double[] v = AudioMetrics.volts(codes, table);
        for (int i = 0; i < v.length; i++) {
            v[i] = 2 * v[i] / (table.maxVolts() - table.minVolts()) - 1;
        }
        Signal out = Signal.wrap(v, RATE);
        Spectrum error = AudioMetrics.of(ref, 3400).errorSpectrum(AudioMetrics.volts(codes, table));
        ToneReport t = ToneAnalysis.analyze(out);
        return new SoundPlots.Data(name, bits, dither, false, Optional.of(error), 3400,
                Optional.of(ToneAnalysis.spectrum(out)), Optional.of(t));
    }

    @Test
    void spectrumChartMarksHarmonicsAndTheFloorOfItsDither() {
        SoundPlots.Data d = tone("chime", 8, Dither.TPDF);
        Spectrum s = d.toneSpectrum().get();
        Plots.Chart c = AnalysisPlots.spectrumChart(d, Optional.empty());
        assertEquals(2, c.series().size());
        assertTrue(c.series().get(0).x().length <= 2048);
        // Floor: -(1.76 + 20·log10(255)) dBFS (Bennett 1948), +4.77 dB for TPDF (Lipshitz et al. 1992), over
        // M/2 bins, read like a tone
        double floor = -(1.76 + 20 * Math.log10(255)) + 10 * Math.log10(3)
                + 10 * Math.log10(s.enbwBins() / (s.fftLength() / 2.0));
        Plots.Reference ref = c.references().get(0);
        assertEquals("ideal 8-bit floor per bin, TPDF dither", ref.label());
        assertEquals(floor, ref.values().get(0), 1e-9);
        ToneReport t = d.tone().get();
        assertEquals(t.harmonics().size() + 1, c.series().get(1).x().length);
        assertEquals(t.fundamentalHz() / 1000, c.series().get(1).x()[0], 1e-12);
        // kHz across, exactly 0 to the Nyquist rate; dB up, on round ticks that hold the tone and the floor
        assertEquals(List.of(0.0, 1.0, 2.0, 3.0, 4.0, 5.0, 6.0, 7.0, 8.0), c.x().ticks());
        assertEquals(8, c.x().max());
        assertEquals(10, c.y().step());
        assertEquals(0, c.y().max());
        assertTrue(c.y().min() <= floor && c.y().min() > floor - 30, c.y().toString());
        assertTrue(c.description().startsWith("Spectrum of the board's output for chime, 0\u20138 kHz, dBFS"),
                c.description());
        byte[] png = Plots.png(c);
        assertArrayEquals(new byte[] {(byte) 0x89, 'P', 'N', 'G'}, Arrays.copyOf(png, 4));
        assertArrayEquals(png, Plots.png(AnalysisPlots.spectrumChart(d, Optional.empty())));
    }

    @Test
    void theIdealErrorDensityIsWhereAnIdealQuantizerPutsIt() {
        for (Dither dither : Dither.values()) {
            SoundPlots.Data d = tone("chime", 6, dither);
            Plots.Chart c = AnalysisPlots.errorSpectrumChart(d, Optional.empty());
            Spectrum e = d.errorSpectrum().get();
            // the measured error power, all bins but DC, as a density over 0 .. fs/2
            double power = 0;
            for (int k = 1; k < e.bins(); k++) {
                power += Math.pow(10, e.powerDbfs(k) / 10);
            }
            double measured = 10 * Math.log10(power) - 10 * Math.log10(RATE / 2);
            double line = c.references().get(0).values().get(0);
            assertEquals(measured, line, 0.5, dither.toString());
            assertEquals(AnalysisPlots.idealErrorDbfs(6, dither) - 10 * Math.log10(RATE / 2), line, 1e-12);
        }
        Plots.Chart c = AnalysisPlots.errorSpectrumChart(tone("chime", 6, Dither.RPDF), Optional.empty());
        assertEquals(List.of("ideal 6-bit error density, RPDF dither", "in-band cutoff 3.4 kHz"),
                c.references().stream().map(Plots.Reference::label).toList());
        assertEquals(List.of(3.4), c.references().get(1).values());
    }

    @Test
    void soundsOfOneProjectShareTheirYRanges(@TempDir Path dir) throws Exception {
        SoundPlots.Data coarse = tone("coarse", 4, Dither.TPDF);
        SoundPlots.Data fine = tone("fine", 10, Dither.NONE);
        SoundPlots.Scales scales = SoundPlots.Scales.of(List.of(coarse, fine));
        Plots.Chart a = AnalysisPlots.errorSpectrumChart(coarse, scales.error());
        Plots.Chart b = AnalysisPlots.errorSpectrumChart(fine, scales.error());
        assertEquals(a.y(), b.y());
        PlotAxis alone = AnalysisPlots.errorSpectrumChart(coarse, Optional.empty()).y();
        assertTrue(b.y().min() < alone.min(), b.y() + " against " + alone);
        assertEquals(AnalysisPlots.spectrumChart(coarse, scales.spectrum()).y(),
                AnalysisPlots.spectrumChart(fine, scales.spectrum()).y());
        List<Path> files = SoundPlots.write(dir, coarse, scales);
        assertEquals(List.of(dir.resolve("error-spectrum.png"), dir.resolve("spectrum.png")), files);
        for (Path f : files) {
            assertTrue(Files.size(f) > 1000);
        }
    }
}
