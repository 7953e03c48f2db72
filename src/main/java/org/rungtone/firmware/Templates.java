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
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;

/**
 * Finds and renders the logic-free C templates: from the jar's {@code templates/} folder, or from a user's
 * folder given explicitly ({@link Setting#TEMPLATES}; same layout: one folder per target family). Rendering
 * uses JMustache with no escaping (the output is C, not HTML) and is strict: a value, a section or a part of
 * a dotted name ({@code {{timer.reload}}}) that the context does not have is an error, not an empty string.
 * The contexts are view records ({@link PlayerView}, {@link SampleArrayView}); JMustache reads a record's
 * components through their accessors.
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
                .strictSections(true)
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

    /** Writes a long value's UTF-8 text (a sample array's body) to a file's stream. */
    @FunctionalInterface
    public interface Streamed {
        /** Writes the value's UTF-8 text to {@code out}. */
        void writeTo(java.io.OutputStream out) throws IOException;
    }

    /**
     * A long value in a template context, written straight to the output file instead of being built as one
     * string: in the rendered text a marker (its {@link #toString()}) holds its place, and
     * {@link Output#writeTo} streams the value there.
     */
    public static final class Stream {
        private static final java.util.concurrent.atomic.AtomicLong NEXT = new java.util.concurrent.atomic.AtomicLong();

        private final String marker = MARK + Long.toString(NEXT.getAndIncrement()) + MARK;
        private final Streamed value;

        private Stream(Streamed value) {
            this.value = value;
        }

        /** The marker that holds the value's place in the rendered text. */
        @Override
        public String toString() {
            return marker;
        }
    }

    /** A context value that {@code value} writes to the file when the rendered template is written. */
    public static Stream stream(Streamed value) {
        return new Stream(java.util.Objects.requireNonNull(value));
    }

    /**
     * Renders {@code family/name} now over {@code context}, with a marker where each of its {@code streams}
     * goes: every template error surfaces here, before anything is written, and the long values are written
     * only by {@link Output#writeTo}.
     *
     * @throws InputError when the template is missing or refers to a value the context does not have
     */
    public Output prepare(String family, String name, Object context, List<Stream> streams) {
        Map<String, Streamed> byMarker = new java.util.HashMap<>();
        for (Stream st : streams) {
            byMarker.put(st.marker, st.value);
        }
        return new Output(execute(family, name, context), byMarker);
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
                Streamed value = streams.get(text.substring(open, close + 1));
                if (value == null) {
                    throw new IllegalStateException("a streamed value was rendered but not handed to prepare");
                }
                value.writeTo(out);
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

    /** The template's text with {@code \n} line endings, whatever a checkout or an editor gave it. */
    private String loadPath(String relative) {
        return readPath(relative).replace("\r\n", "\n");
    }

    private String readPath(String relative) {
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
