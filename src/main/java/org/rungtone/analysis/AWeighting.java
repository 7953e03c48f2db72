package org.rungtone.analysis;

/**
 * The A frequency weighting of IEC 61672-1:2013, from its analytic pole formula:
 * {@code A(f) = 20·log10(f4²·f⁴ / ((f² + f1²)·√((f² + f2²)(f² + f3²))·(f² + f4²))) + 2.00 dB} with
 * f1 = 20.60 Hz, f2 = 107.7 Hz, f3 = 737.9 Hz, f4 = 12194 Hz; the +2.00 dB normalises A(1 kHz) to 0 dB.
 */
public final class AWeighting {
    private static final double F1 = 20.60;
    private static final double F2 = 107.7;
    private static final double F3 = 737.9;
    private static final double F4 = 12194;
    private static final double NORMALISATION_DB = 2.00;

    private AWeighting() {
    }

    /** The weighting in dB at {@code hz}; −Infinity at 0 Hz. */
    public static double gainDb(double hz) {
        return 10 * Math.log10(powerGain(hz));
    }

    /** The weighting as a power ratio, {@code 10^(A(f)/10)}. */
    public static double powerGain(double hz) {
        double f2 = hz * hz;
        double num = F4 * F4 * f2 * f2;
        double den = (f2 + F1 * F1) * Math.sqrt((f2 + F2 * F2) * (f2 + F3 * F3)) * (f2 + F4 * F4);
        double amplitude = num / den;
        return amplitude * amplitude * Math.pow(10, NORMALISATION_DB / 10);
    }
}
