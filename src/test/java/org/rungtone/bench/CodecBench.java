package org.rungtone.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.rungtone.codec.TreadEncoder;
import org.rungtone.codec.TreadFormat;
import org.rungtone.codec.TreadStream;
import org.rungtone.codec.Weighting;
import org.rungtone.condition.Conditioner;
import org.rungtone.condition.Conditioning;
import org.rungtone.condition.KaiserResampler;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.Signal;
import org.rungtone.source.WavReader;

/**
 * The Tread encoder on the 60 s benchmark clip at 16 kHz (960,000 samples) onto an 8-bit ideal ladder with
 * TPDF dither and the A weighting: the goal is under 2 s per encode. Also the reference decoder on its stream.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class CodecBench {
    @Param({"TREAD2", "TREAD3", "TREAD4"})
    String format;

    Signal clip;
    TreadEncoder encoder;
    TreadStream stream;

    /** Makes and conditions the clip once. */
    @Setup(Level.Trial)
    public void setUp() throws IOException {
        Path dir = Files.createTempDirectory("rungtone-bench");
        Path file = dir.resolve("clip60.wav");
        ClipMaker.write(file, 60);
        clip = new Conditioner(KaiserResampler.forBits(8)).apply(WavReader.read(file).signal(),
                Conditioning.toRate(16_000)).signal();
        Files.delete(file);
        Files.delete(dir);
        encoder = new TreadEncoder(TreadFormat.valueOf(format), new Quantizer(LevelTable.ideal(8, 5), Dither.TPDF, 1),
                Weighting.aWeighted(16_000, 8_000));
        stream = encoder.encode(clip).stream();
    }

    /** Encodes the minute. */
    @Benchmark
    public TreadStream encode() {
        return encoder.encode(clip).stream();
    }

    /** Decodes the minute with the reference decoder. */
    @Benchmark
    public int[] decode() {
        return stream.decoder().decode(stream.start(), stream.unsafeCodes());
    }
}
