package org.rungtone.internal;

/** The modified Bessel function the Kaiser window needs. */
public final class Bessel {
    private Bessel() {
    }

    /**
     * I0(x), the zeroth-order modified Bessel function of the first kind, by its power series
     * {@code Σ ((x/2)^k / k!)²}, summed until a term no longer changes the sum in double precision.
     */
    public static double i0(double x) {
        double sum = 1;
        double term = 1;
        double q = x * x / 4;
        for (int k = 1; k < 200; k++) {
            term *= q / ((double) k * k);
            sum += term;
            if (term < sum * 1e-17) {
                break;
            }
        }
        return sum;
    }
}
