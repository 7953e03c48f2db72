package org.rungtone.analysis;

import org.rungtone.internal.Checks;

/**
 * Error-based signal-to-noise figures of an output against its reference.
 *
 * <p>The output is first aligned to the reference by the least-squares gain and offset (so a level shift or
 * an overall gain error of the DAC is not counted as noise); the SNR is then
 * {@code 10·log10(Σ ref² / Σ (ref − aligned)²)} with the reference's own mean removed.
 */
public final class ErrorMetrics {
    private ErrorMetrics() {
    }

    /**
     * The aligned error SNR in dB; {@code +Infinity} when the output equals the reference after alignment.
     *
     * @throws IllegalArgumentException when the lengths differ or the reference is empty
     */
    public static double alignedSnrDb(double[] reference, double[] output) {
        Checks.checkArgument(reference.length == output.length, "lengths differ: %d and %d",
                reference.length, output.length);
        Checks.checkArgument(reference.length > 1, "need at least two samples");
        int n = reference.length;
        double mr = 0;
        double mo = 0;
        for (int i = 0; i < n; i++) {
            mr += reference[i];
            mo += output[i];
        }
        mr /= n;
        mo /= n;
        double sro = 0;
        double soo = 0;
        double srr = 0;
        for (int i = 0; i < n; i++) {
            double r = reference[i] - mr;
            double o = output[i] - mo;
            sro += r * o;
            soo += o * o;
            srr += r * r;
        }
        double gain = soo > 0 ? sro / soo : 0;
        double err = 0;
        for (int i = 0; i < n; i++) {
            double e = (reference[i] - mr) - gain * (output[i] - mo);
            err += e * e;
        }
        if (err == 0) {
            return Double.POSITIVE_INFINITY;
        }
        return 10 * Math.log10(srr / err);
    }
}
