package org.rungtone.condition;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.rungtone.source.Signal;

/** What every resampler must do; one subclass per implementation. */
abstract class ResamplerContractTest {
    abstract Resampler resampler();

    /** Stopband a 6 kHz tone must reach going from 44.1 to 8 kHz (the foundation issue asks 60 dB). */
    double requiredRejectionDb() {
        return 60;
    }

    static Signal tone(double hz, double rate, double seconds) {
        int n = (int) (rate * seconds);
        double[] x = new double[n];
        for (int i = 0; i < n; i++) {
            x[i] = 0.5 * Math.sin(2 * Math.PI * hz * i / rate);
        }
        return Signal.wrap(x, rate);
    }

    /** Least-squares amplitude of a known frequency over the middle half of the signal (edges skipped). */
    static double amplitudeAt(Signal s, double hz) {
        double[] x = s.unsafeSamples();
        int from = x.length / 4;
        int to = 3 * x.length / 4;
        double cc = 0;
        double ss = 0;
        double cs = 0;
        double xc = 0;
        double xs = 0;
        for (int i = from; i < to; i++) {
            double w = 2 * Math.PI * hz * i / s.sampleRateHz();
            double c = Math.cos(w);
            double sn = Math.sin(w);
            cc += c * c;
            ss += sn * sn;
            cs += c * sn;
            xc += x[i] * c;
            xs += x[i] * sn;
        }
        double det = cc * ss - cs * cs;
        double a = (xc * ss - xs * cs) / det;
        double b = (xs * cc - xc * cs) / det;
        return Math.hypot(a, b);
    }

    static double rms(Signal s) {
        double[] x = s.unsafeSamples();
        int from = x.length / 4;
        int to = 3 * x.length / 4;
        double acc = 0;
        for (int i = from; i < to; i++) {
            acc += x[i] * x[i];
        }
        return Math.sqrt(acc / (to - from));
    }

    @Test
    void keepsAPassbandToneWithinATenthOfADecibel() {
        Signal out = resampler().resample(tone(1000, 44_100, 1.0), 8000);
        assertEquals(8000, out.sampleRateHz());
        assertEquals(8000, out.length(), 2);
        double db = 20 * Math.log10(amplitudeAt(out, 1000) / 0.5);
        assertEquals(0, db, 0.1);
    }

    @Test
    void rejectsAToneAboveTheNewNyquistFrequency() {
        // Nyquist-Shannon: 6 kHz cannot exist at 8 kHz; whatever comes out is alias, measured as total RMS.
        Signal out = resampler().resample(tone(6000, 44_100, 1.0), 8000);
        double db = 20 * Math.log10(rms(out) / (0.5 / Math.sqrt(2)));
        assertTrue(db < -requiredRejectionDb(), "6 kHz leaks at " + db + " dB");
    }

    @Test
    void upsamplesWithoutLoss() {
        Signal out = resampler().resample(tone(440, 8000, 0.5), 22_050);
        assertEquals(0, 20 * Math.log10(amplitudeAt(out, 440) / 0.5), 0.1);
    }

    @Test
    void sameRateIsIdentity() {
        Signal in = tone(440, 8000, 0.1);
        assertEquals(in, resampler().resample(in, 8000));
    }
}

class KaiserResamplerContractTest extends ResamplerContractTest {
    @Override
    Resampler resampler() {
        return KaiserResampler.forBits(8);
    }
}

class KaiserHighResolutionContractTest extends ResamplerContractTest {
    @Override
    Resampler resampler() {
        return KaiserResampler.forBits(16);
    }

    @Override
    double requiredRejectionDb() {
        // A 16-bit target: stopband below its quantization noise, 6.02*16 + 1.76 = 98 dB (Bennett 1948).
        return 98;
    }
}

class KaiserIrrationalRatioContractTest extends ResamplerContractTest {
    @Override
    Resampler resampler() {
        // rates that are not whole numbers take the interpolated-phase path
        return new Resampler() {
            final KaiserResampler k = KaiserResampler.forBits(10);

            @Override
            public Signal resample(Signal s, double rate) {
                if (s.sampleRateHz() == rate) {
                    return k.resample(s, rate); // the resampler's own same-rate path, not the test's
                }
                return k.resample(Signal.wrap(s.unsafeSamples(), s.sampleRateHz() + 0.5), rate);
            }

            @Override
            public String name() {
                return "shifted";
            }
        };
    }

    @Test
    void usesTheInterpolatedPath() {
        assertEquals(null, KaiserResampler.fraction(44_100.5, 8000));
    }
}

class TarsosResamplerContractTest extends ResamplerContractTest {
    @Override
    Resampler resampler() {
        return new TarsosResampler();
    }
}
