package org.rungtone.script.eval;

/**
 * sin(2π·p) for a phase p in cycles, without a library call: the phase is folded into [−¼, ¼] cycle by the
 * symmetries of the sine, then the Taylor series of sin y is summed through y^19 by Horner's rule. On
 * |y| ≤ π/2 the first omitted term is (π/2)^21/21! ≈ 2.6e-16, so the result is within a few 1e-16 of the true
 * sine (M. Abramowitz, I. A. Stegun, Handbook of Mathematical Functions, 4.3.65).
 */
final class FastSine {
    private static final double TWO_PI = 2 * Math.PI;
    private static final double C3 = -1.0 / 6;
    private static final double C5 = 1.0 / 120;
    private static final double C7 = -1.0 / 5040;
    private static final double C9 = 1.0 / 362880;
    private static final double C11 = -1.0 / 39916800;
    private static final double C13 = 1.0 / 6227020800.0;
    private static final double C15 = -1.0 / 1307674368000.0;
    private static final double C17 = 1.0 / 355687428096000.0;
    private static final double C19 = -1.0 / 121645100408832000.0;

    private FastSine() {
    }

    /** sin(2π·p). */
    static double sin2pi(double p) {
        double x = p - Math.rint(p);                              // [-0.5, 0.5] cycles
        // Fold into [-0.25, 0.25] with sin(π − y) = sin y, written without branches so loops vectorize.
        double r = x - 2 * (x - Math.max(-0.25, Math.min(0.25, x)));
        double y = r * TWO_PI;
        double y2 = y * y;
        double s = C17 + y2 * C19;
        s = C15 + y2 * s;
        s = C13 + y2 * s;
        s = C11 + y2 * s;
        s = C9 + y2 * s;
        s = C7 + y2 * s;
        s = C5 + y2 * s;
        s = C3 + y2 * s;
        return y + y * y2 * s;
    }
}
