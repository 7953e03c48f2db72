package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.function.DoubleFunction;
import org.junit.jupiter.api.Test;
import org.rungtone.codec.TreadFormat;
import org.rungtone.source.Signal;

class SurveyTest {
    private static final double AMPLITUDE = 0.9;
    private static final DoubleFunction<Signal> TONE =
            rate -> TestSignals.sine(AMPLITUDE, 300, 0, rate, (int) (0.5 * rate));

    private static SurveySpec.Builder small() {
        return SurveySpec.builder().bitDepths(List.of(4, 8, 12)).ratesHz(List.of(8000.0, 16000.0)).seed(3);
    }

    @Test
    void everyCellHasItsFiguresAndFlashBytes() {
        SurveyResult result = Survey.run(small().build(), TONE);
        assertEquals(6, result.rows().size());
        SurveyRow first = result.rows().get(0);
        assertEquals(4, first.bits());
        assertEquals(8000, first.rateHz(), 0);
        assertEquals(12, result.rows().get(5).bits());
        assertEquals(16000, result.rows().get(5).rateHz(), 0);
        for (SurveyRow r : result.rows()) {
            int n = (int) (0.5 * r.rateHz());
            assertEquals(n, r.samples());
            assertEquals((long) n * (r.bits() <= 8 ? 1 : 2), r.flashBytesUnpacked());
            assertEquals(((long) n * r.bits() + 7) / 8, r.flashBytesPacked());
            // TPDF-dithered ideal quantizer: error power LSB²/4 with LSB = 2/(2^N − 1) (Lipshitz,
            // Wannamaker, Vanderkooy 1992), against the tone's AMPLITUDE²/2.
            double lsb = 2 / (Math.pow(2, r.bits()) - 1);
            double expected = 10 * Math.log10(AMPLITUDE * AMPLITUDE / 2 / (lsb * lsb / 4));
            assertEquals(expected, r.sinadDb(), 0.3, r.bits() + " bits at " + r.rateHz());
            assertTrue(r.fits());
            assertFalse(r.chosen());
        }
        assertTrue(result.chosen().isEmpty());
    }

    @Test
    void choosesTheFewestFlashBytesThatReachTheTarget() {
        // TPDF costs 4.77 dB (Lipshitz, Wannamaker & Vanderkooy 1992), 0.79 bit of ENOB = (SINAD − 1.76)/6.02
        // (IEEE Std 1241-2010): 8 bits give ENOB ≈ 7.2, 4 bits ≈ 3.2.
        SurveyResult result = Survey.run(small().target(SurveyTarget.enobBits(7)).build(), TONE);
        SurveyRow chosen = result.chosen().orElseThrow();
        assertEquals(8, chosen.bits());
        assertEquals(8000, chosen.rateHz(), 0);
        assertEquals(1, result.rows().stream().filter(SurveyRow::chosen).count());

        SurveyResult tight = Survey.run(small().target(SurveyTarget.enobBits(7)).flashBudgetBytes(3999).build(),
                TONE);
        assertTrue(tight.chosen().isEmpty());
        assertFalse(tight.rows().get(1).fits());
        assertEquals(3999L, tight.flashBudgetBytes());
    }

    @Test
    void treadStoresAreRowsOfTheirOwnAndCanBeChosen() {
        // a 300 Hz tone at 8 kHz is what an adaptive differential code is for: tread3 to 8 bits reaches ENOB 6
        // for under half the bytes of 6-bit packed codes, which reach it too
        SurveySpec spec = small().bitDepths(List.of(4, 6, 8)).ratesHz(List.of(8000.0)).packed(true)
                .codecs(List.of(TreadFormat.TREAD3)).target(SurveyTarget.enobBits(5)).build();
        SurveyResult result = Survey.run(spec, TONE);
        // tread3 decodes to 4 bits and more: a row of it beside each depth
        assertEquals(6, result.rows().size());
        assertEquals(6, Survey.cellCount(spec));
        List<SurveyRow> tread = result.rows().stream().filter(r -> r.codec().isPresent()).toList();
        assertEquals(List.of(4, 6, 8), tread.stream().map(SurveyRow::bits).toList());
        for (SurveyRow r : tread) {
            // the stream, the decoder's byte table and one reset point
            long bytes = (4000L * 3 + 7) / 8 + 2L * 4 * (4 * r.bits() - 8 + 1) + 3;
            assertEquals(bytes, r.flashBytesPacked());
            assertEquals(bytes, r.flashBytesUnpacked());
        }
        SurveyRow chosen = result.chosen().orElseThrow();
        assertEquals(TreadFormat.TREAD3, chosen.codec().orElseThrow());
        assertTrue(chosen.flashBytesPacked() < result.rows().stream().filter(r -> r.codec().isEmpty()
                && r.reachesTarget()).mapToLong(SurveyRow::flashBytesPacked).min().orElseThrow());
    }

    @Test
    void equalFlashGoesToFewerBits() {
        // Unpacked, 6 and 8 bits cost the same byte per sample; both reach 20 dB SINAD.
        SurveySpec spec = small().bitDepths(List.of(8, 6)).target(SurveyTarget.sinadDb(20)).build();
        assertEquals(6, Survey.run(spec, TONE).chosen().orElseThrow().bits());
        // Packed, fewer bits are cheaper: 4 bits reach 18 dB (19.6 dB with TPDF) and win.
        SurveySpec packed = small().packed(true).target(SurveyTarget.sinadDb(18)).build();
        assertEquals(4, Survey.run(packed, TONE).chosen().orElseThrow().bits());
    }

    @Test
    void resultDoesNotDependOnTheNumberOfThreads() {
        SurveySpec spec = small().target(SurveyTarget.sinadDb(30)).build();
        assertEquals(Survey.run(spec.toBuilder().threads(1).build(), TONE),
                Survey.run(spec.toBuilder().threads(3).build(), TONE));
    }

    @Test
    void reportsProgressOncePerCell() {
        List<Integer> seen = new ArrayList<>();
        Survey.run(small().build(), TONE, (done, total) -> {
            assertEquals(6, total);
            seen.add(done);
        });
        assertEquals(List.of(1, 2, 3, 4, 5, 6), seen);
    }

    @Test
    void rejectsAReferenceAtTheWrongRate() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Survey.run(small().build(), rate -> TestSignals.sine(0.5, 300, 0, 44100, 1000)));
        assertTrue(e.getMessage().startsWith("reference for 8000.0 Hz came at 44100.0 Hz"), e.getMessage());
    }

    @Test
    void listenerFiguresRiseWithTheRateForTreble() {
        // A 1 kHz and a 5 kHz tone: at 8 kHz the 5 kHz tone is lost to the anti-alias filter, at 16 kHz
        // it is kept, with images the hold lets through (sinc(f/fs), Oppenheim & Schafer). Every depth at
        // a rate hears the same loss, so the listener figure rises with the rate for each depth while the
        // quantization-only SINAD, against the reference at that rate, does not see it.
        double sourceRate = 48_000;
        int n = (int) sourceRate;
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            double t = i / sourceRate;
            x[i] = 0.45 * Math.sin(2 * Math.PI * 1000.3 * t) + 0.3 * Math.sin(2 * Math.PI * 5000.9 * t);
        }
        Signal source = Signal.wrap(x, sourceRate);
        org.rungtone.condition.Conditioner conditioner = new org.rungtone.condition.Conditioner(
                org.rungtone.condition.KaiserResampler.forBits(12));
        DoubleFunction<Signal> atRate = rate -> conditioner.apply(source, new org.rungtone.condition.Conditioning(
                false, java.util.OptionalDouble.empty(), rate, java.util.OptionalDouble.empty(),
                java.util.OptionalDouble.empty(), 0, 0)).signal();
        ListenerMetrics listener = ListenerMetrics.prepare(org.rungtone.source.SampleSource.of(source),
                ListenerMetrics.Span.all(n), new AnalogModel(ReconstructionFilter.none(), 48_000));
        SurveySpec spec = small().bitDepths(List.of(8, 12)).build();
        SurveyResult result = Survey.run(spec, atRate, listener, Survey.Progress.NONE);
        for (int bits : List.of(8, 12)) {
            SurveyRow low = result.rows().stream().filter(r -> r.bits() == bits && r.rateHz() == 8000)
                    .findFirst().orElseThrow();
            SurveyRow high = result.rows().stream().filter(r -> r.bits() == bits && r.rateHz() == 16000)
                    .findFirst().orElseThrow();
            assertTrue(low.hasListenerFigures() && high.hasListenerFigures());
            assertTrue(high.listenerSnrDb() > low.listenerSnrDb() + 3, low + " / " + high);
            assertTrue(high.listenerAWeightedSnrDb() > low.listenerAWeightedSnrDb() + 3, low + " / " + high);
            assertTrue(low.listenerSnrDb() < low.sinadDb() - 10, low.toString());
        }
        SurveyRow plain = Survey.run(spec, atRate).rows().get(0);
        assertFalse(plain.hasListenerFigures());
        assertTrue(Double.isNaN(plain.listenerAWeightedSnrDb()));
    }
}
