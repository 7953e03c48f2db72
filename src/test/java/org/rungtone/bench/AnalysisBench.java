package org.rungtone.bench;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.rungtone.analysis.AnalogModel;
import org.rungtone.analysis.AudioMetrics;
import org.rungtone.analysis.ReconstructionFilter;
import org.rungtone.analysis.Survey;
import org.rungtone.analysis.SurveyResult;
import org.rungtone.analysis.SurveySpec;
import org.rungtone.analysis.SurveyTarget;
import org.rungtone.analysis.ToneAnalysis;
import org.rungtone.analysis.ToneReport;
import org.rungtone.ladder.LevelTable;
import org.rungtone.quantize.Codes;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.Signal;

/**
 * Analysis timings. {@code survey}: the default 12 bit depths × 4 rates (8, 11.025, 16, 22.05 kHz) of a
 * 10 s greenhouse-door chime, references already conditioned (target: under 5 s). {@code preview*}: the
 * analog model on 60 s of 8-bit codes. {@code metrics}: one quality report of 60 s at 16 kHz.
 * {@code tone}: single-tone analysis of 2^20 samples.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class AnalysisBench {
    Map<Double, Signal> references;
    SurveySpec spec;
    Codes codes8k;
    Codes codes22k;
    LevelTable table;
    Signal sixtySeconds;
    double[] sixtySecondsOut;
    AudioMetrics metrics;
    Signal tone;

    /** Makes the clips once. */
    @Setup(Level.Trial)
    public void setUp() {
        spec = SurveySpec.builder().target(SurveyTarget.sinadDb(40)).build();
        references = new LinkedHashMap<>();
        for (double rate : spec.ratesHz()) {
            references.put(rate, chime(rate, 10));
        }
        table = LevelTable.ideal(8, 5);
        codes8k = new Quantizer(table, Dither.TPDF, 1).apply(chime(8000, 60)).codes();
        codes22k = new Quantizer(table, Dither.TPDF, 1).apply(chime(22050, 60)).codes();
        sixtySeconds = chime(16000, 60);
        metrics = AudioMetrics.of(sixtySeconds, 3400);
        sixtySecondsOut = AudioMetrics.volts(new Quantizer(table, Dither.TPDF, 1).apply(sixtySeconds).codes(),
                table);
        double[] t = new double[1 << 20];
        for (int i = 0; i < t.length; i++) {
            t[i] = Math.rint(32767 * 0.9 * Math.sin(2 * Math.PI * 997 * i / 48000.0)) / 32767;
        }
        tone = Signal.wrap(t, 48000);
    }

    /** A door chime: three decaying bell partials struck every 1.5 s. */
    static Signal chime(double rate, double seconds) {
        int n = (int) (rate * seconds);
        double[] x = new double[n];
        double[] partials = {659.3, 1318.5, 2093.0};
        double[] weights = {0.5, 0.25, 0.12};
        for (int i = 0; i < n; i++) {
            double t = i / rate;
            double since = t % 1.5;
            double env = Math.exp(-3 * since);
            double v = 0;
            for (int k = 0; k < partials.length; k++) {
                v += weights[k] * Math.sin(2 * Math.PI * partials[k] * t);
            }
            x[i] = env * v;
        }
        return Signal.wrap(x, rate);
    }

    /** The 12 × 4 survey of a 10 s clip. */
    @Benchmark
    public SurveyResult survey() {
        return Survey.run(spec, references::get);
    }

    /** 60 s of 8 kHz codes, no filter, to a 44.1 kHz preview. */
    @Benchmark
    public Object preview8kTo44k() {
        return new AnalogModel(ReconstructionFilter.none(), 44100).render(codes8k, table);
    }

    /** 60 s of 22.05 kHz codes through a second-order filter to a 48 kHz preview. */
    @Benchmark
    public Object preview22kTo48kFiltered() {
        return new AnalogModel(ReconstructionFilter.secondOrder(8000, 0.707), 48000).render(codes22k, table);
    }

    /** Quality report of 60 s at 16 kHz (alignment, two Welch spectra). */
    @Benchmark
    public Object metrics() {
        return metrics.measure("bench", sixtySecondsOut);
    }

    /** Sine fit and spectrum of 2^20 samples. */
    @Benchmark
    public ToneReport tone() {
        return ToneAnalysis.analyze(tone);
    }
}
