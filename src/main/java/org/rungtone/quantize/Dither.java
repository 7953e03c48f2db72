package org.rungtone.quantize;

import java.util.Locale;
import java.util.SplittableRandom;

/**
 * Dither added before quantization, in LSBs of the table's average step.
 *
 * <p>RPDF is uniform over one LSB peak to peak (noise power +LSB²/12, i.e. +3.01 dB over the plain
 * quantizer); TPDF is the sum of two such, two LSB peak to peak (+LSB²/6, +4.77 dB), and makes the error's
 * mean and variance independent of the signal (Lipshitz, Wannamaker, Vanderkooy, "Quantization and Dither:
 * A Theoretical Survey", J. Audio Eng. Soc. 40(5), 1992).
 */
public enum Dither {
    /** No dither. */
    NONE,
    /** Rectangular PDF, 1 LSB peak to peak. */
    RPDF,
    /** Triangular PDF, 2 LSB peak to peak. */
    TPDF;

    /** One dither value in LSBs, drawn from {@code random}. */
    public double next(SplittableRandom random) {
        switch (this) {
            case RPDF:
                return random.nextDouble() - 0.5;
            case TPDF:
                return random.nextDouble() - random.nextDouble();
            default:
                return 0;
        }
    }

    /** The option spelling: none, rpdf, tpdf. */
    public String label() {
        return name().toLowerCase(Locale.ROOT);
    }
}
