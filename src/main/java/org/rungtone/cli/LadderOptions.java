package org.rungtone.cli;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Units;
import org.rungtone.ladder.ESeries;
import org.rungtone.ladder.LadderDescription;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LadderSpecError;
import org.rungtone.ladder.LadderTable;
import org.rungtone.ladder.Topology;
import picocli.CommandLine.Option;

/**
 * The ladder description on the command line: {@code --ladder FILE} (a TOML file with a {@code [ladder]}
 * table) and one option per key of that table, which overrides the file. The bit depth is the core option
 * {@code --bits} of each command, passed in. Shared by every command that models a ladder.
 */
public final class LadderOptions implements LadderDescription {
    @Option(names = "--ladder", paramLabel = "FILE",
            description = "Read the ladder from the [ladder] table of this TOML file; the options below"
                    + " override its keys.")
    Path ladderFile;

    @Option(names = "--topology", paramLabel = "weighted|r2r|custom",
            description = "Network: binary-weighted summing, R-2R, or your own per-bit values (default weighted).")
    String topology;

    @Option(names = "--resistors", split = ",", paramLabel = "R",
            description = "Per-bit resistors, bit 0 (LSB) first, e.g. 100k,47k,24k,12k (weighted, custom).")
    List<String> resistors;

    @Option(names = "--base-r", paramLabel = "<ohms>",
            description = "MSB resistor of a derived weighted ladder, or R of an R-2R ladder (default 10k).")
    String baseR;

    @Option(names = "--series", paramLabel = "E6..E192",
            description = "Preferred-value series to snap derived values to and to propose values from.")
    String series;

    @Option(names = "--tolerance", paramLabel = "<percent>",
            description = "Resistor tolerance, e.g. 1%% (default 5%%).")
    String tolerance;

    @Option(names = "--logic-high", paramLabel = "<volts>",
            description = "Pin output level of a 1 bit (default 5V).")
    String logicHigh;

    @Option(names = "--logic-low", paramLabel = "<volts>",
            description = "Pin output level of a 0 bit (default 0V).")
    String logicLow;

    @Option(names = "--pin-r-high", paramLabel = "<ohms>",
            description = "Pin output resistance while high (default 25).")
    String pinRHigh;

    @Option(names = "--pin-r-low", paramLabel = "<ohms>",
            description = "Pin output resistance while low (default 20).")
    String pinRLow;

    @Option(names = "--load", paramLabel = "<ohms>",
            description = "Load from the ladder output to ground, or inf (default inf).")
    String load;

    @Option(names = "--buffer-gain", paramLabel = "<gain>",
            description = "Voltage gain of the buffer after the ladder (default 1).")
    String bufferGain;

    @Option(names = "--out-min", paramLabel = "<volts>",
            description = "Lowest output the buffer reaches (default 0V).")
    String outMin;

    @Option(names = "--out-max", paramLabel = "<volts>",
            description = "Highest output the buffer reaches (default: logic high).")
    String outMax;

    /**
     * A command's {@code --bits}, checked: 0 when not given (the ladder's or the profile's bit depth then
     * applies). A given 0 is refused here, where the option is known, rather than taken as "not given".
     *
     * @throws InputError naming {@code --bits} when the value is outside 1..16
     */
    static int bitsOrZero(Integer bits) {
        if (bits == null) {
            return 0;
        }
        if (bits < 1 || bits > 16) {
            throw new InputError("--bits: bit depth must be 1..16, got " + bits);
        }
        return bits;
    }

    /** True when a ladder file or any ladder option was given. */
    @Override
    public boolean given() {
        return ladderFile != null || !overrides().isEmpty();
    }

    /** True when the ladder file or options state the bit depth (bits, or a per-bit resistor list). */
    @Override
    public boolean statesBits() {
        return resistors != null || ladderFile != null && LadderTable.read(ladderFile).statesBits();
    }

    /** The ladder described by the file and options, defaults filling the rest; bits 0 keeps the file's. */
    @Override
    public LadderSpec spec(int bitsOrZero) {
        return spec(Optional.empty(), bitsOrZero);
    }

    /** The options on top of a project's {@code [ladder]} table, which {@code --ladder FILE} replaces. */
    @Override
    public LadderDescription over(LadderTable base) {
        LadderOptions self = this;
        return new LadderDescription() {
            @Override
            public boolean given() {
                return true;
            }

            @Override
            public boolean statesBits() {
                return self.resistors != null || (self.ladderFile != null ? LadderTable.read(self.ladderFile)
                        : base).statesBits();
            }

            @Override
            public LadderSpec spec(int bitsOrZero) {
                return self.spec(Optional.of(base), bitsOrZero);
            }
        };
    }

    /**
     * The ladder described by a project's table (when given), replaced by {@code --ladder FILE} when given,
     * with the command-line options on top.
     *
     * @throws InputError naming the option, or the file and line, at fault
     */
    private LadderSpec spec(Optional<LadderTable> projectTable, int bitsOrZero) {
        Optional<LadderTable> table = ladderFile != null ? Optional.of(LadderTable.read(ladderFile)) : projectTable;
        LadderSpec.Builder b = table.map(LadderTable::builder).orElseGet(LadderSpec::builder);
        Map<String, String> cli = overrides();
        applyOverrides(b);
        if (bitsOrZero != 0) {
            b.bits(bitsOrZero);
        }
        try {
            return b.build();
        } catch (LadderSpecError e) {
            boolean bitsFromCli = bitsOrZero != 0;
            if (e.key().equals("bits") && bitsFromCli) {
                throw new InputError("--bits: " + e.detail(), e);
            }
            if (cli.containsKey(e.key())) {
                throw new InputError(cli.get(e.key()) + ": " + e.detail(), e);
            }
            String hint = bitsFromCli && e.key().equals("resistors") ? " (bits from --bits)" : "";
            if (table.isPresent()) {
                throw new InputError(table.get().where(e.key()) + ": " + e.detail() + hint, e);
            }
            throw new InputError(e.getMessage() + hint, e);
        }
    }

    /** Ladder-file key to option name, for the options given. */
    private Map<String, String> overrides() {
        Map<String, String> m = new LinkedHashMap<>();
        put(m, topology, "topology", "--topology");
        put(m, resistors, "resistors", "--resistors");
        put(m, baseR, "base_r", "--base-r");
        put(m, series, "series", "--series");
        put(m, tolerance, "tolerance", "--tolerance");
        put(m, logicHigh, "logic_high", "--logic-high");
        put(m, logicLow, "logic_low", "--logic-low");
        put(m, pinRHigh, "pin_r_high", "--pin-r-high");
        put(m, pinRLow, "pin_r_low", "--pin-r-low");
        put(m, load, "load", "--load");
        put(m, bufferGain, "buffer.gain", "--buffer-gain");
        put(m, outMin, "buffer.out_min", "--out-min");
        put(m, outMax, "buffer.out_max", "--out-max");
        return m;
    }

    private static void put(Map<String, String> m, Object value, String key, String option) {
        if (value != null) {
            m.put(key, option);
        }
    }

    private void applyOverrides(LadderSpec.Builder b) {
        if (topology != null) {
            b.topology(parse("--topology", () -> Topology.parse(topology)));
        }
        if (resistors != null) {
            List<Double> values = new ArrayList<>();
            for (int i = 0; i < resistors.size(); i++) {
                String text = resistors.get(i);
                int bit = i;
                values.add(parse("--resistors", () -> quantity("bit " + bit + ": ", text, "ohm")));
            }
            b.resistors(values);
        }
        if (baseR != null) {
            b.baseROhms(parse("--base-r", () -> Units.parse(baseR, "ohm")));
        }
        if (series != null) {
            b.series(parse("--series", () -> ESeries.parse(series)));
        }
        if (tolerance != null) {
            b.tolerance(parse("--tolerance", () -> percent(tolerance)));
        }
        if (logicHigh != null) {
            b.logicHighVolts(parse("--logic-high", () -> Units.parse(logicHigh, "V")));
        }
        if (logicLow != null) {
            b.logicLowVolts(parse("--logic-low", () -> Units.parse(logicLow, "V")));
        }
        if (pinRHigh != null) {
            b.pinROhmsHigh(parse("--pin-r-high", () -> Units.parse(pinRHigh, "ohm")));
        }
        if (pinRLow != null) {
            b.pinROhmsLow(parse("--pin-r-low", () -> Units.parse(pinRLow, "ohm")));
        }
        if (load != null) {
            b.loadOhms(parse("--load", () -> Units.parse(load, "ohm")));
        }
        if (bufferGain != null) {
            b.bufferGain(parse("--buffer-gain", () -> Units.parse(bufferGain, "")));
        }
        if (outMin != null) {
            b.outMinVolts(parse("--out-min", () -> Units.parse(outMin, "V")));
        }
        if (outMax != null) {
            b.outMaxVolts(parse("--out-max", () -> Units.parse(outMax, "V")));
        }
    }

    private static double quantity(String prefix, String text, String unit) {
        try {
            return Units.parse(text, unit);
        } catch (InputError e) {
            throw new InputError(prefix + e.getMessage(), e);
        }
    }

    /** Parses a percentage that must carry its % sign: "5%" is 0.05. */
    static double percent(String text) {
        if (!text.trim().endsWith("%")) {
            throw new InputError("write it as a percentage, e.g. 5% or 0.1%, got '" + text + "'");
        }
        return Units.parse(text, "%");
    }

    private interface Parse<T> {
        T get();
    }

    private static <T> T parse(String option, Parse<T> parse) {
        try {
            return parse.get();
        } catch (InputError e) {
            throw new InputError(option + ": " + e.getMessage(), e);
        }
    }
}
