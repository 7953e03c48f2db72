package org.rungtone.analysis;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.function.DoubleFunction;
import org.rungtone.codec.TreadEncoder;
import org.rungtone.codec.TreadFormat;
import org.rungtone.codec.Weighting;
import org.rungtone.internal.Checks;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.Signal;

/**
 * The bit-depth × sample-rate survey: a pure function from a {@link SurveySpec} and the conditioned
 * reference at each rate to a {@link SurveyResult}.
 *
 * <p>Each cell quantizes the reference at its rate onto the spec's table for its depth (dither, shaping and
 * seed from the spec) and measures the codes through the same table with {@link AudioMetrics} (the
 * quantization-only figures). Given the source as supplied ({@link ListenerMetrics}), each cell's codes are
 * also rendered through the analog model and measured against it (the listener figures of
 * {@link SurveyRow}), which shows what each rate loses; a target is then checked against those (the listener
 * SNR in the 20 kHz band as the SINAD, and ENOB re full scale from it), so a rate that loses audible treble
 * does not reach a target its at-rate figures would. Flash bytes
 * are {@code n·(N ≤ 8 ? 1 : 2)} unpacked and {@code ceil(n·N/8)} bit-packed for n samples. Each Tread store
 * the spec names adds a row to every cell whose depth it decodes to: the reference encoded through the same
 * quantizer ({@link TreadEncoder}) and measured as the decoder puts it out, its bytes the stream, the
 * decoder's tables and one reset point. The chosen row fits the budget, reaches the target and needs the
 * fewest flash bytes (packed or unpacked, as the spec says, for the plain codes); ties go to fewer bits
 * (fewer pins and resistors), then to the lower rate (less CPU), then to the plain codes (no decoding).
 * Without a target nothing is chosen.
 *
 * <p>Cells run in parallel on the spec's number of threads; the result does not depend on the scheduling
 * (every cell has the same seed and its own random stream).
 */
public final class Survey {
    private Survey() {
    }

    /** Progress of a survey, for a progress bar. */
    @FunctionalInterface
    public interface Progress {
        /** No progress reports. */
        Progress NONE = (done, total) -> { };

        /**
         * Called after each finished cell, from worker threads but never concurrently.
         *
         * @param done cells finished so far
         * @param total cells in the survey
         */
        void update(int done, int total);
    }

    /**
     * Runs the survey without progress reports.
     *
     * @see #run(SurveySpec, DoubleFunction, Progress)
     */
    public static SurveyResult run(SurveySpec spec, DoubleFunction<Signal> referenceAtRate) {
        return run(spec, referenceAtRate, Progress.NONE);
    }

    /**
     * Runs the survey.
     *
     * @param spec what to survey
     * @param referenceAtRate the conditioned reference at a rate (called once per rate, possibly from
     *     worker threads at the same time)
     * @param progress told after each cell
     * @throws IllegalArgumentException when a reference comes back at another rate or a table has another
     *     bit depth than asked for
     * @throws org.rungtone.internal.InputError when a reference is constant
     */
    public static SurveyResult run(SurveySpec spec, DoubleFunction<Signal> referenceAtRate, Progress progress) {
        return run(spec, referenceAtRate, null, progress);
    }

    /**
     * Runs the survey with listener figures for every cell.
     *
     * @param spec what to survey
     * @param referenceAtRate the conditioned reference at a rate (called once per rate, possibly from
     *     worker threads at the same time)
     * @param listener the source as supplied, prepared for the listener figures; null for none (the rows'
     *     listener figures are then NaN)
     * @param progress told after each cell
     * @throws IllegalArgumentException when a reference comes back at another rate or a table has another
     *     bit depth than asked for
     * @throws org.rungtone.internal.InputError when a reference is constant
     */
    public static SurveyResult run(SurveySpec spec, DoubleFunction<Signal> referenceAtRate,
            ListenerMetrics listener, Progress progress) {
        List<Integer> bitDepths = spec.bitDepths();
        List<Double> rates = spec.ratesHz();
        List<LevelTable> tables = new ArrayList<>();
        for (int bits : bitDepths) {
            LevelTable t = spec.tables().apply(bits);
            Checks.checkArgument(t.bits() == bits, "the table for %d bits has %d bits", bits, t.bits());
            tables.add(t);
        }
        int total = cellCount(spec);
        ExecutorService pool = Executors.newFixedThreadPool(Math.min(spec.threads(), total), runnable -> {
            Thread t = new Thread(runnable, "rungtone-survey");
            t.setDaemon(true);
            return t;
        });
        try {
            List<Callable<AudioMetrics>> rateTasks = new ArrayList<>();
            for (double rate : rates) {
                rateTasks.add(() -> {
                    Signal ref = referenceAtRate.apply(rate);
                    Checks.checkArgument(ref.sampleRateHz() == rate, "reference for %s Hz came at %s Hz", rate,
                            ref.sampleRateHz());
                    return AudioMetrics.of(ref, spec.inBandCutoffHz().applyAsDouble(rate));
                });
            }
            List<AudioMetrics> metrics = getAll(pool.invokeAll(rateTasks));
            Counter counter = new Counter(progress, total);
            List<Callable<SurveyRow>> cellTasks = new ArrayList<>();
            for (int r = 0; r < rates.size(); r++) {
                for (int b = 0; b < bitDepths.size(); b++) {
                    AudioMetrics m = metrics.get(r);
                    LevelTable table = tables.get(b);
                    List<Optional<TreadFormat>> stores = new ArrayList<>(List.of(Optional.empty()));
                    spec.codecs().stream().filter(f -> decodes(f, table.bits())).map(Optional::of)
                            .forEach(stores::add);
                    for (Optional<TreadFormat> codec : stores) {
                        cellTasks.add(() -> {
                            SurveyRow row = cell(spec, m, table, listener, codec);
                            counter.done();
                            return row;
                        });
                    }
                }
            }
            List<SurveyRow> rows = getAll(pool.invokeAll(cellTasks));
            return new SurveyResult(choose(rows, spec), spec.target().orElse(null),
                    spec.flashBudgetBytes().isPresent() ? spec.flashBudgetBytes().getAsLong() : null,
                    spec.packed());
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("survey interrupted", e);
        } finally {
            pool.shutdownNow();
        }
    }

    /**
     * Quantizes one cell exactly as the survey measures it: {@code reference} onto the table's full span
     * with the spec's dither, shaping and seed. For previews of a cell.
     */
    public static Quantizer.Quantized quantize(SurveySpec spec, Signal reference, LevelTable table) {
        return new Quantizer(table, table.minVolts(), table.maxVolts(), spec.dither(), spec.shaping(),
                spec.seed()).apply(reference);
    }

    /**
     * The codes of one row exactly as the survey measures it: {@link #quantize}, or for a Tread store what its
     * decoder makes of the reference encoded through that quantizer. For previews of a row.
     */
    public static Quantizer.Quantized codes(SurveySpec spec, Signal reference, LevelTable table,
            Optional<TreadFormat> codec) {
        if (codec.isEmpty()) {
            return quantize(spec, reference, table);
        }
        Quantizer q = new Quantizer(table, table.minVolts(), table.maxVolts(), spec.dither(), spec.shaping(),
                spec.seed());
        double rate = reference.sampleRateHz();
        Weighting w = Weighting.aWeighted(rate, spec.inBandCutoffHz().applyAsDouble(rate));
        return new TreadEncoder(codec.get(), q, w).encode(reference).quantized();
    }

    /** The rows a survey of {@code spec} makes: one per cell, and one per Tread store that fits its depth. */
    public static int cellCount(SurveySpec spec) {
        int total = 0;
        for (int bits : spec.bitDepths()) {
            total += spec.ratesHz().size() * (1 + (int) spec.codecs().stream().filter(f -> decodes(f, bits)).count());
        }
        return total;
    }

    /** True when {@code codec} decodes to {@code bits}-bit codes. */
    private static boolean decodes(TreadFormat codec, int bits) {
        return bits >= codec.minLadderBits() && bits <= TreadFormat.MAX_LADDER_BITS;
    }

    private static SurveyRow cell(SurveySpec spec, AudioMetrics metrics, LevelTable table,
            ListenerMetrics listener, Optional<TreadFormat> codec) {
        Signal ref = metrics.reference();
        Quantizer.Quantized quantized = codes(spec, ref, table, codec);
        QualityReport r = metrics.measure("survey", quantized.codes(), table);
        int n = ref.length();
        int bits = table.bits();
        long unpacked = codec.map(f -> SurveyRow.treadBytes(f, n, bits)).orElse(SurveyRow.unpackedBytes(n, bits));
        long packed = codec.map(f -> SurveyRow.treadBytes(f, n, bits)).orElse(SurveyRow.packedBytes(n, bits));
        long counted = spec.packed() ? packed : unpacked;
        boolean fits = spec.flashBudgetBytes().isEmpty() || counted <= spec.flashBudgetBytes().getAsLong();
        double listenerSnr = Double.NaN;
        double listenerWeighted = Double.NaN;
        if (listener != null && listener.measurable((int) Math.floor(n * listener.model().previewRateHz()
                / ref.sampleRateHz()))) {
            ListenerReport heard = listener.measure(quantized.codes(), table);
            listenerSnr = heard.snrDb();
            listenerWeighted = heard.aWeightedSnrDb();
        }
        final double heardSnr = listenerSnr;
        boolean reaches = spec.target().map(t -> Double.isNaN(heardSnr) ? t.isMet(r.sinadDb(),
                r.enobFullScaleBits()) : t.isMet(heardSnr, enobFullScale(heardSnr, r))).orElse(false);
        return new SurveyRow(bits, ref.sampleRateHz(), n, r.sinadDb(), r.inBandSnrDb(), r.aWeightedSnrDb(),
                r.enobFullScaleBits(), quantized.clippedSamples(), unpacked, packed, fits, reaches, false,
                listenerSnr, listenerWeighted, codec);
    }

    /**
     * ENOB re full scale of what the listener gets: its error power against a full-scale sine,
     * {@code (snr − referenceRmsDbfs − 1.76)/6.02} (IEEE Std 1241-2010 ENOB from the error power), with the
     * programme's level taken from the at-rate reference.
     */
    static double enobFullScale(double listenerSnrDb, QualityReport atRate) {
        return (listenerSnrDb - atRate.referenceRmsDbfs() - 1.76) / 6.02;
    }

    private static List<SurveyRow> choose(List<SurveyRow> rows, SurveySpec spec) {
        Comparator<SurveyRow> order = Comparator
                .comparingLong((SurveyRow r) -> spec.packed() ? r.flashBytesPacked() : r.flashBytesUnpacked())
                .thenComparingInt(SurveyRow::bits)
                .thenComparingDouble(SurveyRow::rateHz)
                .thenComparing(r -> r.codec().isPresent());
        Optional<SurveyRow> best = rows.stream().filter(r -> r.fits() && r.reachesTarget()).min(order);
        List<SurveyRow> out = new ArrayList<>(rows.size());
        for (SurveyRow r : rows) {
            out.add(best.isPresent() && r == best.get() ? r.withChosen(true) : r);
        }
        return out;
    }

    private static <T> List<T> getAll(List<Future<T>> futures) throws InterruptedException {
        List<T> out = new ArrayList<>(futures.size());
        for (Future<T> f : futures) {
            try {
                out.add(f.get());
            } catch (ExecutionException e) {
                Throwable cause = e.getCause();
                if (cause instanceof RuntimeException re) {
                    throw re;
                }
                if (cause instanceof Error err) {
                    throw err;
                }
                throw new IllegalStateException("survey cell failed", cause);
            }
        }
        return out;
    }

    /** Counts finished cells and reports them one at a time. */
    private static final class Counter {
        private final Progress progress;
        private final int total;
        private int done;

        Counter(Progress progress, int total) {
            this.progress = progress;
            this.total = total;
        }

        synchronized void done() {
            done++;
            progress.update(done, total);
        }
    }
}
