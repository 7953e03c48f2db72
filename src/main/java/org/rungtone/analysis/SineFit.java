package org.rungtone.analysis;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.linear.SingularMatrixException;
import org.rungtone.internal.Checks;

/**
 * Least-squares sine fits, IEEE Std 1241-2010 §4.1.4 (also IEEE Std 1057): the model is
 * {@code y(t) = A·cos(ωt) + B·sin(ωt) + C}, t = i/rate.
 *
 * <p>The three-parameter fit (known ω) is linear in A, B, C. The four-parameter fit linearises in ω too:
 * each Gauss-Newton step solves for (A, B, C, Δω) with the extra column {@code t·(−A·sin ωt + B·cos ωt)} and
 * updates ω until the relative step is below 1e-12. It starts from a three-parameter fit at the frequency of
 * the largest peak of a 7-term Blackman-Harris spectrum, refined by parabolic interpolation of the log
 * power of the peak bin and its neighbours. Time is centred on the record for conditioning; the reported
 * phase refers to t = 0 at the first sample. The small normal equations are solved by Commons Math's QR
 * decomposition; residuals are computed directly from the fitted model.
 */
public final class SineFit {
    private static final int MAX_ITERATIONS = 50;
    private static final double TOLERANCE = 1e-12;

    private SineFit() {
    }

    /**
     * A fitted sine {@code y = amplitude·cos(2π·frequencyHz·t + phaseRad) + offset}.
     *
     * @param frequencyHz fitted frequency in hertz
     * @param amplitude peak amplitude (full scale = 1)
     * @param phaseRad phase at the first sample, radians
     * @param offset DC offset
     * @param residualRms root-mean-square of the residual (noise and distortion)
     * @param iterations Gauss-Newton steps taken (0 for a three-parameter fit)
     */
    public record Result(double frequencyHz, double amplitude, double phaseRad, double offset,
            double residualRms, int iterations) {
        /** SINAD in dB from the fit: {@code 10·log10((A²/2) / residualRms²)} (IEEE Std 1241-2010). */
        public double sinadDb() {
            return 10 * Math.log10(0.5 * amplitude * amplitude / (residualRms * residualRms));
        }

        /** Effective number of bits, {@code (SINAD − 1.76)/6.02}. */
        public double enobBits() {
            return (sinadDb() - 1.76) / 6.02;
        }

        /** The model's value at sample {@code i} of a signal at {@code sampleRateHz}. */
        public double valueAt(int i, double sampleRateHz) {
            return amplitude * Math.cos(2 * Math.PI * frequencyHz * i / sampleRateHz + phaseRad) + offset;
        }
    }

    /**
     * The four-parameter fit, seeded from the signal's spectrum.
     *
     * @throws IllegalArgumentException when there are fewer than 16 samples or no tone stands out
     */
    public static Result fit(double[] samples, double sampleRateHz) {
        return fit(samples, sampleRateHz, estimateFrequencyHz(samples, sampleRateHz));
    }

    /**
     * The four-parameter fit starting from {@code initialFrequencyHz} (within a fraction of a bin,
     * rate/n, of the true frequency for reliable convergence).
     *
     * @throws IllegalArgumentException when there are fewer than 16 samples or the fit is singular
     */
    public static Result fit(double[] samples, double sampleRateHz, double initialFrequencyHz) {
        checkInput(samples, sampleRateHz, initialFrequencyHz);
        int n = samples.length;
        double mid = 0.5 * (n - 1);
        double omega = 2 * Math.PI * initialFrequencyHz / sampleRateHz;
        double[] abc = threeParameter(samples, omega, mid);
        int iterations = 0;
        while (iterations < MAX_ITERATIONS) {
            iterations++;
            double[] step = fourParameterStep(samples, omega, abc, mid);
            abc[0] = step[0];
            abc[1] = step[1];
            abc[2] = step[2];
            // The fourth column is scaled by 1/n, so step[3]/n is Δω in radians per sample.
            double dOmega = step[3] / n;
            omega += dOmega;
            if (Math.abs(dOmega) <= TOLERANCE * Math.abs(omega)) {
                abc = threeParameter(samples, omega, mid);
                break;
            }
        }
        return result(samples, sampleRateHz, omega, abc, mid, iterations);
    }

    /**
     * The three-parameter fit at a known frequency.
     *
     * @throws IllegalArgumentException when there are fewer than 16 samples or the fit is singular
     */
    public static Result fitKnownFrequency(double[] samples, double sampleRateHz, double frequencyHz) {
        checkInput(samples, sampleRateHz, frequencyHz);
        double mid = 0.5 * (samples.length - 1);
        double omega = 2 * Math.PI * frequencyHz / sampleRateHz;
        return result(samples, sampleRateHz, omega, threeParameter(samples, omega, mid), mid, 0);
    }

    /**
     * The frequency of the strongest spectral peak away from DC, by parabolic interpolation of the log
     * power around the peak bin of a 7-term Blackman-Harris spectrum.
     *
     * @throws IllegalArgumentException when there are fewer than 16 samples or the signal has no peak
     */
    public static double estimateFrequencyHz(double[] samples, double sampleRateHz) {
        Checks.checkArgument(samples.length >= 16, "a sine fit needs at least 16 samples: %d", samples.length);
        return estimateFrequencyHz(Spectrum.of(samples, sampleRateHz, Window.BLACKMAN_HARRIS_7));
    }

    /**
     * The strongest peak of a spectrum already at hand (see {@link #estimateFrequencyHz(double[], double)}).
     *
     * @throws IllegalArgumentException when the spectrum has no peak away from DC
     */
    public static double estimateFrequencyHz(Spectrum s) {
        int skip = s.mainLobeHalfWidthBins();
        int best = -1;
        double bestPower = 0;
        for (int k = skip; k < s.bins(); k++) {
            if (s.power(k) > bestPower) {
                bestPower = s.power(k);
                best = k;
            }
        }
        Checks.checkArgument(best > 0, "no tone found away from DC");
        double delta = 0;
        if (best > 0 && best < s.bins() - 1) {
            double a = Math.log(Math.max(s.power(best - 1), Double.MIN_NORMAL));
            double b = Math.log(s.power(best));
            double c = Math.log(Math.max(s.power(best + 1), Double.MIN_NORMAL));
            double den = a - 2 * b + c;
            if (den < 0) {
                delta = Math.max(-0.5, Math.min(0.5, 0.5 * (a - c) / den));
            }
        }
        return (best + delta) * s.binHz();
    }

    private static void checkInput(double[] samples, double sampleRateHz, double frequencyHz) {
        Checks.checkArgument(samples.length >= 16, "a sine fit needs at least 16 samples: %d", samples.length);
        Checks.checkArgument(Double.isFinite(sampleRateHz) && sampleRateHz > 0,
                "sample rate must be positive: %s", sampleRateHz);
        Checks.checkArgument(frequencyHz > 0 && frequencyHz < sampleRateHz / 2,
                "the frequency must lie between 0 and half the rate: %s Hz", frequencyHz);
    }

    /** A, B, C of the three-parameter fit at ω (radians per sample), time centred on {@code mid}. */
    private static double[] threeParameter(double[] y, double omega, double mid) {
        double[][] m = new double[3][3];
        double[] r = new double[3];
        double[] col = new double[3];
        for (int i = 0; i < y.length; i++) {
            double ph = omega * (i - mid);
            col[0] = Math.cos(ph);
            col[1] = Math.sin(ph);
            col[2] = 1;
            addOuter(m, r, col, y[i]);
        }
        return solve(m, r);
    }

    /** One Gauss-Newton step: the new A, B, C and n·Δω. */
    private static double[] fourParameterStep(double[] y, double omega, double[] abc, double mid) {
        double[][] m = new double[4][4];
        double[] r = new double[4];
        double[] col = new double[4];
        double inv = 1.0 / y.length;
        for (int i = 0; i < y.length; i++) {
            double t = i - mid;
            double ph = omega * t;
            double c = Math.cos(ph);
            double s = Math.sin(ph);
            col[0] = c;
            col[1] = s;
            col[2] = 1;
            col[3] = t * inv * (-abc[0] * s + abc[1] * c);
            addOuter(m, r, col, y[i]);
        }
        return solve(m, r);
    }

    private static void addOuter(double[][] m, double[] r, double[] col, double y) {
        for (int a = 0; a < col.length; a++) {
            r[a] += col[a] * y;
            for (int b = a; b < col.length; b++) {
                m[a][b] += col[a] * col[b];
            }
        }
    }

    private static double[] solve(double[][] upper, double[] rhs) {
        int k = rhs.length;
        for (int a = 0; a < k; a++) {
            for (int b = 0; b < a; b++) {
                upper[a][b] = upper[b][a];
            }
        }
        try {
            RealVector x = new QRDecomposition(new Array2DRowRealMatrix(upper, false), 1e-14).getSolver()
                    .solve(new ArrayRealVector(rhs, false));
            return x.toArray();
        } catch (SingularMatrixException e) {
            throw new IllegalArgumentException("the sine fit is singular (constant or too short a signal)", e);
        }
    }

    private static Result result(double[] y, double rate, double omega, double[] abc, double mid,
            int iterations) {
        double sum = 0;
        for (int i = 0; i < y.length; i++) {
            double ph = omega * (i - mid);
            double e = y[i] - (abc[0] * Math.cos(ph) + abc[1] * Math.sin(ph) + abc[2]);
            sum += e * e;
        }
        double amplitude = Math.hypot(abc[0], abc[1]);
        // A·cos(ω(i − mid)) + B·sin(ω(i − mid)) = amp·cos(ωi − ω·mid − atan2(B, A)).
        double phase = Math.IEEEremainder(-Math.atan2(abc[1], abc[0]) - omega * mid, 2 * Math.PI);
        return new Result(omega * rate / (2 * Math.PI), amplitude, phase, abc[2], Math.sqrt(sum / y.length),
                iterations);
    }
}
