package org.rungtone.ladder;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;
import java.util.function.Supplier;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Units;

/**
 * A ladder described by keys typed as text (a command line's options) on top of a ladder file, or of a
 * project's {@code [ladder]} table when no file is named. Every error names where its key was typed: the
 * caller's name for the key ({@code --base-r}), or the file and line.
 */
public final class LadderOverrides implements LadderDescription {
    private final Optional<Path> file;
    private final Map<String, String> values;
    private final List<String> resistors;
    private final Function<String, String> nameOf;

    /**
     * Keys on top of a file.
     *
     * @param file the ladder file, when named
     * @param values ladder key ({@code base_r}, {@code buffer.gain}) to its text, for the keys given; the
     *     per-bit resistors are apart
     * @param resistors per-bit resistors as typed, bit 0 first, when given
     * @param nameOf how the user typed a key ({@code --base-r}); also asked for {@code bits}
     */
    public LadderOverrides(Optional<Path> file, Map<String, String> values, Optional<List<String>> resistors,
            Function<String, String> nameOf) {
        this.file = file;
        this.values = new LinkedHashMap<>(values);
        this.resistors = resistors.map(List::copyOf).orElse(null);
        this.nameOf = nameOf;
    }

    @Override
    public boolean given() {
        return file.isPresent() || !values.isEmpty() || resistors != null;
    }

    @Override
    public boolean statesBits() {
        return resistors != null || file.isPresent() && LadderTable.read(file.get()).statesBits();
    }

    @Override
    public LadderSpec spec(int bitsOrZero) {
        return spec(Optional.empty(), bitsOrZero);
    }

    @Override
    public LadderDescription over(LadderTable base) {
        LadderOverrides self = this;
        return new LadderDescription() {
            @Override
            public boolean given() {
                return true;
            }

            @Override
            public boolean statesBits() {
                return self.resistors != null || self.file.map(LadderTable::read).orElse(base).statesBits();
            }

            @Override
            public LadderSpec spec(int bitsOrZero) {
                return self.spec(Optional.of(base), bitsOrZero);
            }
        };
    }

    /**
     * The ladder of the file, else the base table, with the keys on top.
     *
     * @throws InputError naming the key's name, or the file and line, at fault
     */
    private LadderSpec spec(Optional<LadderTable> base, int bitsOrZero) {
        Optional<LadderTable> table = file.isPresent() ? Optional.of(LadderTable.read(file.get())) : base;
        LadderSpec.Builder b = table.map(LadderTable::builder).orElseGet(LadderSpec::builder);
        apply(b);
        if (bitsOrZero != 0) {
            b.bits(bitsOrZero);
        }
        try {
            return b.build();
        } catch (LadderSpecError e) {
            boolean bitsGiven = bitsOrZero != 0;
            if (e.key().equals("bits") && bitsGiven) {
                throw new InputError(nameOf.apply("bits") + ": " + e.detail(), e);
            }
            if (values.containsKey(e.key()) || e.key().equals("resistors") && resistors != null) {
                throw new InputError(nameOf.apply(e.key()) + ": " + e.detail(), e);
            }
            String hint = bitsGiven && e.key().equals("resistors") ? " (bits from " + nameOf.apply("bits") + ")"
                    : "";
            if (table.isPresent()) {
                throw new InputError(table.get().where(e.key()) + ": " + e.detail() + hint, e);
            }
            throw new InputError(e.getMessage() + hint, e);
        }
    }

    private void apply(LadderSpec.Builder b) {
        if (resistors != null) {
            List<Double> ohms = new ArrayList<>();
            for (int i = 0; i < resistors.size(); i++) {
                String text = resistors.get(i);
                String prefix = "bit " + i + ": ";
                ohms.add(parse("resistors", () -> quantity(prefix, text, "ohm")));
            }
            b.resistors(ohms);
        }
        values.forEach((key, text) -> apply(b, key, text));
    }

    private void apply(LadderSpec.Builder b, String key, String text) {
        switch (key) {
            case "topology" -> b.topology(parse(key, () -> Topology.parse(text)));
            case "base_r" -> b.baseROhms(parse(key, () -> Units.parse(text, "ohm")));
            case "series" -> b.series(parse(key, () -> ESeries.parse(text)));
            case "tolerance" -> b.tolerance(parse(key, () -> percent(text)));
            case "logic_high" -> b.logicHighVolts(parse(key, () -> Units.parse(text, "V")));
            case "logic_low" -> b.logicLowVolts(parse(key, () -> Units.parse(text, "V")));
            case "pin_r_high" -> b.pinROhmsHigh(parse(key, () -> Units.parse(text, "ohm")));
            case "pin_r_low" -> b.pinROhmsLow(parse(key, () -> Units.parse(text, "ohm")));
            case "load" -> b.loadOhms(parse(key, () -> Units.parse(text, "ohm")));
            case "buffer.gain" -> b.bufferGain(parse(key, () -> Units.parse(text, "")));
            case "buffer.out_min" -> b.outMinVolts(parse(key, () -> Units.parse(text, "V")));
            case "buffer.out_max" -> b.outMaxVolts(parse(key, () -> Units.parse(text, "V")));
            default -> throw new IllegalArgumentException("not a ladder key: " + key);
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
    private static double percent(String text) {
        if (!text.trim().endsWith("%")) {
            throw new InputError("write it as a percentage, e.g. 5% or 0.1%, got '" + text + "'");
        }
        return Units.parse(text, "%");
    }

    private <T> T parse(String key, Supplier<T> parse) {
        try {
            return parse.get();
        } catch (InputError e) {
            throw new InputError(nameOf.apply(key) + ": " + e.getMessage(), e);
        }
    }
}
