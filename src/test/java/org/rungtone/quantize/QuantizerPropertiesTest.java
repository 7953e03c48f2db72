package org.rungtone.quantize;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.SplittableRandom;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.Size;
import org.rungtone.ladder.LevelTable;
import org.rungtone.source.Signal;

/**
 * Properties of {@link Quantizer} over random level tables (non-uniform, non-monotonic, with repeated levels),
 * dither kinds, error filters and inputs far outside full scale.
 */
class QuantizerPropertiesTest {
    /** Finite inputs from tiny to the largest doubles, where {@code x · span} overflows to infinity. */
    @Provide
    Arbitrary<double[]> inputs() {
        Arbitrary<Double> any = Arbitraries.oneOf(
                Arbitraries.doubles().between(-2, 2),
                Arbitraries.doubles().between(-Double.MAX_VALUE, Double.MAX_VALUE),
                Arbitraries.of(Double.MAX_VALUE, -Double.MAX_VALUE, Double.MIN_VALUE, -Double.MIN_VALUE, 1e308,
                        -1e308, 0.0, -0.0, 1.0, -1.0));
        return any.array(double[].class).ofMinSize(1).ofMaxSize(200);
    }

    /** How the levels of a random table are drawn. */
    enum Style { VOLTS, HUGE, REPEATED, NEAR_IDEAL }

    /**
     * Tables of 1..10 bits whose levels are random: a few volts, up to 1e300 V, drawn from only three values
     * (many repeats), or an ideal ladder with errors of up to one step (non-monotonic). Levels are drawn from
     * a seeded generator rather than element by element, which keeps 1024-level tables cheap.
     */
    @Provide
    Arbitrary<LevelTable> tables() {
        return Combinators.combine(Arbitraries.integers().between(1, 10), Arbitraries.of(Style.class),
                Arbitraries.longs()).as(QuantizerPropertiesTest::table);
    }

    static LevelTable table(int bits, Style style, long seed) {
        SplittableRandom r = new SplittableRandom(seed);
        double[] v = new double[1 << bits];
        for (int k = 0; k < v.length; k++) {
            v[k] = switch (style) {
                case VOLTS -> r.nextDouble(-5, 5);
                case HUGE -> r.nextDouble(-1e300, 1e300);
                case REPEATED -> new double[] {0, 1, 2.5}[r.nextInt(3)];
                case NEAR_IDEAL -> k + r.nextDouble(-1, 1);
            };
        }
        return spanned(bits, v);
    }

    /** The table of {@code v}, with the last level moved up when all are equal (a quantizer needs a span). */
    static LevelTable spanned(int bits, double[] v) {
        boolean flat = true;
        for (double x : v) {
            flat &= x == v[0];
        }
        if (flat) {
            v[v.length - 1] = v[0] + Math.max(1, Math.abs(v[0]));
        }
        return LevelTable.of(bits, v, "random");
    }

    @Provide
    Arbitrary<ErrorFilter> filters() {
        Arbitrary<ErrorFilter> fir = Arbitraries.doubles().between(-4, 4).array(double[].class).ofMaxSize(8)
                .map(ErrorFilter::fir);
        return Arbitraries.oneOf(Arbitraries.of(ErrorFilter.NONE, ErrorFilter.FIRST_ORDER, ErrorFilter.SECOND_ORDER),
                fir);
    }

    @Property(tries = 300)
    void codesAlwaysFitTheTable(@ForAll("tables") LevelTable table, @ForAll("inputs") double[] x,
            @ForAll Dither dither, @ForAll("filters") ErrorFilter shaping, @ForAll long seed) {
        Quantizer q = new Quantizer(table, table.minVolts(), table.maxVolts(), dither, shaping, seed);
        Codes codes = q.apply(Signal.of(x, 8000)).codes();
        assertEquals(x.length, codes.length());
        assertEquals(table.bits(), codes.bits());
        for (int c : codes.unsafeCodes()) {
            assertTrue(c >= 0 && c < table.size(), () -> "code " + c + " outside 0.." + (table.size() - 1));
        }
    }

    @Property(tries = 300)
    void codesFitAnExplicitSpanToo(@ForAll("tables") LevelTable table, @ForAll("inputs") double[] x,
            @ForAll @DoubleRange(min = -1e6, max = 1e6) double low,
            @ForAll @DoubleRange(min = 0.01, max = 1e6) double width, @ForAll Dither dither,
            @ForAll("filters") ErrorFilter shaping) {
        Quantizer q = new Quantizer(table, low, low + width, dither, shaping, 7);
        for (int c : q.apply(Signal.of(x, 8000)).codes().unsafeCodes()) {
            assertTrue(c >= 0 && c < table.size(), () -> "code " + c + " outside 0.." + (table.size() - 1));
        }
    }

    /** Brute force over every code: no level is strictly nearer than the one chosen. */
    @Property(tries = 1000)
    void nearestCodeIsOptimal(@ForAll("tables") LevelTable table,
            @ForAll @DoubleRange(min = -1e301, max = 1e301) double volts) {
        int code = new Quantizer(table, Dither.NONE, 1).nearestCode(volts);
        double chosen = Math.abs(table.volts(code) - volts);
        for (int k = 0; k < table.size(); k++) {
            double d = Math.abs(table.volts(k) - volts);
            assertTrue(chosen <= d, "code " + code + " at " + chosen + " V away, code " + k + " at " + d);
        }
    }

    /** Small tables with levels close together, where the search's neighbours matter most. */
    @Property(tries = 1000)
    void nearestCodeIsOptimalOnDenseTables(@ForAll @Size(min = 4, max = 4) List<@DoubleRange(min = 0, max = 1)
            Double> levels, @ForAll @DoubleRange(min = -0.5, max = 1.5) double volts) {
        LevelTable table = spanned(2, levels.stream().mapToDouble(Double::doubleValue).toArray());
        int code = new Quantizer(table, Dither.NONE, 1).nearestCode(volts);
        double chosen = Math.abs(table.volts(code) - volts);
        for (int k = 0; k < table.size(); k++) {
            assertTrue(chosen <= Math.abs(table.volts(k) - volts));
        }
    }

    /** Without dither or shaping every sample takes the nearest level to the volts it stands for. */
    @Property(tries = 200)
    void plainQuantizingPicksTheNearestLevel(@ForAll("tables") LevelTable table,
            @ForAll @Size(min = 1, max = 100) List<@DoubleRange(min = -1.5, max = 1.5) Double> samples) {
        double[] x = samples.stream().mapToDouble(Double::doubleValue).toArray();
        Quantizer q = new Quantizer(table, Dither.NONE, 3);
        int[] codes = q.apply(Signal.of(x, 8000)).codes().unsafeCodes();
        for (int i = 0; i < x.length; i++) {
            double target = q.targetVolts(x[i]);
            double chosen = Math.abs(table.volts(codes[i]) - target);
            for (int k = 0; k < table.size(); k++) {
                assertTrue(chosen <= Math.abs(table.volts(k) - target), "sample " + i + " code " + codes[i]);
            }
        }
    }
}
