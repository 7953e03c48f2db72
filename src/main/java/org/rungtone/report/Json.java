package org.rungtone.report;

import com.google.gson.Gson;
import com.google.gson.GsonBuilder;
import com.google.gson.JsonElement;
import com.google.gson.JsonNull;
import com.google.gson.JsonPrimitive;
import com.google.gson.JsonSerializer;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import java.util.OptionalLong;
import org.rungtone.internal.AtomicFiles;

/**
 * JSON for machines: records and insertion-ordered maps serialised with stable field names, two-space
 * indentation and {@code \n} line endings. Every report starts with {@link #header}; numbers are always JSON
 * numbers, and one that is not finite (an open-circuit load, the SINAD of an error-free signal) is
 * {@code null}; paths are relative to the report's output folder ({@link #path}). The fields of every report
 * are documented in {@code docs/json.md} and checked by the JSON Schemas in {@code docs/schema/}.
 */
public final class Json {
    /**
     * The version of the reports' layout, in every report's {@code schema_version}: 1 was the layout before
     * it was versioned, 2 the one with origins, firmware facts and relative paths as fields. It goes up
     * whenever a field is renamed, removed or changes its type.
     */
    public static final int SCHEMA_VERSION = 2;

    private Json() {
    }

    /**
     * Serialises a value (records, maps, lists, numbers, strings). A tree of maps, lists, strings and numbers
     * is printed by {@link JsonText}, in Gson's layout without Gson's start-up; anything else by Gson.
     */
    public static String toJson(Object value) {
        if (JsonText.writable(value)) {
            return JsonText.of(value) + "\n";
        }
        return viaGson(value);
    }

    /** Serialises a value through Gson, whatever it is. */
    static String viaGson(Object value) {
        return Reflective.GSON.toJson(value) + "\n";
    }

    /** Gson, set up on first use. */
    private static final class Reflective {
        static final Gson GSON = new GsonBuilder()
                .setPrettyPrinting()
                .disableHtmlEscaping()
                .serializeNulls()
                .registerTypeAdapter(Double.class, (JsonSerializer<Double>) (v, t, c) -> number(v))
                .registerTypeAdapter(double.class, (JsonSerializer<Double>) (v, t, c) -> number(v))
                .create();

        private static JsonElement number(Double v) {
            return Double.isFinite(v) ? new JsonPrimitive(v) : JsonNull.INSTANCE;
        }
    }

    /** Writes a value as JSON atomically. */
    public static void write(Path file, Object value) {
        AtomicFiles.writeString(file, toJson(value));
    }

    /**
     * The first fields of every report: {@code schema_version}, {@code report} (which report this is, named
     * as its schema file {@code docs/schema/REPORT.schema.json}), {@code tool} and {@code version}.
     */
    static Map<String, Object> header(String report, String toolVersion) {
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("schema_version", SCHEMA_VERSION);
        m.put("report", report);
        m.put("tool", "rungtone");
        m.put("version", toolVersion);
        return m;
    }

    /**
     * A path relative to the output folder {@code base}, with {@code /} between names ({@code .} for the
     * folder itself); an absolute path when the two share no root.
     */
    static String path(Path p, Path base) {
        Path target = p.toAbsolutePath().normalize();
        Path from = base.toAbsolutePath().normalize();
        if (target.getRoot() == null || !target.getRoot().equals(from.getRoot())) {
            return target.toString();
        }
        Path rel = from.relativize(target);
        List<String> names = new ArrayList<>();
        for (Path n : rel) {
            names.add(n.toString());
        }
        String joined = String.join("/", names);
        return joined.isEmpty() ? "." : joined;
    }

    /** Paths relative to {@code base}. */
    static List<String> paths(List<Path> files, Path base) {
        return files.stream().map(f -> path(f, base)).toList();
    }

    /** A value or {@code null}. */
    static Object orNull(OptionalDouble v) {
        return v.isPresent() ? (Object) v.getAsDouble() : null;
    }

    /** A value or {@code null}. */
    static Object orNull(OptionalInt v) {
        return v.isPresent() ? (Object) v.getAsInt() : null;
    }

    /** A value or {@code null}. */
    static Object orNull(OptionalLong v) {
        return v.isPresent() ? (Object) v.getAsLong() : null;
    }
}
