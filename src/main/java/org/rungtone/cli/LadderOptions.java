package org.rungtone.cli;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.rungtone.cli.shell.Choices;
import org.rungtone.cli.shell.Heading;
import org.rungtone.cli.shell.Section;
import org.rungtone.internal.InputError;
import org.rungtone.ladder.LadderDescription;
import org.rungtone.ladder.LadderOverrides;
import org.rungtone.ladder.LadderSpec;
import org.rungtone.ladder.LadderTable;
import picocli.CommandLine.Option;

/**
 * The ladder description on the command line: {@code --ladder FILE} (a TOML file with a {@code [ladder]}
 * table) and one option per key of that table, which overrides the file. The bit depth is the core option
 * {@code --bits} of each command, passed in. Shared by every command that models a ladder.
 */
@Section(Heading.LADDER)
public final class LadderOptions implements LadderDescription {
    @Option(names = "--ladder", paramLabel = "FILE",
            description = "Read the ladder from the [ladder] table of this TOML file; the options below"
                    + " override its keys.")
    Path ladderFile;

    @Option(names = "--topology", paramLabel = "weighted|r2r|custom", completionCandidates = Choices.Topologies.class,
            description = "Network: binary-weighted summing, R-2R, or your own per-bit values (default weighted).")
    String topology;

    @Option(names = "--resistors", split = ",", paramLabel = "R",
            description = "Per-bit resistors, bit 0 (LSB) first, e.g. 100k,47k,24k,12k (weighted, custom).")
    List<String> resistors;

    @Option(names = "--base-r", paramLabel = "<ohms>",
            description = "MSB resistor of a derived weighted ladder, or R of an R-2R ladder (default 10k).")
    String baseR;

    @Option(names = "--series", paramLabel = "E6..E192", completionCandidates = Choices.Series.class,
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

    /** A command's {@code --bits} checked against 1..16 where the option is known; 0 when not given. */
    static int bitsOrZero(Integer bits) {
        if (bits == null) {
            return 0;
        }
        if (bits < 1 || bits > 16) {
            throw new InputError("--bits: bit depth must be 1..16, got " + bits);
        }
        return bits;
    }

    /** The options as a ladder description: the file, with the options given on top. */
    private LadderOverrides description() {
        Map<String, String> values = new LinkedHashMap<>();
        put(values, "topology", topology);
        put(values, "base_r", baseR);
        put(values, "series", series);
        put(values, "tolerance", tolerance);
        put(values, "logic_high", logicHigh);
        put(values, "logic_low", logicLow);
        put(values, "pin_r_high", pinRHigh);
        put(values, "pin_r_low", pinRLow);
        put(values, "load", load);
        put(values, "buffer.gain", bufferGain);
        put(values, "buffer.out_min", outMin);
        put(values, "buffer.out_max", outMax);
        return new LadderOverrides(Optional.ofNullable(ladderFile), values, Optional.ofNullable(resistors),
                LadderOptions::optionOf);
    }

    private static void put(Map<String, String> m, String key, String value) {
        if (value != null) {
            m.put(key, value);
        }
    }

    /** The option that sets a ladder key: {@code base_r} is {@code --base-r}, {@code buffer.out_min} --out-min. */
    private static String optionOf(String key) {
        return key.equals("buffer.gain") ? "--buffer-gain"
                : "--" + key.substring(key.indexOf('.') + 1).replace('_', '-');
    }

    @Override
    public boolean given() {
        return description().given();
    }

    @Override
    public boolean statesBits() {
        return description().statesBits();
    }

    @Override
    public LadderSpec spec(int bitsOrZero) {
        return description().spec(bitsOrZero);
    }

    @Override
    public LadderDescription over(LadderTable base) {
        return description().over(base);
    }
}
