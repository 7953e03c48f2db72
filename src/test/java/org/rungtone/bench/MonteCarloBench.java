package org.rungtone.bench;

import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.MonteCarlo;
import org.rungtone.ladder.MonteCarloResult;
import org.rungtone.ladder.Spread;
import org.rungtone.ladder.Topology;

/**
 * Monte Carlo throughput for 10-bit ladders on all cores, reported in boards per second (one JMH operation
 * is one board). Pins have different high and low resistances, so the R-2R case takes the exact prefix-tree
 * path rather than plain superposition. Target: at least 50,000 boards/s on a 2-core machine.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
public class MonteCarloBench {
    private static final int BOARDS = 8192;

    @Param({"r2r", "weighted"})
    public String topology;

    private LadderSpec spec;
    private MonteCarlo monteCarlo;

    /** Builds the ladder once. */
    @Setup
    public void setUp() {
        spec = LadderSpec.builder().topology(Topology.parse(topology)).bits(10).tolerance(0.01)
                .pinROhmsHigh(25).pinROhmsLow(20).loadOhms(100e3).build();
        monteCarlo = new MonteCarlo(BOARDS, 12345, Spread.uniform());
    }

    /** One run of 8192 boards. */
    @Benchmark
    @OperationsPerInvocation(BOARDS)
    public MonteCarloResult boards() {
        return monteCarlo.run(spec);
    }
}
