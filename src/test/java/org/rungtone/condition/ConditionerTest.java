package org.rungtone.condition;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.rungtone.internal.InputError;
import org.rungtone.source.Signal;

class ConditionerTest {
    static final Conditioner CONDITIONER = new Conditioner(KaiserResampler.forBits(12));
    static final OptionalDouble NONE = OptionalDouble.empty();

    static Conditioning settings(boolean dc, OptionalDouble trim, double rate, OptionalDouble gain,
            OptionalDouble norm, double fadeIn, double fadeOut) {
        return new Conditioning(dc, trim, rate, gain, norm, fadeIn, fadeOut);
    }

    @Test
    void removesDcAndNormalizesThePeak() {
        double[] x = new double[1000];
        for (int i = 0; i < x.length; i++) {
            x[i] = 0.3 + 0.2 * Math.sin(2 * Math.PI * 10 * i / 1000.0);
        }
        Conditioner.Conditioned c = CONDITIONER.apply(Signal.wrap(x, 1000),
                settings(true, NONE, 1000, NONE, OptionalDouble.of(-6.0206), 0, 0));
        double mean = 0;
        for (double v : c.signal().unsafeSamples()) {
            mean += v;
        }
        assertEquals(0, mean / 1000, 1e-12);
        // -6.0206 dBFS is a peak of 0.5 (20 log10 0.5)
        assertEquals(0.5, c.signal().peak(), 1e-7);
        assertEquals(20 * Math.log10(0.5 / 0.2), c.gainDb(), 1e-6);
    }

    @Test
    void trimsSilenceAtBothEnds() {
        double[] x = new double[1000];
        for (int i = 200; i < 700; i++) {
            x[i] = 0.5;
        }
        Conditioner.Conditioned c = CONDITIONER.apply(Signal.wrap(x, 1000),
                settings(false, OptionalDouble.of(-40), 1000, NONE, NONE, 0, 0));
        assertEquals(500, c.signal().length());
        assertEquals(0.2, c.trimmedStartSeconds(), 1e-12);
        assertEquals(0.3, c.trimmedEndSeconds(), 1e-12);
    }

    @Test
    void fadesAreLinearFromAndToZero() {
        double[] x = new double[100];
        java.util.Arrays.fill(x, 0.5);
        Signal out = CONDITIONER.apply(Signal.wrap(x, 1000),
                settings(false, NONE, 1000, OptionalDouble.of(0), NONE, 0.010, 0.020)).signal();
        assertEquals(0, out.sample(0), 0);
        assertEquals(0.25, out.sample(5), 1e-12);
        assertEquals(0.5, out.sample(50), 0);
        assertEquals(0, out.sample(99), 0);
        assertEquals(0.25, out.sample(89), 1e-12);
    }

    @Test
    void refusesFadesThatDoNotFitInTheSound() {
        Signal tenth = Signal.wrap(new double[100], 1000);
        assertEquals("sound.fade_in 200ms is longer than the sound (100ms); make it at most 100ms",
                assertThrows(InputError.class, () -> CONDITIONER.apply(tenth,
                        settings(false, NONE, 1000, NONE, NONE, 0.2, 0))).getMessage());
        assertEquals("sound.fade_out 10s is longer than the sound (100ms); make it at most 100ms",
                assertThrows(InputError.class, () -> CONDITIONER.apply(tenth,
                        settings(false, NONE, 1000, NONE, NONE, 0, 10))).getMessage());
        assertEquals("sound.fade_in 60ms and sound.fade_out 60ms together are longer than the sound (100ms) and"
                + " would overlap; make them add up to at most 100ms", assertThrows(InputError.class,
                        () -> CONDITIONER.apply(tenth, settings(false, NONE, 1000, NONE, NONE, 0.06, 0.06)))
                        .getMessage());
        // a fade over exactly the whole sound is fine
        assertEquals(0, CONDITIONER.apply(tenth, settings(false, NONE, 1000, NONE, NONE, 0.04, 0.06)).signal()
                .sample(99));
    }

    @Test
    void fadesMustFitInWhatTrimmingLeaves() {
        double[] x = new double[1000];
        java.util.Arrays.fill(x, 400, 600, 0.5);
        assertEquals("sound.fade_in 300ms is longer than the sound (200ms once trimmed); make it at most 200ms",
                assertThrows(InputError.class, () -> CONDITIONER.apply(Signal.wrap(x, 1000),
                        settings(false, OptionalDouble.of(-40), 1000, NONE, NONE, 0.3, 0))).getMessage());
    }

    @Test
    void gainIsInDecibels() {
        Signal out = CONDITIONER.apply(Signal.of(new double[] {0.1, -0.1}, 8000),
                settings(false, NONE, 8000, OptionalDouble.of(20), NONE, 0, 0)).signal();
        assertEquals(1.0, out.sample(0), 1e-12);
    }

    @Test
    void warnsAboutClippingAfterGain() {
        Conditioner.Conditioned c = CONDITIONER.apply(Signal.of(new double[] {0.5, -0.5, 0.1}, 8000),
                settings(false, NONE, 8000, OptionalDouble.of(6.0206), NONE, 0, 0));
        assertEquals(1, c.warnings().size());
        assertTrue(c.warnings().get(0).startsWith("2 samples exceed full scale"), c.warnings().get(0));
    }

    @Test
    void trimsThenResamples() {
        double[] x = new double[44_100];
        for (int i = 11_025; i < 33_075; i++) {
            x[i] = 0.5 * Math.sin(2 * Math.PI * 500 * i / 44_100.0);
        }
        Conditioner.Conditioned c = CONDITIONER.apply(Signal.wrap(x, 44_100),
                settings(false, OptionalDouble.of(-60), 8000, NONE, NONE, 0, 0));
        assertEquals(8000, c.signal().sampleRateHz());
        assertEquals(0.5 * 8000, c.signal().length(), 3);
        assertEquals(0.5, c.signal().peak(), 0.01);
    }

    @Test
    void rejectsContradictorySettings() {
        InputError e = assertThrows(InputError.class, () -> settings(false, NONE, 8000, OptionalDouble.of(1),
                OptionalDouble.of(-1), 0, 0));
        assertEquals("give either sound.gain or sound.normalize, not both", e.getMessage());
        assertEquals("target rate must be 1 Hz..384 kHz: 500000.0 Hz", assertThrows(InputError.class,
                () -> settings(false, NONE, 500_000, NONE, NONE, 0, 0)).getMessage());
        assertEquals("sound.fade_out must be a finite time of 0 s or more: Infinity", assertThrows(InputError.class,
                () -> settings(false, NONE, 8000, NONE, NONE, 0, Double.POSITIVE_INFINITY)).getMessage());
        assertEquals("sound.fade_in must be a finite time of 0 s or more: -1s", assertThrows(InputError.class,
                () -> settings(false, NONE, 8000, NONE, NONE, -1, 0)).getMessage());
        assertEquals("sound.gain must be within ±120 dB: NaN", assertThrows(InputError.class,
                () -> settings(false, NONE, 8000, OptionalDouble.of(Double.NaN), NONE, 0, 0)).getMessage());
    }
}
