package org.rungtone.ladder;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.rungtone.internal.InputError;
import org.tomlj.Toml;
import org.tomlj.TomlParseResult;

class LadderSpecTest {
    private static LadderSpec parse(String toml) {
        TomlParseResult r = Toml.parse(toml);
        assertTrue(r.errors().isEmpty(), r.errors().toString());
        return LadderSpec.fromToml(r.getTable("ladder"), Path.of("board.toml"));
    }

    private static String tomlError(String toml) {
        return assertThrows(InputError.class, () -> parse(toml)).getMessage();
    }

    private static String buildError(LadderSpec.Builder b) {
        return assertThrows(LadderSpecError.class, b::build).getMessage();
    }

    @Test
    void defaultsAreAWeightedEightBitLadderOnFiveVoltPins() {
        LadderSpec spec = LadderSpec.builder().build();
        assertEquals(Topology.WEIGHTED, spec.topology());
        assertEquals(8, spec.bits());
        assertEquals(0.05, spec.tolerance());
        assertEquals(25, spec.pinROhmsHigh());
        assertEquals(20, spec.pinROhmsLow());
        assertEquals(new Buffer(1, 0, 5), spec.buffer());
        // R_i = base_r · 2^(N-1-i): the MSB gets base_r, the LSB 128·base_r.
        assertEquals(10e3, spec.parts().get(7).ohms());
        assertEquals(1.28e6, spec.parts().get(0).ohms());
        assertTrue(spec.warnings().isEmpty(), spec.warnings().toString());
    }

    @Test
    void derivedValuesSnapToTheSeries() {
        LadderSpec spec = LadderSpec.builder().bits(4).series(ESeries.E12).build();
        // 10k, 20k, 40k, 80k -> nearest E12 (IEC 60063): 10k, 18k or 22k (22k is nearer on a log scale), 39k, 82k.
        assertEquals(List.of(82e3, 39e3, 22e3, 10e3), spec.parts().stream().map(Part::ohms).toList());
        LadderSpec r2r = LadderSpec.builder().topology(Topology.R2R).bits(3).baseROhms(4.7e3)
                .series(ESeries.E24).build();
        assertEquals(9.1e3, r2r.parts().get(0).ohms());
        assertEquals(4.7e3, r2r.parts().get(3).ohms());
        assertEquals(Part.Role.TERMINATION, r2r.parts().get(5).role());
    }

    @Test
    void toBuilderRoundTrips() {
        LadderSpec spec = LadderSpec.builder().topology(Topology.R2R).bits(6).baseROhms(4.7e3).loadOhms(1e5)
                .series(ESeries.E96).outMinVolts(0.05).build();
        assertEquals(spec, spec.toBuilder().build());
        assertEquals(spec.hashCode(), spec.toBuilder().build().hashCode());
        assertNotEquals(spec, spec.toBuilder().bits(7).build());
        // out_max follows logic high unless given.
        assertEquals(3.3, spec.toBuilder().logicHighVolts(3.3).build().buffer().outMaxVolts());
    }

    @Test
    void rejectsBadValuesWithOneLineNamingTheKey() {
        assertEquals("ladder.bits: bit depth must be 1..16, got 17", buildError(LadderSpec.builder().bits(17)));
        assertEquals("ladder.resistors: expected 4 values for 4 bits, got 3",
                buildError(LadderSpec.builder().bits(4).resistors(1e3, 2e3, 4e3)));
        assertEquals("ladder.resistors: bit 1 needs a positive, finite resistance, got -2k",
                buildError(LadderSpec.builder().resistors(1e3, -2e3)));
        assertEquals("ladder.resistors: bit 0 needs a positive, finite resistance, got 0",
                buildError(LadderSpec.builder().resistors(0, 2e3)));
        assertEquals("ladder.base_r: must be a positive, finite resistance, got -10k",
                buildError(LadderSpec.builder().baseROhms(-10e3)));
        assertEquals("ladder.resistors: topology custom needs one value per bit, bit 0 (LSB) first",
                buildError(LadderSpec.builder().topology(Topology.CUSTOM)));
        assertTrue(buildError(LadderSpec.builder().topology(Topology.R2R).resistors(1e3, 2e3))
                .startsWith("ladder.resistors: not used by topology r2r"));
        assertEquals("ladder.logic_high: must be above logic_low (3.3V), got 3V",
                buildError(LadderSpec.builder().logicHighVolts(3).logicLowVolts(3.3)));
        assertEquals("ladder.load: must be a positive resistance, or inf for none, got 0",
                buildError(LadderSpec.builder().loadOhms(0)));
        assertEquals("ladder.buffer.out_max: 1V must be above out_min (2V)",
                buildError(LadderSpec.builder().outMinVolts(2).outMaxVolts(1)));
        assertEquals("ladder.tolerance: must be 0% to 50%, got 60%",
                buildError(LadderSpec.builder().tolerance(0.6)));
    }

    @Test
    void rejectsResistancesTheNodalSolverCannotResolve() {
        assertEquals("ladder.base_r: must be 0.1 ohm to 1e12 ohm, got 1e+300",
                buildError(LadderSpec.builder().topology(Topology.R2R).baseROhms(1e300)));
        assertEquals("ladder.base_r: must be 0.1 ohm to 1e12 ohm, got 1e-300",
                buildError(LadderSpec.builder().topology(Topology.R2R).baseROhms(1e-300)));
        assertEquals("ladder.base_r: 600G makes the 2R legs 1.2e+12, above 1e12 ohm; use a smaller base_r",
                buildError(LadderSpec.builder().topology(Topology.R2R).baseROhms(600e9)));
        assertEquals("ladder.base_r: 10G makes bit 0's resistor 1.28e+12 (base_r * 2^7), above 1e12 ohm; use a"
                + " smaller base_r", buildError(LadderSpec.builder().baseROhms(10e9)));
        assertEquals("ladder.resistors: bit 1 needs a resistance of 0.1 ohm to 1e12 ohm, got 10m",
                buildError(LadderSpec.builder().topology(Topology.CUSTOM).resistors(1e3, 0.01)));
        assertEquals("ladder.pin_r_high: must be 0 to 1e12 ohm, got 1e+300",
                buildError(LadderSpec.builder().pinROhmsHigh(1e300)));
        assertEquals("ladder.load: must be 0.1 ohm to 1e12 ohm, or inf for none, got 1e-300",
                buildError(LadderSpec.builder().loadOhms(1e-300)));
        // the limits themselves are allowed
        assertEquals(1e12, LadderSpec.builder().topology(Topology.CUSTOM).resistors(1e12, 0.1).loadOhms(0.1)
                .build().parts().get(0).ohms());
    }

    @Test
    void rejectsABufferSwingWithNoUsableSpan() {
        assertEquals("ladder.buffer.out_min: 6V is at or above the highest buffered ladder level (5V);"
                + " no usable span is left", buildError(LadderSpec.builder().outMinVolts(6).outMaxVolts(9)));
        assertTrue(buildError(LadderSpec.builder().outMinVolts(-5).outMaxVolts(-1))
                .startsWith("ladder.buffer.out_max: -1V is at or below the lowest"));
    }

    @Test
    void warnsWhenPinsAreStrongerThanTheLadderAndWhenTheBufferClips() {
        LadderSpec spec = LadderSpec.builder().bits(3).resistors(80, 40, 20).pinROhmsHigh(25).build();
        assertEquals(1, spec.warnings().size());
        assertTrue(spec.warnings().get(0).startsWith("pin resistance (25 high, 20 low) is larger than the"
                + " smallest ladder resistor (20, leg b2)"), spec.warnings().get(0));
        LadderSpec clipped = LadderSpec.builder().bits(4).bufferGain(2).build();
        assertEquals(List.of("the buffer clips 8 codes at out_max 5V (codes 8..15); lower the gain or widen"
                + " the swing"), clipped.warnings());
    }

    /** All pins high with no load puts the top code on the 5 V rail itself: on the swing, not beyond it. */
    @Test
    void aLevelOnTheRailIsNotClipped() {
        // E24 legs of a 4-bit weighted ladder, as ladder --series E24 chooses them
        LadderSpec spec = LadderSpec.builder().bits(4).resistors(82e3, 39e3, 20e3, 10e3).build();
        assertEquals(5.0, Ladder.nominal(spec).levels().volts(15), 1e-9);
        assertEquals(List.of(), spec.warnings());
    }

    @Test
    void readsALadderTable() {
        LadderSpec spec = parse("[ladder]\n"
                + "topology   = \"weighted\"\n"
                + "bits       = 4\n"
                + "resistors  = [\"100k\", \"47k\", \"24k\", 12000]\n"
                + "series     = \"e24\"\n"
                + "tolerance  = \"1%\"\n"
                + "logic_high = \"3.3V\"\n"
                + "pin_r_high = \"30\"\n"
                + "pin_r_low  = 22\n"
                + "load       = \"inf\"\n"
                + "buffer     = { gain = 1.5, out_min = \"0.1V\", out_max = \"4.8V\" }\n");
        LadderSpec expected = LadderSpec.builder().bits(4).resistors(100e3, 47e3, 24e3, 12e3).series(ESeries.E24)
                .tolerance(0.01).logicHighVolts(3.3).pinROhmsHigh(30).pinROhmsLow(22).bufferGain(1.5)
                .outMinVolts(0.1).outMaxVolts(4.8).build();
        assertEquals(expected, spec);
        assertEquals(4, parse("[ladder]\nresistors = [\"1k\", \"2k\", \"4k\", \"8k\"]\n").bits());
        assertEquals(20e3, parse("[ladder]\ntopology = \"r2r\"\nbase_r = \"4k7\"\n").baseROhms() * 20e3 / 4.7e3,
                1e-9);
    }

    @Test
    void tomlErrorsNameFileLineAndKey() {
        assertEquals("board.toml:7: ladder.resistors: expected 6 values for 6 bits, got 5",
                tomlError("# greenhouse door chime\n\n[ladder]\ntopology = \"weighted\"\nbits = 6\n\n"
                        + "resistors = [\"10k\", \"20k\", \"39k\", \"82k\", \"160k\"]\n"));
        assertEquals("board.toml:3: ladder.base_r: '10q' is not a resistance (e.g. 4k7, 2.2k, 100, 1M)",
                tomlError("[ladder]\ntopology = \"r2r\"\nbase_r = \"10q\"\n"));
        assertEquals("board.toml:2: ladder.unit: unknown key; the R of an r2r ladder is called base_r",
                tomlError("[ladder]\nunit = \"10k\"\n"));
        assertEquals("board.toml:2: ladder.tolerance: write it as a percentage in quotes, e.g. \"5%\" or \"0.1%\"",
                tomlError("[ladder]\ntolerance = 5\n"));
        assertEquals("board.toml:3: ladder.buffer.out_max: 1V must be above out_min (2V)",
                tomlError("[ladder]\nbits = 4\nbuffer = { out_min = \"2V\", out_max = \"1V\" }\n"));
        assertEquals("board.toml:2: ladder.bits: bit depth must be 1..16, got 0", tomlError("[ladder]\nbits = 0\n"));
        assertEquals("board.toml:3: ladder.resistors: bit 1: '-' is not a resistance (e.g. 4k7, 2.2k, 100, 1M)",
                tomlError("[ladder]\nbits = 2\nresistors = [\"1k\", \"-\"]\n"));
        assertEquals("board.toml:2: ladder.topology: unknown topology 'ladder'; use weighted, r2r or custom",
                tomlError("[ladder]\ntopology = \"ladder\"\n"));
        assertEquals("board.toml:2: ladder.buffer.offset: unknown key; known keys are gain, out_min, out_max",
                tomlError("[ladder]\nbuffer = { offset = 1 }\n"));
    }

    @Test
    void anR2rLadderTakesEveryPartsOwnValueLegsThenRungsThenTermination() {
        LadderSpec derived = LadderSpec.builder().topology(Topology.R2R).bits(3).baseROhms(10e3).build();
        LadderSpec listed = LadderSpec.builder().topology(Topology.R2R).bits(3)
                .resistors(20e3, 20e3, 20e3, 10e3, 10e3, 20e3).build();
        assertEquals(derived.parts(), listed.parts());
        assertEquals(derived.levels(), listed.levels());
        LadderSpec own = LadderSpec.builder().topology(Topology.R2R).bits(3)
                .resistors(20e3, 22e3, 24e3, 11e3, 12e3, 27e3).build();
        assertEquals(List.of("leg b0 20k", "leg b1 22k", "leg b2 24k", "rung b0-b1 11k", "rung b1-b2 12k",
                "termination 27k"), own.parts().stream().map(Part::toString).toList());
        assertEquals("ladder.resistors: not used by topology r2r unless it lists all 6 parts of 3 bits (the legs,"
                + " bit 0 first, then the rungs from bit 0 up, then the termination), got 3; remove it to take the"
                + " values from base_r, or use topology custom for a summing network of your own values",
                buildError(LadderSpec.builder().topology(Topology.R2R).bits(3).resistors(1e3, 2e3, 3e3)));
        assertEquals("ladder.resistors: part 5 needs a positive, finite resistance, got 0",
                buildError(LadderSpec.builder().topology(Topology.R2R).bits(3).resistors(1e3, 1e3, 1e3, 1e3, 1e3,
                        0)));
    }
}
