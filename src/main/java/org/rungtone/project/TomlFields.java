package org.rungtone.project;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;
import org.rungtone.internal.EditDistance;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Units;
import org.tomlj.TomlArray;
import org.tomlj.TomlPosition;
import org.tomlj.TomlTable;

/**
 * Typed, position-aware reading of one TOML table of a project file. Every value read is remembered, so
 * {@link #rejectUnknown()} can name the keys that were never read, with their line and the nearest known key.
 * Errors read {@code FILE:LINE: SECTION.KEY: what is wrong; an example of what is right}.
 */
final class TomlFields {
    private final TomlTable table;
    private final Path file;
    private final String section;
    private final Set<String> known = new LinkedHashSet<>();

    TomlFields(TomlTable table, Path file, String section) {
        this.table = table;
        this.file = file;
        this.section = section;
    }

    Path file() {
        return file;
    }

    TomlTable table() {
        return table;
    }

    String section() {
        return section;
    }

    /** The line of a key, or of the table when the key is absent. */
    int line(String key) {
        TomlPosition p = table.inputPositionOf(List.of(key)); // one key, even a quoted one with dots
        return p == null ? 0 : p.line();
    }

    /**
     * The string at {@code key} read by {@code parse}; a setting's error from it is reported at the key's line.
     */
    <T> Optional<T> parsed(String key, java.util.function.Function<String, T> parse) {
        return string(key).map(text -> {
            try {
                return parse.apply(text);
            } catch (org.rungtone.internal.SettingError e) {
                throw error(key, e.detail(org.rungtone.internal.Setting::key));
            }
        });
    }

    InputError error(String key, String message) {
        int line = line(key);
        return new InputError(file + (line > 0 ? ":" + line : "") + ": " + qualified(key) + ": " + message);
    }

    private String qualified(String key) {
        return section.isEmpty() ? key : section + "." + key;
    }

    boolean has(String key) {
        known.add(key);
        return table.contains(key);
    }

    /** Declares keys that are read elsewhere (for example a sub-table handed to another reader). */
    void declare(String... keys) {
        known.addAll(List.of(keys));
    }

    Optional<String> string(String key) {
        if (!has(key)) {
            return Optional.empty();
        }
        Object v = table.get(key);
        if (!(v instanceof String s)) {
            throw error(key, "expected a string in quotes, got " + describe(v));
        }
        return Optional.of(s);
    }

    /** A string that must be one of {@code choices} (case-insensitive); returned in lower case. */
    Optional<String> choice(String key, String... choices) {
        Optional<String> s = string(key);
        if (s.isPresent()) {
            String v = s.get().toLowerCase(Locale.ROOT);
            if (!List.of(choices).contains(v)) {
                throw error(key, "'" + s.get() + "' is not one of " + String.join(", ", choices));
            }
            return Optional.of(v);
        }
        return s;
    }

    Optional<Long> integer(String key, long min, long max) {
        if (!has(key)) {
            return Optional.empty();
        }
        Object v = table.get(key);
        if (!(v instanceof Long n)) {
            throw error(key, "expected a whole number, got " + describe(v));
        }
        if (n < min || n > max) {
            throw error(key, "must be " + min + ".." + max + ", got " + n);
        }
        return Optional.of(n);
    }

    Optional<Boolean> bool(String key) {
        if (!has(key)) {
            return Optional.empty();
        }
        Object v = table.get(key);
        if (!(v instanceof Boolean b)) {
            throw error(key, "expected true or false, got " + describe(v));
        }
        return Optional.of(b);
    }

    /** A quantity written as a number (SI units) or a string with a suffix, e.g. "16k", "250ms", "5V". */
    OptionalDouble quantity(String key, String unit) {
        return number(key, text -> Units.parse(text, unit), "a number or a string like \"16k\"");
    }

    /** A level in dB, written as a number or a string like "-1dB". */
    OptionalDouble decibels(String key) {
        return number(key, Units::parseDecibels, "a level in dB");
    }

    /** A number, or a string read by {@code fromText}; its InputError is placed at the key's line. */
    private OptionalDouble number(String key, java.util.function.ToDoubleFunction<String> fromText,
            String expected) {
        if (!has(key)) {
            return OptionalDouble.empty();
        }
        Object v = table.get(key);
        if (v instanceof Long n) {
            return OptionalDouble.of(n);
        }
        if (v instanceof Double d) {
            return OptionalDouble.of(d);
        }
        if (v instanceof String s) {
            try {
                return OptionalDouble.of(fromText.applyAsDouble(s));
            } catch (InputError e) {
                throw error(key, e.getMessage());
            }
        }
        throw error(key, "expected " + expected + ", got " + describe(v));
    }

    Optional<TomlFields> table(String key) {
        if (!has(key)) {
            return Optional.empty();
        }
        Object v = table.get(key);
        if (!(v instanceof TomlTable t)) {
            throw error(key, "expected a table, got " + describe(v));
        }
        return Optional.of(new TomlFields(t, file, qualified(key)));
    }

    /** An array of tables ({@code [[sound]]}), each with its index in the section name. */
    List<TomlFields> tables(String key) {
        List<TomlFields> out = new ArrayList<>();
        if (!has(key)) {
            return out;
        }
        Object v = table.get(key);
        if (!(v instanceof TomlArray a) || (!a.isEmpty() && !(a.get(0) instanceof TomlTable))) {
            throw error(key, "expected one or more [[" + key + "]] tables");
        }
        for (int i = 0; i < a.size(); i++) {
            out.add(new TomlFields(a.getTable(i), file, qualified(key) + "[" + (i + 1) + "]"));
        }
        return out;
    }

    /** Fails on the first key that was never read, naming its line and the nearest known key. */
    void rejectUnknown() {
        for (String key : table.keySet()) {
            if (!known.contains(key)) {
                String near = nearest(key);
                throw error(key, "unknown key" + (near == null ? "" : "; did you mean '" + near + "'?")
                        + " (known: " + String.join(", ", known) + ")");
            }
        }
    }

    /** The known key nearest to {@code key} (Suggestions.distance), if within max(2, length/3) edits. */
    private String nearest(String key) {
        String best = null;
        int bestD = Integer.MAX_VALUE;
        for (String k : known) {
            int d = EditDistance.of(key, k);
            if (d < bestD) {
                bestD = d;
                best = k;
            }
        }
        return bestD <= Math.max(2, key.length() / 3) ? best : null;
    }

    static String describe(Object v) {
        if (v instanceof String s) {
            return "the string \"" + s + "\"";
        }
        if (v instanceof Long || v instanceof Double) {
            return "the number " + v;
        }
        if (v instanceof Boolean) {
            return v.toString();
        }
        if (v instanceof TomlTable) {
            return "a table";
        }
        if (v instanceof TomlArray) {
            return "an array";
        }
        return v == null ? "nothing" : "a " + v.getClass().getSimpleName();
    }
}
