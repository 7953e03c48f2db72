package org.rungtone.firmware;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.lang.reflect.ParameterizedType;
import java.lang.reflect.RecordComponent;
import java.lang.reflect.Type;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayDeque;
import java.util.Deque;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.rungtone.internal.AtomicFiles;
import org.rungtone.internal.InputError;
import org.rungtone.quantize.Codes;

/**
 * The templates and the view records agree: every template of every family renders, strictly (a name no view
 * has is an error), over the {@link TemplateMatrix} of families, engines, storage, single and multi-port pin
 * maps, with and without a sweep button, and every timer; and {@code templates/README.md} documents exactly
 * the names the views expose.
 */
class TemplateKeysTest {
    private static final Pattern VIEW_HEADING = Pattern.compile("^### `(\\w+)`");
    private static final Pattern KEY_ROW = Pattern.compile("^\\| `(\\w+)` \\|");

    @TempDir
    Path dir;

    static Stream<Arguments> cases() {
        return Stream.of(TargetFamily.values()).flatMap(f -> TemplateMatrix.cases(f).stream()
                .map(c -> Arguments.of(f.folder(), c.name(), c.engine(), c.request())));
    }

    @ParameterizedTest(name = "{0} {1} {2}")
    @MethodSource("cases")
    void everyPlayerTemplateResolvesEveryName(String family, String name, String engine, FirmwareRequest request) {
        // a name that does not resolve throws here (InputError naming the template and line)
        Map<String, String> files = FirmwareEmitter.render(request).files();
        assertEquals(List.of(name + ".h", name + ".c", name + "_data.c"), List.copyOf(files.keySet()));
        files.forEach((file, text) -> assertFalse(text.contains("{{"), file + " kept a tag"));
    }

    @Test
    void theMatrixCoversEveryEngineButtonAndTimer() {
        for (TargetFamily f : TargetFamily.values()) {
            Set<String> engines = new TreeSet<>();
            Set<TimerKind> timers = new TreeSet<>();
            for (TemplateMatrix.Case c : TemplateMatrix.cases(f)) {
                engines.add(c.engine());
                c.request().timer().ifPresent(timers::add);
            }
            assertEquals(Set.of("button", "clip", "dds", "loop", "record", "sweep"), engines, f.folder());
            assertTrue(timers.containsAll(f.timers()), f.folder() + " " + timers);
        }
    }

    @Test
    void theSampleArrayTemplatesResolveEveryName() throws IOException {
        for (int bits : new int[] {4, 8, 12}) {
            for (String flash : List.of("", "PROGMEM")) {
                Codes codes = Codes.of(bits, 8000, new int[] {0, 1, (1 << bits) - 1});
                Path out = dir.resolve(bits + flash);
                new SampleArrayEmitter(Templates.bundled()).emit(new SampleArrayEmitter.Request("s", codes, flash,
                        "test", List.of("bits: " + bits)), out);
                assertFalse(Files.readString(out.resolve("s.h")).contains("{{"));
                assertTrue(Files.readString(out.resolve("s.c")).contains("s_samples[S_LENGTH] S_FLASH = {"));
            }
        }
    }

    @Test
    void aNameNoViewHasStopsTheBuild() {
        assertEquals("template pic/player.c.mustache: No method or field with name 'timer.reloads' on line 2",
                userTemplateError("/* {{symbol}} */\n{{timer.reloads}}\n"));
        assertEquals("template pic/player.c.mustache: No method or field with name 'hasSamples' on line 1",
                userTemplateError("{{#hasSamples}}x{{/hasSamples}}\n"));
        // a view that is null is a false section, but not a value
        assertEquals("template pic/player.c.mustache: No key, method or field with name 'target.avr.vector' on"
                + " line 1", userTemplateError("{{^target.avr}}generic{{/target.avr}}{{target.avr.vector}}\n"));
    }

    private String userTemplateError(String playerC) {
        Path t = dir.resolve("templates");
        AtomicFiles.writeString(t.resolve("pic").resolve("player.h.mustache"), "/* {{file.name}} */\n");
        AtomicFiles.writeString(t.resolve("pic").resolve("data.c.mustache"), "/* {{file.name}} */\n");
        AtomicFiles.writeString(t.resolve("pic").resolve("player.c.mustache"), playerC);
        FirmwareRequest r = FirmwareRequest.builder().family("pic").templates(Templates.fromFolder(t)).name("x")
                .pins("PB0-PB3").sound("s", Codes.of(4, 8000, new int[] {1, 2})).build();
        return assertThrows(InputError.class, () -> FirmwareEmitter.render(r)).getMessage();
    }

    @Test
    void theReadmeDocumentsExactlyTheNamesOfEveryView() throws IOException {
        Map<String, Set<String>> views = new TreeMap<>();
        collect(PlayerView.class, views);
        collect(SampleArrayView.class, views);
        assertEquals(views, documented(Files.readAllLines(Path.of("templates", "README.md"))));
    }

    /** Every record reachable from {@code root} through components and lists, by simple name. */
    private static void collect(Class<?> root, Map<String, Set<String>> out) {
        Deque<Class<?>> todo = new ArrayDeque<>(List.of(root));
        while (!todo.isEmpty()) {
            Class<?> view = todo.pop();
            Set<String> names = new TreeSet<>();
            for (RecordComponent c : view.getRecordComponents()) {
                names.add(c.getName());
                Type t = c.getGenericType();
                Class<?> type = c.getType();
                if (t instanceof ParameterizedType pt && pt.getActualTypeArguments()[0] instanceof Class<?> e) {
                    type = e;
                }
                if (type.isRecord() && !out.containsKey(type.getSimpleName())) {
                    todo.push(type);
                }
            }
            Set<String> before = out.put(view.getSimpleName(), names);
            assertTrue(before == null || before.equals(names), "two views named " + view.getSimpleName());
        }
    }

    /** The README's key tables: each "### `View`" heading and the "| `key` |" rows under it. */
    private static Map<String, Set<String>> documented(List<String> lines) {
        Map<String, Set<String>> out = new TreeMap<>();
        Set<String> current = null;
        for (String line : lines) {
            Matcher h = VIEW_HEADING.matcher(line);
            if (h.find()) {
                current = new TreeSet<>();
                assertTrue(out.put(h.group(1), current) == null, "documented twice: " + h.group(1));
            } else if (line.startsWith("#")) {
                current = null;
            } else {
                Matcher k = KEY_ROW.matcher(line);
                if (k.find() && current != null) {
                    assertTrue(current.add(k.group(1)), "key documented twice: " + k.group(1));
                }
            }
        }
        return out;
    }
}
