package org.rungtone.ladder;

/**
 * A full-scale coherent sine played through a DAC, reduced to the sums that the aligned error SNR needs so
 * that each board costs one pass over its levels.
 *
 * <p>The sine {@code x_n = sin(2π·J·n/M)} (M a power of two, J odd, so every sample has a different phase)
 * is quantized once to the nearest ideal code {@code c_n = round((x_n + 1)/2 · (2^N − 1))}; a board plays
 * {@code o_n = L[c_n]}. As in {@link org.rungtone.analysis.ErrorMetrics#alignedSnrDb} the output is aligned
 * to the reference by least-squares gain and offset and {@code SINAD = 10·log10(Σr² / Σ(r − g·o)²)} with
 * means removed, which equals {@code 10·log10(Srr / (Srr − Sro²/Soo))} in centred sums. Per code the probe
 * keeps the sample count and the sum of reference samples, so Soo and Sro take one pass over the 2^N levels.
 * ENOB follows IEEE Std 1241: {@code (SINAD − 1.76)/6.02}.
 */
final class SineProbe {
    private final int samples;
    private final int cycles;
    private final double[] count;
    private final double[] sumRef;
    private final double srr;
    private final double meanRef;

    SineProbe(int bits) {
        int codes = 1 << bits;
        samples = Math.min(1 << 18, Math.max(4096, 4 * codes));
        cycles = samples / 8 - 1;
        count = new double[codes];
        sumRef = new double[codes];
        double[] x = sine();
        double sum = 0;
        for (int n = 0; n < samples; n++) {
            int c = codeOf(x[n], codes);
            count[c]++;
            sumRef[c] += x[n];
            sum += x[n];
        }
        meanRef = sum / samples;
        double s = 0;
        for (int n = 0; n < samples; n++) {
            s += (x[n] - meanRef) * (x[n] - meanRef);
        }
        srr = s;
    }

    /** The reference sine. */
    double[] sine() {
        double[] x = new double[samples];
        for (int n = 0; n < samples; n++) {
            x[n] = Math.sin(2 * Math.PI * ((long) cycles * n % samples) / samples);
        }
        return x;
    }

    /** The ideal code of every sample. */
    int[] codes() {
        double[] x = sine();
        int[] c = new int[samples];
        for (int n = 0; n < samples; n++) {
            c[n] = codeOf(x[n], count.length);
        }
        return c;
    }

    private static int codeOf(double x, int codes) {
        return (int) Math.round((x + 1) / 2 * (codes - 1));
    }

    /** SINAD in dB of the sine played through {@code levels}. */
    double sinadDb(double[] levels) {
        double shift = levels[0];
        double so = 0;
        double soo = 0;
        double sro = 0;
        for (int k = 0; k < levels.length; k++) {
            double c = count[k];
            if (c == 0) {
                continue;
            }
            double l = levels[k] - shift;
            so += c * l;
            soo += c * l * l;
            sro += sumRef[k] * l;
        }
        double sroCentred = sro - meanRef * so;
        double sooCentred = soo - so * so / samples;
        if (sooCentred <= 0) {
            return 0;
        }
        double err = srr - sroCentred * sroCentred / sooCentred;
        return err <= 0 ? Double.POSITIVE_INFINITY : 10 * Math.log10(srr / err);
    }

    /** ENOB from SINAD (IEEE Std 1241). */
    static double enob(double sinadDb) {
        return (sinadDb - 1.76) / 6.02;
    }
}
