package org.rungtone.firmware;

import com.samskivert.mustache.Escapers;
import com.samskivert.mustache.Mustache;
import com.samskivert.mustache.MustacheException;
import com.samskivert.mustache.Template;
import java.io.IOException;
import java.io.InputStream;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;

/**
 * Finds and renders the logic-free C templates: from the jar's {@code templates/} folder, or from a user's
 * folder given explicitly ({@link Setting#TEMPLATES}; same layout: one folder per target family). Rendering
 * uses JMustache with no escaping (the output is C, not HTML) and fails on missing values.
 */
public final class Templates {
    /** Marks a streamed value in rendered text; a control character no template or value contains. */
    private static final char MARK = '\u0001';

    private final Optional<Path> userDir;
    private final Mustache.Compiler compiler;
    /** Compiled templates by family/name; partials are cached inside them once first used. */
    private final Map<String, Template> compiled = new ConcurrentHashMap<>();

    private Templates(Optional<Path> userDir) {
        this.userDir = userDir;
        // Partials ({{> common/engine_clip.c}}) resolve against the same root as the templates themselves.
        this.compiler = Mustache.compiler()
                .withEscaper(Escapers.NONE)
                .strictSections(false)
                .defaultValue(null)
                .withLoader(partial -> new StringReader(loadPath(partial + ".mustache")));
    }

    /** The templates bundled with Rungtone. */
    public static Templates bundled() {
        return Bundled.INSTANCE;
    }

    /**
     * Templates from a user folder.
     *
     * @throws InputError when the folder does not exist
     */
    public static Templates fromFolder(Path dir) {
        if (!Files.isDirectory(dir)) {
            throw Refusal.of(Setting.TEMPLATES, "%s: %s folder does not exist", dir, Setting.TEMPLATES.ref());
        }
        return new Templates(Optional.of(dir));
    }

    /** True when {@code family/name} exists. */
    public boolean exists(String family, String name) {
        if (userDir.isPresent()) {
            return Files.isRegularFile(userDir.get().resolve(family).resolve(name));
        }
        return Templates.class.getClassLoader().getResource("templates/" + family + "/" + name) != null;
    }

    /**
     * A long value (a sample array's text) written straight to the output file instead of being built as one
     * string: {@link #prepare} renders the template with a marker in its place, {@link Output#writeTo} streams
     * the value there.
     */
    @FunctionalInterface
    public interface Streamed {
        /** Writes the value's UTF-8 text to {@code out}. */
        void writeTo(java.io.OutputStream out) throws IOException;
    }

    /**
     * Renders {@code family/name} now, with a marker where each {@link Streamed} value goes: every template
     * error surfaces here, before anything is written, and the long values are written only by
     * {@link Output#writeTo}.
     *
     * @throws InputError when the template is missing or refers to a value that is not there
     */
    public Output prepare(String family, String name, Map<?, ?> context) {
        Map<Object, Object> marked = new java.util.LinkedHashMap<>();
        Map<String, Streamed> streams = new java.util.HashMap<>();
        for (Map.Entry<?, ?> e : context.entrySet()) {
            if (e.getValue() instanceof Streamed st) {
                String marker = MARK + Integer.toString(streams.size()) + MARK;
                streams.put(marker, st);
                marked.put(e.getKey(), marker);
            } else {
                marked.put(e.getKey(), e.getValue());
            }
        }
        return new Output(execute(family, name, marked), streams);
    }

    /** A rendered template whose {@link Streamed} values are written when it is. */
    public static final class Output {
        private final String text;
        private final Map<String, Streamed> streams;

        private Output(String text, Map<String, Streamed> streams) {
            this.text = text;
            this.streams = Map.copyOf(streams);
        }

        /** Writes the whole text as UTF-8, streaming the long values in their places. */
        public void writeTo(java.io.OutputStream out) throws IOException {
            int at = 0;
            while (true) {
                int open = text.indexOf(MARK, at);
                int close = open < 0 ? -1 : text.indexOf(MARK, open + 1);
                if (close < 0) {
                    out.write(text.substring(at).getBytes(StandardCharsets.UTF_8));
                    return;
                }
                out.write(text.substring(at, open).getBytes(StandardCharsets.UTF_8));
                streams.get(text.substring(open, close + 1)).writeTo(out);
                at = close + 1;
            }
        }

        /** The whole text as one string (for tests and small files). */
        public String text() {
            if (streams.isEmpty()) {
                return text;
            }
            java.io.ByteArrayOutputStream out = new java.io.ByteArrayOutputStream();
            try {
                writeTo(out);
            } catch (IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
            return out.toString(StandardCharsets.UTF_8);
        }
    }

    private String execute(String family, String name, Object context) {
        try {
            return compiled.computeIfAbsent(family + "/" + name, k -> compiler.compile(load(family, name)))
                    .execute(context);
        } catch (MustacheException e) {
            throw new InputError("template " + family + "/" + name + ": " + e.getMessage(), e);
        }
    }

    private String load(String family, String name) {
        return loadPath(family + "/" + name);
    }

    private String loadPath(String relative) {
        try {
            if (userDir.isPresent()) {
                Path p = userDir.get().resolve(relative);
                if (!Files.isRegularFile(p)) {
                    throw Refusal.of(Setting.TEMPLATES, "%s: template not found in %s folder (copy the bundled"
                            + " templates folder and edit it)", p, Setting.TEMPLATES.ref());
                }
                return Files.readString(p, StandardCharsets.UTF_8);
            }
            try (InputStream in = Templates.class.getClassLoader()
                    .getResourceAsStream("templates/" + relative)) {
                if (in == null) {
                    throw new InputError("no bundled template " + relative);
                }
                return new String(in.readAllBytes(), StandardCharsets.UTF_8);
            }
        } catch (IOException e) {
            throw new InputError("cannot read template " + relative + ": " + e.getMessage(), e);
        }
    }

    /** The one bundled instance, made on first use, so its compiled templates are shared. */
    private static final class Bundled {
        static final Templates INSTANCE = new Templates(Optional.empty());
    }
}
