package org.rungtone.bench;

import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.rungtone.script.RungScript;
import org.rungtone.source.Signal;

/**
 * Rendering speed of compiled scripts, in samples per microsecond (×1e6 = samples per second), on one thread.
 * Each invocation renders one second at 48 kHz, compile included. Target: at least 50 M samples/s for five
 * oscillator terms under an envelope. Run with {@code ./bench jmh ScriptBench}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Fork(1)
public class ScriptBench {
    private static final int SAMPLES = 48_000;

    /** Five oscillator terms of different waveforms, all under one ADSR envelope. */
    static final String FIVE_OSCILLATORS = String.join("\n",
            "duration 1s",
            "rate 48kHz",
            "let env = adsr(5ms, 60ms, 0.7, 200ms)",
            "out env * (0.30 * sine(220Hz) + 0.20 * triangle(330Hz) + 0.20 * square(440Hz, 30%)",
            "           + 0.15 * sawup(550Hz) + 0.10 * sine(660Hz))");

    /** The same with every frequency moving (vibrato and a sweep), so every oscillator integrates. */
    static final String FIVE_MODULATED = String.join("\n",
            "duration 1s",
            "rate 48kHz",
            "let env = adsr(5ms, 60ms, 0.7, 200ms)",
            "let wob = 1 + 0.01 * sine(5Hz)",
            "out env * (0.30 * sine(220Hz * wob) + 0.20 * triangle(330Hz * wob)",
            "           + 0.20 * square(440Hz * wob, 30%) + 0.15 * sawup(linsweep(550Hz, 600Hz, 1s))",
            "           + 0.10 * sine(660Hz * wob))");

    private RungScript steady;
    private RungScript modulated;

    @Setup
    public void setUp() {
        steady = RungScript.parse(FIVE_OSCILLATORS, "bench.rung");
        modulated = RungScript.parse(FIVE_MODULATED, "bench.rung");
        // ./bench runs only two one-second warm-up iterations; render a few hundred times first so the
        // evaluator loops are compiled before anything is measured.
        for (int i = 0; i < 300; i++) {
            steady.render(Double.NaN, i);
            modulated.render(Double.NaN, i);
        }
    }

    @Benchmark
    @OperationsPerInvocation(SAMPLES)
    public Signal fiveOscillatorsWithEnvelope() {
        return steady.render(Double.NaN, 1);
    }

    @Benchmark
    @OperationsPerInvocation(SAMPLES)
    public Signal fiveModulatedOscillatorsWithEnvelope() {
        return modulated.render(Double.NaN, 1);
    }
}
