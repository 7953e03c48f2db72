package org.rungtone.bench;

import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.rungtone.calibrate.BoardFit;
import org.rungtone.calibrate.FitReport;
import org.rungtone.calibrate.MeasurementPlan;
import org.rungtone.calibrate.Measurements;
import org.rungtone.calibrate.OutputSpan;
import org.rungtone.calibrate.SimulatedBoard;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LevelTable;
import org.rungtone.ladder.Spread;
import org.rungtone.ladder.Topology;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;
import org.rungtone.quantize.Quantizer;
import org.rungtone.source.Signal;

/**
 * Calibration speed. {@code fit12Bit}: the fit of a 12-bit weighted board of 5 % parts read at all 4096
 * codes (both models, outlier screening, the table), target under 0.2 s. {@code compensate60s}: compensated
 * quantization of a 60 s clip at 16 kHz onto a 10-bit board's real levels with TPDF dither and second-order
 * error feedback, target under 0.5 s.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class CalibrateBench {
    private Measurements readings;
    private Signal clip;
    private LevelTable board;
    private double[] span;

    /** Draws the boards and makes the readings and the clip once. */
    @Setup
    public void setUp() {
        LadderSpec spec12 = LadderSpec.builder().topology(Topology.WEIGHTED).bits(12).tolerance(0.05).build();
        SimulatedBoard b12 = SimulatedBoard.draw(spec12, Spread.uniform(), 42);
        readings = b12.measure(MeasurementPlan.everyCode(spec12.levels()),
                new SimulatedBoard.Meter(0.2e-3, 1e-3, 1), 43);
        LadderSpec spec10 = LadderSpec.builder().topology(Topology.WEIGHTED).bits(10).tolerance(0.05).build();
        board = SimulatedBoard.draw(spec10, Spread.uniform(), 7).levels();
        span = OutputSpan.FULL.volts(board, LevelTable.ideal(10, 5.0));
        double rate = 16_000;
        double[] x = new double[(int) (60 * rate)];
        for (int i = 0; i < x.length; i++) {
            double t = i / rate;
            x[i] = 0.6 * Math.sin(2 * Math.PI * 440 * t) + 0.3 * Math.sin(2 * Math.PI * 1234.5 * t);
        }
        clip = Signal.wrap(x, rate);
    }

    /** One 12-bit fit from 4096 readings. */
    @Benchmark
    public FitReport fit12Bit() {
        return BoardFit.fit(readings, BoardFit.Settings.defaults());
    }

    /** One compensated quantization of 960,000 samples. */
    @Benchmark
    public Quantizer.Quantized compensate60s() {
        return new Quantizer(board, span[0], span[1], Dither.TPDF, ErrorFilter.SECOND_ORDER, 1).apply(clip);
    }
}
