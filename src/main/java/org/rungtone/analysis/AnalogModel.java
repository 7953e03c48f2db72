package org.rungtone.analysis;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.QRDecomposition;
import org.rungtone.internal.Checks;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.source.Signal;

/**
 * What the board puts out, as a listenable preview: codes → the ladder's {@link LevelTable} (volts) →
 * zero-order hold at the code rate fs → {@link ReconstructionFilter} → band-limited resampling to the
 * preview rate (44.1 or 48 kHz).
 *
 * <p>Normalisation (the same for every setting, so that A/B listening is fair): volts map linearly so that
 * the table's full span, lowest level → −1 and highest → +1, is full scale; the preview is not re-levelled
 * afterwards. A full-scale signal therefore plays equally loud at every bit depth, rate and filter, and
 * only the differences in noise, distortion and filtering remain. Filter ringing and the Gibbs overshoot
 * of the band-limited staircase can exceed ±1 by a few per cent; {@link Preview#peak()} reports it.
 *
 * <p>Method: each code is held for L samples of a fine grid at L·fs, with L ≥ 8 and L·fs above twice the
 * preview's stopband edge. The filter runs on that grid in its step-invariant form
 * ({@link StepInvariantFilter}), exact for a held input. A Kaiser-windowed sinc resampler
 * ({@link SincResampler}: flat to min(20 kHz, 0.4535·rate), at least 100 dB down from rate − that edge, so
 * aliases land only above the passband) brings the result to the preview rate. Sampling the held staircase
 * on the grid turns its {@code sinc(f/fs)} into {@code sin(πf/fs)/(L·sin(πf/(L·fs)))}; without a filter a
 * three-tap correction (1/24, 11/12, 1/24), which approximates {@code sin x/x} with x = πf/(L·fs), restores
 * the analog response to within 0.002 dB up to fs/2. With a filter the grid samples are exact samples of
 * the analog output, whose images beyond the grid's Nyquist frequency still fold back; an 11-tap correction
 * fitted to that folding (see {@code aliasCorrection}) keeps the response within 0.01 dB of the analog one up
 * to fs/2 for filter cutoffs below the grid rate.
 *
 * <p>The zero-order hold's own response is {@code |H(f)| = |sinc(f/fs)|}, −3.92 dB at fs/2 (A. V.
 * Oppenheim, R. W. Schafer, Discrete-Time Signal Processing); {@link #zohDroopDb} reports it at the top of
 * the passband, which is fs/2 without a filter and min(cutoff, fs/2) with one.
 */
public final class AnalogModel {
    /** Stopband attenuation of the preview resampler in dB. */
    public static final double RESAMPLER_ATTENUATION_DB = 100;

    /** Top of the audio band: in-band figures and the preview stop here. */
    public static final double AUDIO_BAND_TOP_HZ = 20000;
    private static final double[] HOLD_CORRECTION = {1.0 / 24, 11.0 / 12, 1.0 / 24};
    private static final int CORRECTION_TERMS = 6;
    /** Output samples per parallel chunk of the preview. */
    private static final int CHUNK = 1 << 17;
    /** The largest hold factor (fine samples per code) whose summed kernel table is worth building. */
    private static final int MAX_HELD_FACTOR = 64;
    /** Fine-grid samples each chunk's filter runs before its first needed input (several thousand time constants). */
    private static final int WARMUP = 1 << 16;

    private final ReconstructionFilter filter;
    private final double previewRateHz;

    /**
     * A model with the given filter and preview rate.
     *
     * @throws IllegalArgumentException when the preview rate is outside 8 kHz .. 192 kHz
     */
    public AnalogModel(ReconstructionFilter filter, double previewRateHz) {
        Checks.checkArgument(previewRateHz >= 8000 && previewRateHz <= 192000,
                "preview rate must be 8 kHz .. 192 kHz: %s", previewRateHz);
        this.filter = filter;
        this.previewRateHz = previewRateHz;
    }

    /** The reconstruction filter. */
    public ReconstructionFilter filter() {
        return filter;
    }

    /** The preview's sample rate in hertz. */
    public double previewRateHz() {
        return previewRateHz;
    }

    /**
     * The rendered preview and the figures that go with it.
     *
     * @param signal the preview at {@link #previewRateHz()}, full span of the table = full scale
     * @param codeRateHz the rate the codes play at
     * @param passbandTopHz fs/2 without a filter, min(cutoff, fs/2) with one
     * @param zohDroopDb the hold's droop at {@code passbandTopHz}, 20·log10|sinc(f/fs)|
     * @param peak largest |sample| of the preview (above 1 means overshoot)
     */
    public record Preview(Signal signal, double codeRateHz, double passbandTopHz, double zohDroopDb,
            double peak) {
    }

    /** The zero-order hold's response in dB at {@code hz} for code rate {@code codeRateHz}. */
    public static double zohResponseDb(double hz, double codeRateHz) {
        double x = Math.PI * hz / codeRateHz;
        return x == 0 ? 0 : 20 * Math.log10(Math.abs(Math.sin(x) / x));
    }

    /** Top of the passband at code rate fs: fs/2, or the filter's cutoff when lower. */
    public double passbandTopHz(double codeRateHz) {
        double nyquist = codeRateHz / 2;
        return filter.kind() == ReconstructionFilter.Kind.NONE ? nyquist : Math.min(filter.cutoffHz(), nyquist);
    }

    /**
     * Top of the in-band figures at code rate fs, the one definition the build and the survey share: the top
     * of the passband ({@link #passbandTopHz}), but never above the audio band's {@value #AUDIO_BAND_TOP_HZ}
     * Hz, since nobody hears above it.
     */
    public double inBandTopHz(double codeRateHz) {
        return Math.min(AUDIO_BAND_TOP_HZ, passbandTopHz(codeRateHz));
    }

    /** The hold's droop at the top of the passband, in dB (negative). */
    public double zohDroopDb(double codeRateHz) {
        return zohResponseDb(passbandTopHz(codeRateHz), codeRateHz);
    }

    /** The analog response, hold times filter, in dB at {@code hz}. */
    public double responseDb(double hz, double codeRateHz) {
        return zohResponseDb(hz, codeRateHz) + filter.responseDb(hz);
    }

    /**
     * Renders codes played through {@code table} into a preview.
     *
     * @throws IllegalArgumentException when the bit depths differ or the table's levels are all equal
     */
    public Preview render(Codes codes, LevelTable table) {
        Checks.checkArgument(codes.bits() == table.bits(), "codes have %d bits, the table %d", codes.bits(),
                table.bits());
        double low = table.minVolts();
        double high = table.maxVolts();
        Checks.checkArgument(high > low, "the level table spans no voltage: %s .. %s V", low, high);
        double fs = codes.sampleRateHz();
        double pass = Math.min(AUDIO_BAND_TOP_HZ, 0.4535 * previewRateHz);
        double stop = previewRateHz - pass;
        int factor = Math.max(8, (int) Math.floor(2 * stop / fs) + 1);
        double fine = factor * fs;
        boolean raw = filter.kind() == ReconstructionFilter.Kind.NONE;
        SincResampler resampler = new SincResampler(fine, previewRateHz, pass, stop, RESAMPLER_ATTENUATION_DB,
                raw ? HOLD_CORRECTION : aliasCorrection(fs, factor, pass));
        double[] normalised = new double[table.size()];
        for (int k = 0; k < normalised.length; k++) {
            normalised[k] = (table.volts(k) - 0.5 * (low + high)) / (0.5 * (high - low));
        }
        int outLength = (int) Math.floor(codes.length() * previewRateHz / fs);
        // A held fine sample stands for the average over its step, centred half a step late.
        double offset = raw ? -0.5 : 0;
        double[] out = new double[outLength];
        double ratio = fine / previewRateHz;
        int[] c = codes.unsafeCodes();
        int chunks = (outLength + CHUNK - 1) / CHUNK;
        // Fixed-size chunks in parallel. Each chunk after the first starts its own filter WARMUP fine samples
        // early, so the filter state it reaches equals the sequential one to far below double precision; the
        // result does not depend on the number of cores.
        if (raw && factor <= MAX_HELD_FACTOR) {
            // No filter: the grid signal is the held staircase itself, so the kernel is summed over each
            // hold once and every output reads codes instead of fine samples (factor times less work). Its
            // table grows with the factor squared: very low rates (a factor past MAX_HELD_FACTOR) take the
            // general path below with no filter, which gives the same result to rounding.
            SincResampler.Held held = resampler.new Held(factor);
            java.util.stream.IntStream.range(0, chunks).parallel().forEach(k -> resampler.resampleHeld(held, c,
                    normalised, k * CHUNK, Math.min(outLength, (k + 1) * CHUNK), offset, out));
            return preview(out, fs);
        }
        java.util.stream.IntStream.range(0, chunks).parallel().forEach(k -> {
            int from = k * CHUNK;
            int to = Math.min(outLength, from + CHUNK);
            long start = k == 0 ? -resampler.half() - 1
                    : (long) Math.floor(from * ratio + offset) - resampler.half() + 1 - WARMUP;
            HeldSource source = new HeldSource(c, normalised, factor, new StepInvariantFilter(filter, 1 / fine),
                    start);
            resampler.resampleInto(source, start, from, to, offset, out);
        });
        return preview(out, fs);
    }

    private Preview preview(double[] out, double fs) {
        Signal signal = Signal.wrap(out, previewRateHz);
        return new Preview(signal, fs, passbandTopHz(fs), zohDroopDb(fs), signal.peak());
    }

    /**
     * Symmetric taps at the fine rate that undo, up to {@code passHz}, the gain error of sampling the
     * filtered staircase on the grid. By Poisson summation the grid sees at f the sum over m of the analog
     * response at {@code f + m·L·fs}, so with x = f/fs the grid's response relative to the analog one is
     * {@code R(f) = Σ_m x/(x + L·m) · H(f + m·L·fs)/H(f)}; the taps fit {@code 1/|R|} by least squares (QR)
     * over 128 frequencies with a cosine series {@code c0 + 2·Σ_(k=1..5) c_k·cos(kω)}.
     */
    private double[] aliasCorrection(double fs, int factor, double passHz) {
        double fine = factor * fs;
        int points = 128;
        int terms = CORRECTION_TERMS;
        double[][] design = new double[points][terms];
        double[] target = new double[points];
        for (int p = 0; p < points; p++) {
            double f = passHz * (p + 0.5) / points;
            double x = f / fs;
            double[] h0 = response(f);
            double h0Power = h0[0] * h0[0] + h0[1] * h0[1];
            double re = 0;
            double im = 0;
            for (int m = -2000; m <= 2000; m++) {
                double[] h = response(f + m * fine);
                double w = x / (x + (double) factor * m);
                re += w * (h[0] * h0[0] + h[1] * h0[1]) / h0Power;
                im += w * (h[1] * h0[0] - h[0] * h0[1]) / h0Power;
            }
            target[p] = 1 / Math.hypot(re, im);
            double omega = 2 * Math.PI * f / fine;
            design[p][0] = 1;
            for (int k = 1; k < terms; k++) {
                design[p][k] = 2 * Math.cos(k * omega);
            }
        }
        double[] c = new QRDecomposition(new Array2DRowRealMatrix(design, false)).getSolver()
                .solve(new ArrayRealVector(target, false)).toArray();
        double[] taps = new double[2 * terms - 1];
        for (int k = 0; k < terms; k++) {
            taps[terms - 1 - k] = c[k];
            taps[terms - 1 + k] = c[k];
        }
        return taps;
    }

    /** The filter's complex response {re, im} at {@code hz} (any sign). */
    private double[] response(double hz) {
        double re;
        double im;
        switch (filter.kind()) {
            case FIRST_ORDER:
                re = 1;
                im = hz / filter.cutoffHz();
                break;
            case SECOND_ORDER:
                double u = hz / filter.cutoffHz();
                re = 1 - u * u;
                im = u / filter.q();
                break;
            default:
                return new double[] {1, 0};
        }
        double d = re * re + im * im;
        return new double[] {re / d, -im / d};
    }

    /** The held, filtered signal on the fine grid, produced block by block. */
    private static final class HeldSource implements SincResampler.Source {
        private final int[] codes;
        private final double[] level;
        private final int factor;
        private final StepInvariantFilter filter;
        private long next;
        private double[] held = new double[0];

        HeldSource(int[] codes, double[] level, int factor, StepInvariantFilter filter, long start) {
            this.codes = codes;
            this.level = level;
            this.factor = factor;
            this.filter = filter;
            this.next = start;
        }

        @Override
        public void fill(double[] dst, int offset, int count) {
            if (held.length < count) {
                held = new double[count];
            }
            // step through the codes instead of dividing for every fine sample
            long code = Math.floorDiv(next, factor);
            int left = (int) (factor - Math.floorMod(next, (long) factor));
            for (int k = 0; k < count; k++) {
                held[k] = code >= 0 && code < codes.length ? level[codes[(int) code]] : 0;
                if (--left == 0) {
                    code++;
                    left = factor;
                }
            }
            next += count;
            filter.process(held, dst, offset, count);
        }
    }
}
