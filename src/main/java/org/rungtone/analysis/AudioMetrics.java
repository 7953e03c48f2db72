package org.rungtone.analysis;

import java.util.Optional;
import org.rungtone.internal.Checks;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.source.Signal;

/**
 * Error-based quality of arbitrary audio: an output (codes through a level table, or any signal at the
 * reference's rate) against the conditioned reference it was made from.
 *
 * <p>Alignment: the output is modelled as {@code o = g·r + c + g·e}; least squares give
 * {@code g = Σ(r − r̄)(o − ō) / Σ(r − r̄)²} and {@code c = ō − g·r̄}, and the error in reference units is
 * {@code e = (o − c)/g − r}. Fitting the output to the reference (as the sine fit of IEEE Std 1241-2010
 * fits a model to the output) leaves an error that is uncorrelated with the reference unbiased, and makes
 * gain and offset errors of the ladder invisible: they are not noise.
 *
 * <p>Figures, with {@code P_r} the reference's mean square (mean removed) and {@code P_e} the error's:
 * SINAD = {@code P_r/P_e}; in-band SNR = {@code (P_r·φ_r)/(P_e·φ_e)}, where φ is the fraction of a signal's
 * power at or below the cutoff in its Welch spectrum (Hann window, 8192-sample segments, half overlap);
 * A-weighted SNR = {@code P_r/(P_e·α_e)}, α the A-weighted fraction of the error's power (IEC 61672-1; the
 * reference is left unweighted, as for A-weighted noise figures in AES17); ENOB re full scale =
 * {@code (10·log10(½/P_e) − 1.76)/6.02}, which measures the error against a full-scale sine as IEEE Std
 * 1241-2010 defines ENOB, and so equals N for an ideal N-bit quantizer whatever the programme's level; ENOB
 * re signal = {@code (SINAD − 1.76)/6.02} holds the same error against the programme itself, lower by the
 * programme's distance below a full-scale sine in steps of 6.02 dB. Power fractions rather than absolute
 * spectral sums keep the in-band figure equal to SINAD when the cutoff is rate/2.
 *
 * <p>These are quantization-only figures: both signals are at the target rate. What the rate itself loses is
 * measured by {@link ListenerMetrics}.
 *
 * <p>Immutable and thread-safe: the reference's figures are computed once, in {@link #of}.
 */
public final class AudioMetrics {
    /** Welch segment length for the in-band and weighted fractions. */
    public static final int SEGMENT_LENGTH = 8192;

    /** Samples per block of the passes over an output; blocks run in parallel and add up in order. */
    private static final int BLOCK = 1 << 15;

    private final Signal reference;
    private final double inBandCutoffHz;
    private final double referenceMean;
    private final double referenceSumSquares;
    private final double referenceInBandFraction;

    private AudioMetrics(Signal reference, double inBandCutoffHz, double referenceMean,
            double referenceSumSquares, double referenceInBandFraction) {
        this.reference = reference;
        this.inBandCutoffHz = inBandCutoffHz;
        this.referenceMean = referenceMean;
        this.referenceSumSquares = referenceSumSquares;
        this.referenceInBandFraction = referenceInBandFraction;
    }

    /**
     * Prepares measurements against {@code reference}; the in-band cutoff is clamped to rate/2.
     *
     * @throws org.rungtone.internal.InputError when the reference is constant (nothing to measure)
     * @throws IllegalArgumentException when the reference has fewer than 16 samples or the cutoff is not
     *     positive
     */
    public static AudioMetrics of(Signal reference, double inBandCutoffHz) {
        double[] r = reference.unsafeSamples();
        Checks.checkArgument(r.length >= 16, "quality figures need at least 16 samples: %d", r.length);
        Checks.checkArgument(inBandCutoffHz > 0, "the in-band cutoff must be positive: %s", inBandCutoffHz);
        double cutoff = Math.min(inBandCutoffHz, reference.sampleRateHz() / 2);
        double mean = 0;
        for (double v : r) {
            mean += v;
        }
        mean /= r.length;
        double ss = 0;
        for (double v : r) {
            double d = v - mean;
            ss += d * d;
        }
        Checks.checkInput(ss > 0, "the reference signal is constant, so there is no sound to measure "
                + "quality against; use a source with some signal in it");
        // At a cutoff of rate/2 every bin is in band: the fraction is 1 without a transform.
        double fraction = 1;
        if (cutoff < reference.sampleRateHz() / 2) {
            Spectrum s = Spectrum.welch(r, mean, reference.sampleRateHz(), Window.HANN, segment(r.length));
            fraction = s.bandPower(0, cutoff) / s.totalPower();
        }
        return new AudioMetrics(reference, cutoff, mean, ss, fraction);
    }

    /** One-off measurement of {@code output} against {@code reference}. */
    public static QualityReport measure(String label, Signal reference, Signal output, double inBandCutoffHz) {
        return of(reference, inBandCutoffHz).measure(label, output);
    }

    /** The reference measured against. */
    public Signal reference() {
        return reference;
    }

    /** Upper edge of the in-band figure in hertz (clamped to rate/2). */
    public double inBandCutoffHz() {
        return inBandCutoffHz;
    }

    /**
     * Measures an output signal at the reference's rate and length; its units are free (alignment removes
     * gain and offset).
     *
     * @throws IllegalArgumentException when the rate or length differs from the reference's
     */
    public QualityReport measure(String label, Signal output) {
        Checks.checkArgument(output.sampleRateHz() == reference.sampleRateHz(),
                "output rate %s Hz differs from the reference's %s Hz", output.sampleRateHz(),
                reference.sampleRateHz());
        return measure(label, output.unsafeSamples());
    }

    /**
     * Measures codes played through a level table (the volts the board would put out).
     *
     * @throws IllegalArgumentException when the bit depths, rates or lengths do not match
     */
    public QualityReport measure(String label, Codes codes, LevelTable table) {
        return measureWithSpectrum(label, codes, table).report();
    }

    /**
     * Measures codes played through a level table and keeps the error spectrum, without building an array
     * of the output's volts: the error is computed from the codes as it is needed (long clips).
     *
     * @throws IllegalArgumentException when the bit depths, rates or lengths do not match
     */
    public Measured measureWithSpectrum(String label, Codes codes, LevelTable table) {
        Checks.checkArgument(codes.bits() == table.bits(), "codes have %d bits, the table %d", codes.bits(),
                table.bits());
        Checks.checkArgument(codes.sampleRateHz() == reference.sampleRateHz(),
                "codes rate %s Hz differs from the reference's %s Hz", codes.sampleRateHz(),
                reference.sampleRateHz());
        int[] c = codes.unsafeCodes();
        double[] level = table.levels();
        return measured(label, c.length, (from, dst, count) -> {
            for (int i = 0; i < count; i++) {
                dst[i] = level[c[from + i]];
            }
        });
    }

    /** The volts of every code through the table. */
    public static double[] volts(Codes codes, LevelTable table) {
        int[] c = codes.unsafeCodes();
        double[] v = new double[c.length];
        for (int i = 0; i < c.length; i++) {
            v[i] = table.volts(c[i]);
        }
        return v;
    }

    /**
     * Measures output samples at the reference's rate.
     *
     * @throws IllegalArgumentException when the length differs from the reference's
     */
    public QualityReport measure(String label, double[] output) {
        return measureWithSpectrum(label, output).report();
    }

    /**
     * The figures and the error's Welch spectrum of one output, computed once.
     *
     * @param report the quality figures
     * @param errorSpectrum the aligned error's spectrum (null when the error is zero)
     */
    public record Measured(QualityReport report, Spectrum errorSpectrum) {
    }

    /**
     * Measures output samples and keeps the error spectrum for plots (no second alignment or transform).
     *
     * @throws IllegalArgumentException when the length differs from the reference's
     */
    public Measured measureWithSpectrum(String label, double[] output) {
        return measured(label, output.length, (from, dst, count) -> System.arraycopy(output, from, dst, 0, count));
    }

    /** The figures of an output read by range (see the class comment for the alignment). */
    private Measured measured(String label, int length, Spectrum.Samples output) {
        double[] r = reference.unsafeSamples();
        Checks.checkArgument(length == r.length, "output has %d samples, the reference %d", length, r.length);
        Alignment a = align(output);
        Spectrum.Samples e = a.error(output, r);
        double pr = referenceSumSquares / length;
        double pe = blockSum(length, (from, buf, count) -> {
            e.read(from, buf, count);
            double sum = 0;
            for (int i = 0; i < count; i++) {
                sum += buf[i] * buf[i];
            }
            return new double[] {sum};
        })[0] / length;
        Spectrum s = null;
        double inBandError;
        double weightedError;
        if (pe > 0 && Double.isFinite(pe)) {
            s = Spectrum.welch(e, length, reference.sampleRateHz(), Window.HANN, segment(length));
            double total = s.totalPower();
            inBandError = pe * s.bandPower(0, inBandCutoffHz) / total;
            weightedError = pe * s.weightedPower(AWeighting::powerGain) / total;
        } else {
            inBandError = pe;
            weightedError = pe;
        }
        double errorDbfs = db(pe / 0.5);
        return new Measured(new QualityReport(label, reference.sampleRateHz(), length, inBandCutoffHz,
                db(pr / 0.5), db(pr / pe), db(pr * referenceInBandFraction / inBandError), db(pr / weightedError),
                (-errorDbfs - 1.76) / 6.02, errorDbfs, a.gain(), a.offset(), Optional.empty(),
                Optional.empty()), s);
    }

    /** Partial sums of one block. */
    @FunctionalInterface
    private interface BlockSums {
        double[] of(int from, double[] buf, int count);
    }

    /** Sums over fixed blocks of {@code length} samples, in parallel, added in block order (core-independent). */
    private static double[] blockSum(int length, BlockSums sums) {
        int blocks = (length + BLOCK - 1) / BLOCK;
        double[][] partial = new double[blocks][];
        java.util.stream.IntStream.range(0, blocks).parallel().forEach(b -> {
            int from = b * BLOCK;
            int count = Math.min(BLOCK, length - from);
            partial[b] = sums.of(from, new double[count], count);
        });
        double[] total = new double[partial.length == 0 ? 0 : partial[0].length];
        for (double[] p : partial) {
            for (int k = 0; k < total.length; k++) {
                total[k] += p[k];
            }
        }
        return total;
    }

    /**
     * The aligned error of an output, in reference units (see the class comment).
     *
     * @throws IllegalArgumentException when the length differs from the reference's
     */
    public double[] alignedError(double[] output) {
        double[] r = reference.unsafeSamples();
        Checks.checkArgument(output.length == r.length, "output has %d samples, the reference %d",
                output.length, r.length);
        Spectrum.Samples o = (from, dst, count) -> System.arraycopy(output, from, dst, 0, count);
        double[] out = new double[r.length];
        double[] buf = new double[BLOCK];
        Spectrum.Samples e = align(o).error(o, r);
        for (int from = 0; from < out.length; from += BLOCK) {
            int count = Math.min(BLOCK, out.length - from);
            e.read(from, buf, count);
            System.arraycopy(buf, 0, out, from, count);
        }
        return out;
    }

    /** Welch spectrum of the aligned error (Hann, 8192-sample segments), for plots. */
    public Spectrum errorSpectrum(double[] output) {
        return spectrum(alignedError(output), reference.sampleRateHz());
    }

    /** Gain and offset in one pass: Σo and Σ(r − r̄)·o; then Σ(r − r̄)(o − ō) = Σ(r − r̄)·o − ō·Σ(r − r̄). */
    private Alignment align(Spectrum.Samples o) {
        double[] r = reference.unsafeSamples();
        int n = r.length;
        double rm = referenceMean;
        double[] sums = blockSum(n, (from, buf, count) -> {
            o.read(from, buf, count);
            double so = 0;
            double sro = 0;
            double sr = 0;
            for (int i = 0; i < count; i++) {
                double d = r[from + i] - rm;
                so += buf[i];
                sro += d * buf[i];
                sr += d;
            }
            return new double[] {so, sro, sr};
        });
        double mo = sums[0] / n;
        double gain = (sums[1] - mo * sums[2]) / referenceSumSquares;
        return new Alignment(gain, mo - gain * referenceMean);
    }

    private static Spectrum spectrum(double[] x, double rate) {
        return Spectrum.welch(x, rate, Window.HANN, segment(x.length));
    }

    private static int segment(int length) {
        return Math.min(SEGMENT_LENGTH, Spectrum.nextPowerOfTwo(Math.max(16, length)));
    }

    private static double db(double ratio) {
        return 10 * Math.log10(ratio);
    }

    private record Alignment(double gain, double offset) {
        /** The error {@code (o − offset)/gain − r} by range; unbounded when the output carries none of r. */
        Spectrum.Samples error(Spectrum.Samples o, double[] r) {
            if (!(gain > 0)) {
                return (from, dst, count) -> java.util.Arrays.fill(dst, 0, count, Double.POSITIVE_INFINITY);
            }
            double inv = 1 / gain;
            double c = offset;
            return (from, dst, count) -> {
                o.read(from, dst, count);
                for (int i = 0; i < count; i++) {
                    dst[i] = (dst[i] - c) * inv - r[from + i];
                }
            };
        }
    }
}
