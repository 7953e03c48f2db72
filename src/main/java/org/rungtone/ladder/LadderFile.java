package org.rungtone.ladder;

import java.io.IOException;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.rungtone.internal.InputError;
import org.rungtone.internal.TomlText;
import org.rungtone.internal.Units;
import org.tomlj.TomlArray;
import org.tomlj.TomlParseResult;
import org.tomlj.TomlPosition;
import org.tomlj.TomlTable;

/**
 * Reads the {@code [ladder]} table of a TOML file into a {@link LadderSpec.Builder}. Values are strings in
 * schematic notation ({@code "4k7"}, {@code "3.3V"}, {@code "5%"}, {@code "inf"}) or plain numbers in SI
 * units; every error names the file, the line and the key ({@code "board.toml:7: ladder.load: ..."}).
 */
public final class LadderFile {
    /** The keys of the {@code [ladder]} table, in the order documented. */
    public static final List<String> KEYS = List.of("topology", "bits", "resistors", "base_r", "series",
            "tolerance", "logic_high", "logic_low", "pin_r_high", "pin_r_low", "load", "buffer");
    /** The keys of the {@code buffer} table. */
    public static final List<String> BUFFER_KEYS = List.of("gain", "out_min", "out_max");

    private LadderFile() {
    }

    /**
     * Reads every key of the table into a builder without validating the combination; call
     * {@link LadderSpec.Builder#build()} and pass a {@link LadderSpecError} to {@link #locate}.
     *
     * @throws InputError naming file, line and key when a key is unknown or a value malformed
     */
    public static LadderSpec.Builder read(TomlTable table, Path file) {
        LadderSpec.Builder b = LadderSpec.builder();
        for (String key : table.keySet()) {
            if (!KEYS.contains(key)) {
                String hint = key.equals("unit") ? "the R of an r2r ladder is called base_r"
                        : "known keys are " + String.join(", ", KEYS);
                throw error(table, file, key, "unknown key; " + hint);
            }
        }
        if (table.contains("topology")) {
            String name = string(table, file, "topology");
            b.topology(wrap(table, file, "topology", () -> Topology.parse(name)));
        }
        if (table.contains("bits")) {
            Object v = table.get("bits");
            if (!(v instanceof Long)) {
                throw error(table, file, "bits", "expected a whole number of bits, e.g. bits = 8");
            }
            long bits = (Long) v;
            if (bits < 1 || bits > 16) {
                throw error(table, file, "bits", "bit depth must be 1..16, got " + bits);
            }
            b.bits((int) bits);
        }
        if (table.contains("resistors")) {
            b.resistors(resistors(table, file));
        }
        if (table.contains("base_r")) {
            b.baseROhms(quantity(table, file, "base_r", "ohm"));
        }
        if (table.contains("series")) {
            String name = string(table, file, "series");
            b.series(wrap(table, file, "series", () -> ESeries.parse(name)));
        }
        if (table.contains("tolerance")) {
            b.tolerance(percent(table, file, "tolerance"));
        }
        readElectrical(table, file, b);
        return b;
    }

    private static void readElectrical(TomlTable table, Path file, LadderSpec.Builder b) {
        if (table.contains("logic_high")) {
            b.logicHighVolts(quantity(table, file, "logic_high", "V"));
        }
        if (table.contains("logic_low")) {
            b.logicLowVolts(quantity(table, file, "logic_low", "V"));
        }
        if (table.contains("pin_r_high")) {
            b.pinROhmsHigh(quantity(table, file, "pin_r_high", "ohm"));
        }
        if (table.contains("pin_r_low")) {
            b.pinROhmsLow(quantity(table, file, "pin_r_low", "ohm"));
        }
        if (table.contains("load")) {
            b.loadOhms(quantity(table, file, "load", "ohm"));
        }
        if (table.contains("buffer")) {
            if (!table.isTable("buffer")) {
                throw error(table, file, "buffer",
                        "expected a table, e.g. buffer = { gain = 1.0, out_min = \"0V\", out_max = \"5V\" }");
            }
            TomlTable buffer = table.getTable("buffer");
            for (String key : buffer.keySet()) {
                if (!BUFFER_KEYS.contains(key)) {
                    throw error(table, file, "buffer." + key,
                            "unknown key; known keys are " + String.join(", ", BUFFER_KEYS));
                }
            }
            if (buffer.contains("gain")) {
                b.bufferGain(quantity(table, file, "buffer.gain", ""));
            }
            if (buffer.contains("out_min")) {
                b.outMinVolts(quantity(table, file, "buffer.out_min", "V"));
            }
            if (buffer.contains("out_max")) {
                b.outMaxVolts(quantity(table, file, "buffer.out_max", "V"));
            }
        }
    }

    /**
     * Reads a TOML file and returns its {@code [ladder]} table.
     *
     * @throws InputError when the file cannot be read, is not valid TOML or has no {@code [ladder]} table
     */
    public static TomlTable readTable(Path file) {
        String text;
        try {
            text = Files.readString(file, StandardCharsets.UTF_8);
        } catch (NoSuchFileException e) {
            throw new InputError(file + ": no such file", e);
        } catch (CharacterCodingException e) {
            throw new InputError(file + ": is not UTF-8 text; expected a TOML file with a [ladder] table", e);
        } catch (IOException e) {
            throw new InputError(file + ": cannot read (" + e.getMessage() + ")", e);
        }
        TomlParseResult result = TomlText.parse(text, file,
                e -> new InputError(location(file, e.position()) + ": not valid TOML: " + e.getMessage(), e));
        if (!result.isTable("ladder")) {
            throw new InputError(file + ": no [ladder] table; a ladder file holds its keys under [ladder]");
        }
        return result.getTable("ladder");
    }

    /**
     * Turns a validation error of a builder read from {@code table} into one line that names the file and
     * the line of the key at fault.
     */
    public static InputError locate(LadderSpecError e, TomlTable table, Path file) {
        return new InputError(where(table, file, e.key()) + ": " + e.detail(), e);
    }

    private static List<Double> resistors(TomlTable table, Path file) {
        if (!table.isArray("resistors")) {
            throw error(table, file, "resistors", "expected a list, bit 0 (LSB) first, e.g. [\"100k\", \"47k\"]");
        }
        TomlArray array = table.getArray("resistors");
        List<Double> out = new ArrayList<>();
        for (int i = 0; i < array.size(); i++) {
            Object v = array.get(i);
            TomlPosition pos = array.inputPositionOf(i);
            String at = location(file, pos) + ": ladder.resistors: bit " + i + ": ";
            if (v instanceof Number) {
                out.add(((Number) v).doubleValue());
            } else if (v instanceof String) {
                try {
                    out.add(Units.parse((String) v, "ohm"));
                } catch (InputError e) {
                    throw new InputError(at + e.getMessage(), e);
                }
            } else {
                throw new InputError(at + "expected a resistance such as \"4k7\" or 4700");
            }
        }
        return out;
    }

    private static String string(TomlTable table, Path file, String key) {
        Object v = table.get(key);
        if (!(v instanceof String)) {
            throw error(table, file, key, "expected a string in quotes");
        }
        return (String) v;
    }

    private static double quantity(TomlTable table, Path file, String key, String unit) {
        Object v = table.get(key);
        if (v instanceof Number) {
            return ((Number) v).doubleValue();
        }
        if (v instanceof String) {
            return wrap(table, file, key, () -> Units.parse((String) v, unit));
        }
        throw error(table, file, key, "expected a number or a string such as \"" + example(unit) + "\"");
    }

    private static double percent(TomlTable table, Path file, String key) {
        Object v = table.get(key);
        if (!(v instanceof String) || !((String) v).trim().endsWith("%")) {
            throw error(table, file, key, "write it as a percentage in quotes, e.g. \"5%\" or \"0.1%\"");
        }
        return wrap(table, file, key, () -> Units.parse((String) v, "%"));
    }

    private static String example(String unit) {
        switch (unit) {
            case "ohm":
                return "4k7";
            case "V":
                return "3.3V";
            default:
                return "1.0";
        }
    }

    private interface Parse<T> {
        T get();
    }

    private static <T> T wrap(TomlTable table, Path file, String key, Parse<T> parse) {
        try {
            return parse.get();
        } catch (InputError e) {
            throw new InputError(where(table, file, key) + ": " + e.getMessage(), e);
        }
    }

    private static InputError error(TomlTable table, Path file, String key, String detail) {
        return new InputError(where(table, file, key) + ": " + detail);
    }

    /**
     * Where a key sits: {@code "board.toml:7: ladder.key"} with the line of the key, of its parent table, or
     * of the table's first key.
     */
    public static String where(TomlTable table, Path file, String key) {
        TomlPosition pos = TomlText.positionOf(table, key);
        if (pos == null && key.contains(".")) {
            pos = TomlText.positionOf(table, key.substring(0, key.indexOf('.')));
        }
        if (pos == null) {
            for (String k : table.keySet()) {
                TomlPosition p = table.inputPositionOf(List.of(k));
                if (p != null && (pos == null || p.line() < pos.line())) {
                    pos = p;
                }
            }
        }
        return location(file, pos) + ": ladder." + key;
    }

    private static String location(Path file, TomlPosition pos) {
        String name = file == null ? "ladder" : file.toString();
        return pos == null ? name : name + ":" + pos.line();
    }
}
