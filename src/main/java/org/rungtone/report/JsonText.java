package org.rungtone.report;

import java.util.Arrays;
import java.util.Collection;
import java.util.Locale;
import java.util.Map;

/**
 * Writes a tree of maps (string keys, insertion order), collections, strings, booleans, whole numbers,
 * doubles and arrays of doubles or ints as JSON in exactly the layout {@link Json} prints through Gson
 * (two-space indentation, {@code "key": value}, {@code {}} and {@code []} when empty, a number that is not
 * finite as {@code null}, the same string escapes), without Gson's reflective set-up, which costs a cold run
 * tens of milliseconds: a report made only of such values, as every report's tree is, is printed here;
 * anything else is left to Gson ({@link #writable}).
 */
final class JsonText {
    private static final String INDENT = "  ";

    private final StringBuilder out = new StringBuilder(4096);

    private JsonText() {
    }

    /** True when every value in the tree is one this writer prints as Gson would. */
    static boolean writable(Object value) {
        if (value == null || value instanceof String || value instanceof Boolean || value instanceof Integer
                || value instanceof Long || value instanceof Double || value instanceof double[]
                || value instanceof int[]) {
            return true;
        }
        if (value instanceof Map<?, ?> m) {
            for (Map.Entry<?, ?> e : m.entrySet()) {
                if (!(e.getKey() instanceof String) || !writable(e.getValue())) {
                    return false;
                }
            }
            return true;
        }
        if (value instanceof Collection<?> c) {
            for (Object v : c) {
                if (!writable(v)) {
                    return false;
                }
            }
            return true;
        }
        return false;
    }

    /** The tree as JSON, without a final line end; {@link #writable} must hold for it. */
    static String of(Object value) {
        JsonText t = new JsonText();
        t.value(value, 0);
        return t.out.toString();
    }

    private void value(Object value, int depth) {
        if (value == null) {
            out.append("null");
        } else if (value instanceof String s) {
            string(s);
        } else if (value instanceof Double d) {
            out.append(Double.isFinite(d) ? d.toString() : "null");
        } else if (value instanceof Map<?, ?> m) {
            object(m, depth);
        } else if (value instanceof Collection<?> c) {
            array(c, depth);
        } else if (value instanceof double[] a) {
            array(Arrays.stream(a).boxed().toList(), depth);
        } else if (value instanceof int[] a) {
            array(Arrays.stream(a).boxed().toList(), depth);
        } else {
            out.append(value);
        }
    }

    private void object(Map<?, ?> m, int depth) {
        if (m.isEmpty()) {
            out.append("{}");
            return;
        }
        out.append('{');
        boolean first = true;
        for (Map.Entry<?, ?> e : m.entrySet()) {
            out.append(first ? "" : ",");
            first = false;
            newline(depth + 1);
            string((String) e.getKey());
            out.append(": ");
            value(e.getValue(), depth + 1);
        }
        newline(depth);
        out.append('}');
    }

    private void array(Collection<?> c, int depth) {
        if (c.isEmpty()) {
            out.append("[]");
            return;
        }
        out.append('[');
        boolean first = true;
        for (Object v : c) {
            out.append(first ? "" : ",");
            first = false;
            newline(depth + 1);
            value(v, depth + 1);
        }
        newline(depth);
        out.append(']');
    }

    private void newline(int depth) {
        out.append('\n');
        for (int i = 0; i < depth; i++) {
            out.append(INDENT);
        }
    }

    /** A JSON string with Gson's escapes (HTML escaping off): quote, backslash, control characters, U+2028/9. */
    private void string(String s) {
        out.append('"');
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '"' -> out.append("\\\"");
                case '\\' -> out.append("\\\\");
                case '\t' -> out.append("\\t");
                case '\b' -> out.append("\\b");
                case '\n' -> out.append("\\n");
                case '\r' -> out.append("\\r");
                case '\f' -> out.append("\\f");
                case '\u2028', '\u2029' -> out.append(String.format(Locale.ROOT, "\\u%04x", (int) c));
                default -> {
                    if (c < 0x20) {
                        out.append(String.format(Locale.ROOT, "\\u%04x", (int) c));
                    } else {
                        out.append(c);
                    }
                }
            }
        }
        out.append('"');
    }
}
