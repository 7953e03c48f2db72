package org.rungtone.report;

import com.google.gson.Gson;
import com.google.gson.GsonBuilder;
import com.google.gson.JsonElement;
import com.google.gson.JsonPrimitive;
import com.google.gson.JsonSerializer;
import java.nio.file.Path;
import org.rungtone.internal.AtomicFiles;

/**
 * JSON for machines: records and insertion-ordered maps serialised with stable field names, two-space
 * indentation and {@code \n} line endings. Non-finite numbers become strings ("inf", "-inf", "nan") so the
 * output stays valid JSON.
 */
public final class Json {
    private static final Gson GSON = new GsonBuilder()
            .setPrettyPrinting()
            .disableHtmlEscaping()
            .serializeSpecialFloatingPointValues()
            .registerTypeAdapter(Double.class, (JsonSerializer<Double>) (v, t, c) -> number(v))
            .registerTypeAdapter(double.class, (JsonSerializer<Double>) (v, t, c) -> number(v))
            .create();

    private Json() {
    }

    private static JsonElement number(Double v) {
        if (v.isNaN()) {
            return new JsonPrimitive("nan");
        }
        if (v.isInfinite()) {
            return new JsonPrimitive(v > 0 ? "inf" : "-inf");
        }
        return new JsonPrimitive(v);
    }

    /** Serialises a value (records, maps, lists, numbers, strings). */
    public static String toJson(Object value) {
        return GSON.toJson(value) + "\n";
    }

    /** Writes a value as JSON atomically. */
    public static void write(Path file, Object value) {
        AtomicFiles.writeString(file, toJson(value));
    }
}
