package org.rungtone.testing;

import com.networknt.schema.Error;
import com.networknt.schema.InputFormat;
import com.networknt.schema.Schema;
import com.networknt.schema.SchemaLocation;
import com.networknt.schema.SchemaRegistry;
import com.networknt.schema.SpecificationVersion;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

/**
 * The JSON Schemas of docs/schema/ (draft 2020-12), checked with networknt's json-schema-validator. The schemas
 * are served from the folder under a base IRI that is never fetched, so their relative {@code $ref}s to
 * {@code common.schema.json} resolve offline.
 */
public final class JsonSchemas {
    /** Where the schemas live. */
    public static final Path FOLDER = Path.of("docs", "schema");
    private static final String BASE = "https://rungtone.invalid/schema/";
    private static final SchemaRegistry REGISTRY = SchemaRegistry.withDefaultDialect(
            SpecificationVersion.DRAFT_2020_12, b -> b.schemas(JsonSchemas::text));
    private static final Map<String, Schema> LOADED = new ConcurrentHashMap<>();

    private JsonSchemas() {
    }

    private static String text(String iri) {
        if (!iri.startsWith(BASE)) {
            return null;
        }
        try {
            return Files.readString(FOLDER.resolve(iri.substring(BASE.length())));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** The schema of one report, e.g. {@code build} for docs/schema/build.schema.json. */
    public static Schema of(String report) {
        return LOADED.computeIfAbsent(report, r -> REGISTRY.getSchema(SchemaLocation.of(BASE + r
                + ".schema.json")));
    }

    /** What is wrong with {@code json} against the schema of {@code report}, one line each; empty when valid. */
    public static List<String> problems(String report, String json) {
        return of(report).validate(json, InputFormat.JSON).stream().map(Error::toString).toList();
    }
}
