package org.rungtone.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.SplittableRandom;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/**
 * The held-input shortcut gives what resampling the held staircase sample by sample gives, both where the
 * rates repeat their alignment within a short period (16 kHz to 44.1 kHz: 160 codes per 441 outputs) and
 * where they do not (16.001 kHz to 44.1 kHz, output by output).
 */
class SincResamplerTest {
    @ParameterizedTest
    @CsvSource({"8000, 8, 48000", "16000, 8, 48000", "22050, 8, 44100", "11025, 9, 44100",
        "16000, 8, 44100", "12000, 8, 44100", "16001, 8, 44100"})
    void summingTheKernelOverEachHoldChangesNothingButRounding(double codeRate, int factor, double outRate) {
        double fine = factor * codeRate;
        double pass = Math.min(20000, 0.4535 * outRate);
        SincResampler r = new SincResampler(fine, outRate, pass, outRate - pass, 100,
                new double[] {1.0 / 24, 11.0 / 12, 1.0 / 24});
        SplittableRandom rnd = new SplittableRandom(5);
        int[] codes = new int[3000];
        double[] level = new double[16];
        for (int i = 0; i < codes.length; i++) {
            codes[i] = rnd.nextInt(16);
        }
        for (int k = 0; k < level.length; k++) {
            level[k] = -1 + 2.0 * k / 15 + 0.01 * rnd.nextDouble();
        }
        int outLength = (int) (codes.length * outRate / codeRate);
        double[] direct = new double[outLength];
        long[] next = {-r.half() - 1};
        SincResampler.Source held = (dst, offset, count) -> {
            for (int k = 0; k < count; k++) {
                long code = Math.floorDiv(next[0] + k, factor);
                dst[offset + k] = code >= 0 && code < codes.length ? level[codes[(int) code]] : 0;
            }
            next[0] += count;
        };
        r.resampleInto(held, -r.half() - 1, 0, outLength, -0.5, direct);
        double[] fast = new double[outLength];
        r.resampleHeld(r.new Held(factor), codes, level, 0, outLength, -0.5, fast);
        // 1e-11: sample by sample, output j sits at j·ratio in floating point, whose rounding grows with j
        // (about 1e-12 of a fine sample here); the periodic shortcut places it from whole numbers
        for (int j = 0; j < outLength; j++) {
            assertEquals(direct[j], fast[j], 1e-11, "output " + j);
        }
    }
}
