package org.rungtone.ladder;

import java.util.SplittableRandom;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ForkJoinPool;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.function.IntConsumer;
import java.util.stream.IntStream;
import org.rungtone.internal.Checks;

/**
 * Tolerance analysis: K boards of one ladder whose resistor values are drawn around the nominal ones
 * ({@link Spread}), each solved exactly ({@link LevelSolver}) and measured: worst DNL and INL per IEEE Std
 * 1658-2011, monotonicity, and SINAD/ENOB of a full-scale coherent sine ({@link SineProbe}).
 *
 * <p>Reproducible: the seed makes a root {@link SplittableRandom}; boards are grouped in fixed chunks of
 * {@value #CHUNK}, each chunk gets {@code root.split()} in chunk order and each board a further
 * {@code split()} of its chunk's generator in board order. Chunks run in parallel on the fork-join pool, so
 * results do not depend on the number of threads. Pin resistances, logic levels, load and buffer stay
 * nominal.
 */
public final class MonteCarlo {
    static final int CHUNK = 64;

    private final int boards;
    private final long seed;
    private final Spread spread;

    /**
     * A run of {@code boards} boards.
     *
     * @throws IllegalArgumentException when boards is not positive
     */
    public MonteCarlo(int boards, long seed, Spread spread) {
        Checks.checkArgument(boards > 0, "need at least one board: %d", boards);
        this.boards = boards;
        this.seed = seed;
        this.spread = spread;
    }

    /** The number of boards simulated. */
    public int boards() {
        return boards;
    }

    /** Simulates boards of the nominal network of {@code spec}. */
    public MonteCarloResult run(LadderSpec spec) {
        return run(Ladder.nominal(spec), n -> { });
    }

    /**
     * Simulates boards whose nominal values are those of {@code ladder}, with its spec's tolerance.
     *
     * @param progress told the number of boards finished so far, from worker threads
     */
    public MonteCarloResult run(Ladder ladder, IntConsumer progress) {
        return run(ladder, ForkJoinPool.commonPool(), progress);
    }

    MonteCarloResult run(Ladder ladder, ForkJoinPool pool, IntConsumer progress) {
        LadderSpec spec = ladder.spec();
        double[] nominal = ladder.ohms();
        int bits = spec.bits();
        SineProbe probe = new SineProbe(bits);
        double[] worstDnl = new double[boards];
        double[] worstInl = new double[boards];
        double[] worstInlBestFit = new double[boards];
        double[] sinad = new double[boards];
        boolean[] monotonic = new boolean[boards];
        int chunks = (boards + CHUNK - 1) / CHUNK;
        SplittableRandom root = new SplittableRandom(seed);
        SplittableRandom[] chunkRandom = new SplittableRandom[chunks];
        for (int c = 0; c < chunks; c++) {
            chunkRandom[c] = root.split();
        }
        AtomicInteger done = new AtomicInteger();
        Runnable all = () -> IntStream.range(0, chunks).parallel().forEach(c -> {
            double[] ohms = new double[nominal.length];
            double[] levels = new double[1 << bits];
            LevelSolver.Scratch scratch = new LevelSolver.Scratch(bits);
            Linearity.Worst worst = new Linearity.Worst();
            int end = Math.min(boards, (c + 1) * CHUNK);
            for (int b = c * CHUNK; b < end; b++) {
                SplittableRandom random = chunkRandom[c].split();
                for (int i = 0; i < ohms.length; i++) {
                    double d = spread.deviation(random, spec.tolerance());
                    ohms[i] = nominal[i] * Math.max(1e-6, 1 + d);
                }
                LevelSolver.outputVolts(spec, ohms, levels, scratch);
                worst.of(levels);
                worstDnl[b] = worst.maxAbsDnl;
                worstInl[b] = worst.maxAbsInl;
                worstInlBestFit[b] = worst.maxAbsInlBestFit;
                monotonic[b] = worst.monotonic;
                sinad[b] = probe.sinadDb(levels);
            }
            progress.accept(done.addAndGet(end - c * CHUNK));
        });
        try {
            pool.submit(all).get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("Monte Carlo run interrupted", e);
        } catch (ExecutionException e) {
            Throwable cause = e.getCause();
            throw cause instanceof RuntimeException ? (RuntimeException) cause
                    : new IllegalStateException("Monte Carlo run failed", cause);
        }
        double nominalSinad = probe.sinadDb(ladder.levels().levels());
        return new MonteCarloResult(bits, seed, spread, spec.tolerance(),
                new MonteCarloResult.PerBoard(worstDnl, worstInl, worstInlBestFit, sinad, monotonic), nominalSinad);
    }
}
