package org.rungtone.analysis;

import org.rungtone.internal.Checks;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.Signal;

/**
 * How much in-band SNR an error-feedback filter wins (positive dB) or loses (negative) against plain
 * quantization with the same dither.
 *
 * <p>Analytic form: with a white quantizer error (true with TPDF dither, close without) the shaped error has
 * density ∝ {@code |NTF(e^jω)|²}, {@code NTF(z) = Σ g_m z^−m}, g = (1, −h0, −h1, …). With the
 * autocorrelation {@code c_m = Σ_j g_j·g_(j+m)}, {@code ∫0^ωc |NTF|² dω = c_0·ωc + 2·Σ_(m≥1) c_m·sin(m·ωc)/m};
 * the gain is {@code 10·log10(ωc / ∫0^ωc |NTF|² dω)} with {@code ωc = 2π·cutoff/rate}. First order at
 * cutoff rate/8 gives +7.0 dB; at rate/2 every filter loses {@code 10·log10(Σ g_m²)} (first order −3.01 dB),
 * the total-power doubling of Gerzon and Craven ("Optimal Noise Shaping and Dither of Digital Signals", AES
 * preprint 2822, 1989). The measured form quantizes a real signal both ways and compares in-band SNRs from
 * {@link AudioMetrics}, which includes the quantizer's actual (not ideally white) error and any overload.
 */
public final class ShapingGain {
    private static final int WEIGHTING_STEPS = 4096;

    private ShapingGain() {
    }

    /**
     * The analytic in-band SNR gain in dB of {@code filter} below {@code cutoffHz} at {@code sampleRateHz}
     * (cutoff clamped to rate/2).
     *
     * @throws IllegalArgumentException when the rate or cutoff is not positive
     */
    public static double inBandSnrGainDb(ErrorFilter filter, double sampleRateHz, double cutoffHz) {
        Checks.checkArgument(sampleRateHz > 0 && cutoffHz > 0, "rate and cutoff must be positive: %s, %s",
                sampleRateHz, cutoffHz);
        double wc = 2 * Math.PI * Math.min(cutoffHz, sampleRateHz / 2) / sampleRateHz;
        double[] c = autocorrelation(filter);
        double integral = c[0] * wc;
        for (int m = 1; m < c.length; m++) {
            integral += 2 * c[m] * Math.sin(m * wc) / m;
        }
        return 10 * Math.log10(wc / integral);
    }

    /**
     * The analytic gain in A-weighted noise power of {@code filter} at {@code sampleRateHz}: the mean of
     * {@code 10^(A(f)/10)} over 0 .. rate/2 divided by its mean weighted by {@code |NTF|²}, in dB
     * (Simpson's rule over 4096 intervals). Shaping that pushes the error to 2..5 kHz, where the ear is most
     * sensitive, can lose here while it wins in band.
     */
    public static double aWeightedSnrGainDb(ErrorFilter filter, double sampleRateHz) {
        Checks.checkArgument(sampleRateHz > 0, "rate must be positive: %s", sampleRateHz);
        double flat = 0;
        double shaped = 0;
        for (int i = 0; i <= WEIGHTING_STEPS; i++) {
            double w = i == 0 || i == WEIGHTING_STEPS ? 1 : i % 2 == 1 ? 4 : 2;
            double f = 0.5 * sampleRateHz * i / WEIGHTING_STEPS;
            double a = AWeighting.powerGain(f);
            double ntf = filter.noiseGain(Math.PI * i / WEIGHTING_STEPS);
            flat += w * a;
            shaped += w * a * ntf * ntf;
        }
        return 10 * Math.log10(flat / shaped);
    }

    /**
     * The measured in-band SNR of plain and shaped quantization of {@code reference} onto {@code table}.
     *
     * @param flatInBandSnrDb in-band SNR without shaping
     * @param shapedInBandSnrDb in-band SNR with the filter
     * @param gainDb shaped minus flat
     */
    public record Measured(double flatInBandSnrDb, double shapedInBandSnrDb, double gainDb) {
    }

    /**
     * Quantizes {@code reference} twice, with and without {@code filter}, and compares the in-band SNRs below
     * {@code cutoffHz}.
     */
    public static Measured measure(Signal reference, LevelTable table, Dither dither, ErrorFilter filter,
            long seed, double cutoffHz) {
        AudioMetrics metrics = AudioMetrics.of(reference, cutoffHz);
        double flat = metrics.measure("flat", quantize(reference, table, dither, ErrorFilter.NONE, seed), table)
                .inBandSnrDb();
        double shaped = metrics.measure("shaped", quantize(reference, table, dither, filter, seed), table)
                .inBandSnrDb();
        return new Measured(flat, shaped, shaped - flat);
    }

    private static Codes quantize(Signal s, LevelTable table, Dither dither,
            ErrorFilter filter, long seed) {
        return new Quantizer(table, table.minVolts(), table.maxVolts(), dither, filter, seed).apply(s).codes();
    }

    private static double[] autocorrelation(ErrorFilter filter) {
        double[] h = filter.taps();
        double[] g = new double[h.length + 1];
        g[0] = 1;
        for (int k = 0; k < h.length; k++) {
            g[k + 1] = -h[k];
        }
        double[] c = new double[g.length];
        for (int m = 0; m < g.length; m++) {
            for (int j = 0; j + m < g.length; j++) {
                c[m] += g[j] * g[j + m];
            }
        }
        return c;
    }
}
