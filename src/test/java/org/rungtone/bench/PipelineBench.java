package org.rungtone.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.rungtone.condition.Conditioner;
import org.rungtone.condition.Conditioning;
import org.rungtone.condition.KaiserResampler;
import org.rungtone.firmware.SampleArrayEmitter;
import org.rungtone.firmware.Templates;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.Signal;
import org.rungtone.source.WavReader;

/**
 * Stage timings on a 60 s 44.1 kHz stereo 16-bit clip (2,646,000 input frames): decode, resample to 16 kHz,
 * quantize to 8 bits with TPDF, emit C. Divide 2.646 M by the seconds per operation for input samples/s.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class PipelineBench {
    Path dir;
    Path clip;
    Signal decoded;
    Signal conditioned;
    Quantizer quantizer;
    Quantizer shaped;

    /** Makes the clip once. */
    @Setup(Level.Trial)
    public void setUp() throws IOException {
        dir = Files.createTempDirectory("rungtone-bench");
        clip = dir.resolve("clip60.wav");
        ClipMaker.write(clip, 60);
        decoded = WavReader.read(clip).signal();
        conditioned = new Conditioner(KaiserResampler.forBits(8)).apply(decoded, Conditioning.toRate(16_000))
                .signal();
        quantizer = new Quantizer(LevelTable.ideal(8, 5), Dither.TPDF, 1);
        LevelTable ideal = LevelTable.ideal(8, 5);
        shaped = new Quantizer(ideal, ideal.minVolts(), ideal.maxVolts(), Dither.TPDF,
                org.rungtone.quantize.ErrorFilter.SECOND_ORDER, 1);
    }

    /** Removes the files. */
    @TearDown(Level.Trial)
    public void tearDown() throws IOException {
        try (var s = Files.walk(dir)) {
            s.sorted(java.util.Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        }
    }

    /** WAV decode with mix-down. */
    @Benchmark
    public Signal decode() {
        return WavReader.read(clip).signal();
    }

    /** DC removal, resampling 44.1 to 16 kHz, normalization. */
    @Benchmark
    public Signal condition() {
        return new Conditioner(KaiserResampler.forBits(8)).apply(decoded, Conditioning.toRate(16_000)).signal();
    }

    /** Streamed decode and conditioning, as a build runs it: the WAV is decoded block by block as resampled. */
    @Benchmark
    public Signal decodeAndCondition() {
        try (var in = WavReader.open(clip, 0)) {
            return new Conditioner(KaiserResampler.forBits(8)).apply(in, Conditioning.toRate(16_000)).signal();
        }
    }

    /** 8-bit TPDF quantization with second-order error feedback (sequential by nature). */
    @Benchmark
    public Object quantizeShaped() {
        return shaped.apply(conditioned);
    }

    /** 8-bit TPDF quantization of 960,000 samples. */
    @Benchmark
    public Object quantize() {
        return quantizer.apply(conditioned);
    }

    /** Decode, condition, quantize and emit C, end to end. */
    @Benchmark
    public Object wholePipeline() {
        Signal s = WavReader.read(clip).signal();
        Signal c = new Conditioner(KaiserResampler.forBits(8)).apply(s, Conditioning.toRate(16_000)).signal();
        var codes = quantizer.apply(c).codes();
        return new SampleArrayEmitter(Templates.bundled()).emit(new SampleArrayEmitter.Request("bench", codes, "",
                "bench", List.of()), dir.resolve("out"));
    }

}
