package org.rungtone.script.eval;

/**
 * Turns white noise into pink noise (power spectral density ∝ 1/f, −3.01 dB per octave) with a cascade of
 * first-order sections whose real poles and zeros alternate at equal spacing on a logarithmic frequency axis;
 * each pole–zero pair tilts the response by half the pair's spacing, so the cascade approximates a slope of
 * −10 dB per decade within a small ripple (S. Saletti, "A comparison between two methods to generate 1/f^γ
 * noise", Proc. IEEE 74(11), 1986; P. Corsini, R. Saletti, IEEE Trans. Instrum. Meas. 37(4), 1988). Poles and
 * zeros map to the sampled domain by the matched z-transform, z = exp(−2π·f/fs). Below the lowest pole the
 * spectrum is flat; the output is scaled so its standard deviation is that of the white input.
 */
final class PinkFilter {
    /** Lowest pole frequency, in hertz. */
    private static final double LOWEST_HZ = 5.0;
    /** Frequency ratio between successive poles. */
    private static final double SPACING = 3.0;

    private final double[] poles;
    private final double[] zeros;
    private final double[] lastIn;
    private final double[] lastOut;
    private final double gain;

    private PinkFilter(double[] poles, double[] zeros, double gain) {
        this.poles = poles;
        this.zeros = zeros;
        this.lastIn = new double[poles.length];
        this.lastOut = new double[poles.length];
        this.gain = gain;
    }

    /** A filter for sample rate {@code rateHz}, its gain set from the power of its impulse response. */
    static PinkFilter design(double rateHz) {
        int count = 0;
        while (LOWEST_HZ * Math.pow(SPACING, count) < rateHz / 2 && count < 40) {
            count++;
        }
        double[] p = new double[count];
        double[] z = new double[count];
        for (int k = 0; k < count; k++) {
            double pole = LOWEST_HZ * Math.pow(SPACING, k);
            p[k] = Math.exp(-2 * Math.PI * pole / rateHz);
            z[k] = Math.exp(-2 * Math.PI * pole * Math.sqrt(SPACING) / rateHz);
        }
        PinkFilter probe = new PinkFilter(p, z, 1.0);
        double slowest = count == 0 ? 0 : p[0];
        long length = Math.min(4_000_000L, 40 + (long) Math.ceil(30.0 / Math.max(1e-12, 1 - slowest)));
        double energy = 0;
        for (long i = 0; i < length; i++) {
            double h = probe.next(i == 0 ? 1 : 0);
            energy += h * h;
        }
        return new PinkFilter(p, z, 1 / Math.sqrt(energy));
    }

    /** Filters one sample. */
    double next(double x) {
        double v = x;
        for (int k = 0; k < poles.length; k++) {
            double y = v - zeros[k] * lastIn[k] + poles[k] * lastOut[k];
            lastIn[k] = v;
            lastOut[k] = y;
            v = y;
        }
        return v * gain;
    }
}
