package org.rungtone.project;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.analysis.CodeUse;
import org.rungtone.analysis.ListenerReport;
import org.rungtone.analysis.QualityReport;
import org.rungtone.calibrate.OutputSpan;
import org.rungtone.quantize.ErrorFilter;
import org.rungtone.source.Signal;
import org.rungtone.source.WavWriter;

class SoundRendererTest {
    @TempDir
    Path dir;

    /** 1 kHz and, 12 dB lower, 6 kHz, 1.5 s at 44.1 kHz, written as a 16-bit WAV. */
    private Path treble() {
        double rate = 44_100;
        int n = (int) (1.5 * rate);
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            double t = i / rate;
            x[i] = 0.6 * Math.sin(2 * Math.PI * 1000.3 * t) + 0.15 * Math.sin(2 * Math.PI * 6000.7 * t);
        }
        Path wav = dir.resolve("treble.wav");
        WavWriter.write(wav, Signal.wrap(x, rate), WavWriter.Format.PCM16);
        return wav;
    }

    private static SoundRenderer.Rendered render(BuildPlan plan) {
        return new SoundRenderer(OutputSpan.FULL, BuildProgress.NONE).render(plan);
    }

    @Test
    void listenerFiguresRiseWithTheRateWhileQuantizationOnlyFiguresStayAlike() {
        // At 8 kHz the 6 kHz tone is lost (the anti-alias filter removes it); at 16 and 22.05 kHz it is kept,
        // with the hold's images and droop, sinc(f/fs) (Oppenheim & Schafer), ever smaller as the rate rises.
        // The quantization-only SINAD compares with the source at the target rate and sees none of that.
        Path wav = treble();
        double[] rates = {8000, 16000, 22050};
        double[] heard = new double[rates.length];
        double[] sinad = new double[rates.length];
        for (int i = 0; i < rates.length; i++) {
            BuildPlan plan = BuildPlan.builder(wav, "treble", dir.resolve("out" + i)).bits(8)
                    .rateHz(OptionalDouble.of(rates[i])).build();
            QualityReport q = render(plan).quality().get(0);
            ListenerReport l = q.listener().orElseThrow();
            assertEquals(44_100, l.analysisRateHz());
            assertEquals(1.5, l.analysedSeconds(), 0.01);
            heard[i] = l.snrDb();
            sinad[i] = q.sinadDb();
        }
        String all = java.util.Arrays.toString(heard) + " " + java.util.Arrays.toString(sinad);
        assertTrue(heard[0] + 3 < heard[1] && heard[1] + 3 < heard[2], all);
        // 6 kHz at −12 dB lost: the listener SNR cannot exceed 10·log10(1 + 1/0.0625) = 12.3 dB
        assertTrue(heard[0] < 12.3, all);
        for (double s : sinad) {
            assertEquals(sinad[2], s, 1.0, all);
        }
    }

    @Test
    void inBandFiguresStopAtTwentyKilohertzAtHighRates() {
        // 44.1 kHz: rate/2 is 22.05 kHz, but the in-band figures stop at 20 kHz, the one definition
        // (AnalogModel.inBandTopHz) the survey uses too.
        BuildPlan plan = BuildPlan.builder(treble(), "treble", dir.resolve("o")).bits(8)
                .rateHz(OptionalDouble.of(44_100)).build();
        SoundRenderer.Rendered r = render(plan);
        assertEquals(20_000, r.inBandCutoffHz());
        assertEquals(20_000, r.quality().get(0).inBandCutoffHz());
    }

    @Test
    void everyCaseCountsItsEndCodesAndShapingKeepsItsHeadroom() {
        // Normalized to 0 dBFS, second-order shaping with TPDF needs 5.5 LSB of room at 8 bits (the loop
        // bound of Quantizer, after Gerzon and Craven 1989): the signal is scaled down, nothing overloads,
        // and no warning is given.
        BuildPlan plan = BuildPlan.builder(treble(), "treble", dir.resolve("o")).bits(8)
                .normalizeDbfs(OptionalDouble.of(0)).shaping(ErrorFilter.SECOND_ORDER).build();
        SoundRenderer.Rendered r = render(plan);
        CodeUse use = r.quality().get(0).codeUse().orElseThrow();
        assertTrue(use.shaped());
        assertTrue(use.headroomKept());
        assertTrue(use.headroomGainDb() < 0, "headroom " + use.headroomGainDb());
        assertEquals(0, use.overloadSamples());
        assertEquals(r.emitted().length(), use.samples());
        assertFalse(r.warnings().stream().anyMatch(w -> w.contains("overloaded")), r.warnings().toString());
    }

    @Test
    void shapingThatCannotKeepItsHeadroomIsWarnedAbout() {
        // 3 bits: second-order TPDF shaping needs 5.5 steps of room, more than the 4 from the middle to an
        // overload point, so none can be kept; at 0 dBFS the loop overloads on far more than 0.1 % of the
        // samples, and the report must say so rather than count only the (zero) clipped samples.
        BuildPlan plan = BuildPlan.builder(treble(), "treble", dir.resolve("o")).bits(3)
                .normalizeDbfs(OptionalDouble.of(0)).shaping(ErrorFilter.SECOND_ORDER).build();
        SoundRenderer.Rendered r = render(plan);
        CodeUse use = r.quality().get(0).codeUse().orElseThrow();
        assertFalse(use.headroomKept());
        assertTrue(use.shapingOverloads(), "overload " + use.overloadFraction());
        assertTrue(use.endCodeFraction() > use.overloadFraction());
        assertEquals(0, r.clippedSamples());
        assertTrue(r.warnings().stream().anyMatch(w -> w.startsWith("noise shaping overloaded the quantizer on")),
                r.warnings().toString());
    }

    @Test
    void theListenerHearsTheStretchConditioningKeptWithItsFades() {
        // 0.3 s of silence, then 1 s of a 1 kHz tone: trimming drops the silence and 20 ms fades shape the
        // ends. Compared with the source from its first kept sample, with the same fades, the board's output
        // at 44.1 kHz has the quantization-only noise of the in-band figure, shaped by the hold's
        // |sinc(f/fs)|² (Oppenheim & Schafer), which takes about 1.07 dB of white noise off below 20 kHz;
        // no image falls below 20 kHz, and the tone's own droop (0.007 dB) is in the gain. A start off by
        // the silence would read near 0 dB.
        double rate = 44_100;
        int silence = (int) (0.3 * rate);
        double[] x = new double[silence + (int) rate];
        for (int i = silence; i < x.length; i++) {
            x[i] = 0.7 * Math.sin(2 * Math.PI * 1000.3 * (i - silence) / rate);
        }
        Path wav = dir.resolve("late.wav");
        WavWriter.write(wav, Signal.wrap(x, rate), WavWriter.Format.PCM16);
        BuildPlan plan = BuildPlan.builder(wav, "late", dir.resolve("o")).bits(12).rateHz(OptionalDouble.of(rate))
                .trimDbfs(OptionalDouble.of(-60)).fades(0.02, 0.02).build();
        SoundRenderer.Rendered r = render(plan);
        assertEquals(0.3, r.conditioned().trimmedStartSeconds(), 0.001);
        QualityReport q = r.quality().get(0);
        ListenerReport l = q.listener().orElseThrow();
        assertEquals(1.0, l.analysedSeconds(), 0.01);
        double held = 0;
        int steps = 20_000;
        for (int k = 0; k < steps; k++) {
            double f = 20 + (k + 0.5) * (20_000 - 20) / steps;
            double x1 = Math.PI * f / rate;
            held += Math.pow(Math.sin(x1) / x1, 2) / steps;
        }
        assertEquals(q.inBandSnrDb() - 10 * Math.log10(held), l.snrDb(), 0.3);
    }
}
