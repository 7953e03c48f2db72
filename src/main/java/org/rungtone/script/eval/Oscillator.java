package org.rungtone.script.eval;

import java.util.List;
import org.rungtone.script.ast.Pos;

/**
 * A phase-continuous oscillator whose frequency may change every sample. The phase (in cycles) is the
 * integral of the frequency over the part's local time, φ(t) = ∫₀ᵗ f(τ) dτ, summed by the trapezoidal rule
 * (exact for a linear sweep) with Kahan-compensated addition so rounding does not drift; the waveform is read
 * from φ mod 1. When the part restarts (its local time jumps back), the phase starts again from zero. A
 * constant frequency takes a direct path, φ = φ₀ + f·(t − t₀), which is exact and cheap.
 *
 * <p>The naive form sin(2π·f(t)·t) is wrong for a changing frequency: its instantaneous frequency is
 * f(t) + t·f'(t), not f(t) (see e.g. R. G. Lyons, Understanding Digital Signal Processing, 3rd ed., on chirps).
 * Waveforms are not band-limited.
 */
final class Oscillator extends Eval {
    /** Waveforms; all start at phase 0 and swing between −1 and +1, except the unipolar pulse. */
    enum Wave { SINE, TRIANGLE, SQUARE, SAW_UP, SAW_DOWN, PULSE }

    private final Wave wave;
    private final Eval frequency;
    /** The start phase (sine, triangle), the duty (square) or the width in seconds (pulse); may be null. */
    private final Eval shape;
    private final Frame frame;
    private final double[] phases = new double[Block.SIZE];
    private final double[] out = new double[Block.SIZE];
    private boolean started;
    private double phase;
    private double compensation;
    private double prevT;
    private double prevF;

    Oscillator(Pos pos, String label, Wave wave, Eval frequency, Eval shape, Frame frame) {
        super(pos, label);
        this.wave = wave;
        this.frequency = frequency;
        this.shape = shape;
        this.frame = frame;
    }

    @Override
    double[] compute(Block b) {
        double[] f = frequency.run(b);
        double[] t = frame.t;
        int n = b.length;
        boolean running = frame.monotonic && started && t[0] >= prevT;
        if (running && frequency.isConstant()) {
            steady(f[0], t, n);
        } else if (running) {
            glide(f, t, n);
        } else {
            integrate(f, t, n);
        }
        shape(b, f, n);
        return out;
    }

    private void steady(double f, double[] t, int n) {
        double base = phase;
        double t0 = prevT;
        for (int i = 0; i < n; i++) {
            double p = base + f * (t[i] - t0);
            phases[i] = p - Math.floor(p);
        }
        double dt = t[n - 1] - t0;
        double product = f * dt;
        add(product);
        add(productError(f, dt, product));
        phase -= Math.floor(phase);
        prevT = t[n - 1];
        prevF = f;
    }

    /** A changing frequency on a clock that neither restarts nor starts within the block. */
    private void glide(double[] f, double[] t, int n) {
        double p = phase;
        double c = compensation;
        double lastT = prevT;
        double lastF = prevF;
        for (int i = 0; i < n; i++) {
            double y = 0.5 * (lastF + f[i]) * (t[i] - lastT) - c;
            double sum = p + y;
            c = (sum - p) - y;
            p = sum;
            if (p >= 1 || p < 0) {
                p -= Math.floor(p);
            }
            phases[i] = p;
            lastT = t[i];
            lastF = f[i];
        }
        phase = p;
        compensation = c;
        prevT = lastT;
        prevF = lastF;
    }

    private void integrate(double[] f, double[] t, int n) {
        for (int i = 0; i < n; i++) {
            double ti = t[i];
            double fi = f[i];
            if (ti < 0) {
                started = false;
                phases[i] = 0;
                continue;
            }
            if (!started || ti < prevT) {
                phase = fi * ti;
                compensation = 0;
                started = true;
            } else {
                add(0.5 * (prevF + fi) * (ti - prevT));
            }
            if (phase >= 1 || phase < 0) {
                phase -= Math.floor(phase);
            }
            phases[i] = phase;
            prevT = ti;
            prevF = fi;
        }
    }

    /** Kahan summation (W. Kahan, "Further remarks on reducing truncation errors", Comm. ACM 8(1), 1965). */
    private void add(double x) {
        double y = x - compensation;
        double s = phase + y;
        compensation = (s - phase) - y;
        phase = s;
    }

    /**
     * The rounding error of {@code product = a·b}, exactly, by Dekker's splitting (T. J. Dekker, "A
     * floating-point technique for extending the available precision", Numer. Math. 18, 1971).
     */
    private static double productError(double a, double b, double product) {
        if (!Double.isFinite(product) || Math.abs(a) > 1e150 || Math.abs(b) > 1e150) {
            return 0;
        }
        double ca = 134217729.0 * a;
        double ahi = ca - (ca - a);
        double alo = a - ahi;
        double cb = 134217729.0 * b;
        double bhi = cb - (cb - b);
        double blo = b - bhi;
        return ((ahi * bhi - product) + ahi * blo + alo * bhi) + alo * blo;
    }

    private void shape(Block b, double[] f, int n) {
        double[] s = shape == null ? null : shape.run(b);
        switch (wave) {
            case SINE:
                if (s == null) {
                    for (int i = 0; i < n; i++) {
                        out[i] = FastSine.sin2pi(phases[i]);
                    }
                } else {
                    for (int i = 0; i < n; i++) {
                        out[i] = FastSine.sin2pi(phases[i] + s[i]);
                    }
                }
                break;
            case TRIANGLE:
                if (s != null) {
                    for (int i = 0; i < n; i++) {
                        phases[i] += s[i];
                    }
                }
                for (int i = 0; i < n; i++) {
                    double x = phases[i] + 0.25;
                    x -= Math.floor(x);
                    out[i] = 1 - 4 * Math.abs(x - 0.5);
                }
                break;
            case SQUARE:
                double duty = s == null ? 0.5 : Double.NaN;
                for (int i = 0; i < n; i++) {
                    double d = s == null ? duty : s[i];
                    // 0·phase keeps a NaN phase visible instead of turning it into a level
                    out[i] = (phases[i] < d ? 1 : -1) + 0 * phases[i];
                }
                break;
            case SAW_UP:
            case SAW_DOWN:
                double sign = wave == Wave.SAW_UP ? 1 : -1;
                for (int i = 0; i < n; i++) {
                    double x = phases[i] + 0.5;
                    x -= Math.floor(x);
                    out[i] = sign * (2 * x - 1);
                }
                break;
            default:
                for (int i = 0; i < n; i++) {
                    out[i] = (phases[i] < s[i] * f[i] ? 1 : 0) + 0 * phases[i];
                }
        }
    }

    @Override
    List<Eval> inputs() {
        return shape == null ? List.of(frequency) : List.of(frequency, shape);
    }
}
