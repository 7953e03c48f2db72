package org.rungtone.bench;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.Writer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.rungtone.analysis.Survey;
import org.rungtone.analysis.SurveyResult;
import org.rungtone.analysis.SurveySpec;
import org.rungtone.analysis.SurveyTarget;
import org.rungtone.cli.Main;
import org.rungtone.condition.Conditioner;
import org.rungtone.condition.Conditioning;
import org.rungtone.condition.KaiserResampler;
import org.rungtone.ladder.LevelTable;
import org.rungtone.source.Signal;
import org.rungtone.source.WavReader;
import picocli.CommandLine;

/**
 * The whole survey of a 10 s clip (ClipMaker's stereo 44.1 kHz chords), 12 bit depths × 4 rates (8,
 * 11.025, 16, 22.05 kHz), target under 5 s. {@code conditionAndSurvey}: the decoded clip conditioned to each
 * rate (Kaiser resampler for 12 bits, DC removal, −1 dBFS normalization) and surveyed. {@code command}:
 * {@code rungtone survey CLIP --target-sinad 40 --flash-budget 200k --quiet}, i.e. plus WAV decoding, the plot,
 * the JSON and the text report.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class SurveyBench {
    Path folder;
    Path clip;
    Signal decoded;
    SurveySpec spec;

    /** Writes the clip once. */
    @Setup(Level.Trial)
    public void setUp() throws IOException {
        folder = Files.createTempDirectory("rungtone-survey-bench");
        clip = folder.resolve("chords.wav");
        ClipMaker.write(clip, 10);
        decoded = WavReader.read(clip, 0).signal();
        spec = SurveySpec.builder().target(SurveyTarget.sinadDb(40)).flashBudgetBytes(200_000)
                .tables(bits -> LevelTable.ideal(bits, 5.0)).seed(1).build();
    }

    /** Removes the clip and outputs. */
    @TearDown(Level.Trial)
    public void tearDown() throws IOException {
        try (Stream<Path> s = Files.walk(folder)) {
            for (Path p : s.sorted(Comparator.reverseOrder()).toList()) {
                Files.delete(p);
            }
        }
    }

    /** Conditioning to the four rates and the 48 cells. */
    @Benchmark
    public SurveyResult conditionAndSurvey() {
        Conditioner conditioner = new Conditioner(KaiserResampler.forBits(12));
        return Survey.run(spec, rate -> conditioner.apply(decoded, Conditioning.toRate(rate)).signal());
    }

    /** The command, end to end, writing its three files. */
    @Benchmark
    public int command() {
        CommandLine cl = Main.newCommandLine();
        PrintWriter sink = new PrintWriter(Writer.nullWriter());
        cl.setOut(sink);
        cl.setErr(sink);
        int code = cl.execute("survey", clip.toString(), "--target-sinad", "40", "--flash-budget", "200k",
                "--quiet", "--out", folder.resolve("out").toString());
        if (code != 0) {
            throw new IllegalStateException("survey failed with exit code " + code);
        }
        return code;
    }
}
