package org.rungtone.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.rungtone.firmware.EmitResult;
import org.rungtone.firmware.FirmwareEmitter;
import org.rungtone.firmware.FirmwareRequest;
import org.rungtone.firmware.SampleArrayEmitter;
import org.rungtone.firmware.SampleStorage;
import org.rungtone.firmware.Templates;
import org.rungtone.quantize.Codes;

/**
 * Emission of a 1 M-sample sound into C files on disk (target: under 0.3 s): the sample-array emitter the
 * build command uses, and the full player emitter with unpacked and packed storage.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class EmitBench {
    private static final int SAMPLES = 1_000_000;

    @Param({"unpacked", "packed"})
    public String storage;

    private Codes codes;
    private Path out;

    @Setup(Level.Trial)
    public void setUp() throws IOException {
        int[] c = new int[SAMPLES];
        SplittableRandom r = new SplittableRandom(1);
        for (int i = 0; i < c.length; i++) {
            c[i] = r.nextInt(256);
        }
        codes = Codes.of(8, 16000, c);
        out = Files.createTempDirectory("emitbench");
    }

    @TearDown(Level.Trial)
    public void tearDown() throws IOException {
        try (Stream<Path> s = Files.walk(out)) {
            for (Path p : s.sorted(Comparator.reverseOrder()).toList()) {
                Files.delete(p);
            }
        }
    }

    @Benchmark
    public List<Path> sampleArray() {
        return new SampleArrayEmitter(Templates.bundled()).emit(new SampleArrayEmitter.Request("bench", codes, "",
                "bench", List.of("source: generated")), out);
    }

    @Benchmark
    public EmitResult player() {
        FirmwareRequest request = FirmwareRequest.builder().family("cortexm").name("bench").pins("PB0-PB7")
                .cpuClockHz(16e6).storage(SampleStorage.valueOf(storage.toUpperCase(java.util.Locale.ROOT)))
                .sound("noise", codes).build();
        return FirmwareEmitter.emit(request, out);
    }
}
