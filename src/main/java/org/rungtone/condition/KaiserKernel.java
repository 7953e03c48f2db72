package org.rungtone.condition;

import org.rungtone.internal.Bessel;

/**
 * The one Kaiser-windowed sinc low-pass design that every resampler of ours uses (the conditioning
 * {@link KaiserResampler} and the analysis preview's resampler).
 *
 * <p>For stopband attenuation A dB and a transition of Δf cycles per input sample (stop edge minus pass edge,
 * over the input rate) the window is N = (A − 7.95)/(14.36·Δf) input samples long and its half-width is
 * ⌈N/2⌉, at least 2; β = 0.1102·(A − 8.7) for A &gt; 50, 0.5842·(A − 21)^0.4 + 0.07886·(A − 21) for
 * 21 ≤ A ≤ 50 and 0 below (J. F. Kaiser, "Nonrecursive Digital Filter Design Using the I0-sinh Window
 * Function", Proc. IEEE ISCAS 1974; the same length in radians, (A − 8)/(2.285·Δω), is in A. V. Oppenheim
 * and R. W. Schafer, Discrete-Time Signal Processing, 3rd ed., §7.5.3). The cutoff fc sits midway between
 * the edges, and the kernel at t input samples from the output's time is
 * {@code h(t) = 2fc·sinc(2fc·t)·I0(β·√(1 − (t/half)²))/I0(β)}, zero for |t| ≥ half.
 *
 * <p>Immutable. How the kernel is laid out in taps and phases is each resampler's own business.
 */
public final class KaiserKernel {
    private final double cutoff;
    private final int halfWidth;
    private final double beta;
    private final double i0Beta;

    private KaiserKernel(double cutoff, int halfWidth, double beta) {
        this.cutoff = cutoff;
        this.halfWidth = halfWidth;
        this.beta = beta;
        this.i0Beta = Bessel.i0(beta);
    }

    /** A low-pass at {@code rateHz}, flat to {@code passHz} and {@code attenuationDb} down from {@code stopHz}. */
    public static KaiserKernel lowPass(double rateHz, double passHz, double stopHz, double attenuationDb) {
        return new KaiserKernel((passHz + stopHz) / 2 / rateHz, halfWidth(rateHz, passHz, stopHz, attenuationDb),
                beta(attenuationDb));
    }

    /** The window's half-width in input samples, ⌈N/2⌉ and at least 2, for the design's edges. */
    public static int halfWidth(double rateHz, double passHz, double stopHz, double attenuationDb) {
        int n = (int) Math.ceil((attenuationDb - 7.95) / (14.36 * (stopHz - passHz) / rateHz));
        return Math.max(2, (n + 1) / 2);
    }

    /** Kaiser's β for a stopband attenuation in dB. */
    public static double beta(double attenuationDb) {
        if (attenuationDb > 50) {
            return 0.1102 * (attenuationDb - 8.7);
        }
        return attenuationDb >= 21 ? 0.5842 * Math.pow(attenuationDb - 21, 0.4) + 0.07886 * (attenuationDb - 21)
                : 0;
    }

    /** The window's half-width in input samples: h is zero from here outwards. */
    public int halfWidth() {
        return halfWidth;
    }

    /** The cutoff in cycles per input sample, midway between the pass and stop edges. */
    public double cutoff() {
        return cutoff;
    }

    /** h(t), t in input samples from the output sample's time. */
    public double at(double t) {
        double r = t / halfWidth;
        double w = Math.abs(r) >= 1 ? 0 : Bessel.i0(beta * Math.sqrt(1 - r * r)) / i0Beta;
        return 2 * cutoff * sinc(2 * cutoff * t) * w;
    }

    private static double sinc(double x) {
        if (Math.abs(x) < 1e-12) {
            return 1;
        }
        double px = Math.PI * x;
        return Math.sin(px) / px;
    }
}
