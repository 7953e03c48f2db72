package org.rungtone.internal;

import java.util.List;
import java.util.Objects;

/**
 * One warning a stage collects for the user: its kind, so code can tell warnings apart without reading their
 * text, and the one-line text the user sees.
 *
 * @param kind what the warning is about
 * @param text the line shown to the user
 */
public record Warning(Kind kind, String text) {
    /** What a warning is about. */
    public enum Kind {
        /** The transfer has inverted steps: a higher code gives a lower level. */
        NOT_MONOTONIC,
        /** A pin sources or sinks more than the stated current limit. */
        PIN_CURRENT,
        /** A sound was cut short to fit the flash budget (an automatic loop keeps its attack and one loop). */
        SOUND_SHORTENED,
        /** Anything without a kind of its own. */
        OTHER
    }

    /** Checks that both parts are given. */
    public Warning {
        Objects.requireNonNull(kind, "kind");
        Objects.requireNonNull(text, "text");
    }

    /** A warning of kind {@link Kind#OTHER}. */
    public static Warning other(String text) {
        return new Warning(Kind.OTHER, text);
    }

    /** The texts of {@code warnings}, in order. */
    public static List<String> texts(List<Warning> warnings) {
        return warnings.stream().map(Warning::text).toList();
    }

    /** True when this warning is of {@code kind}. */
    public boolean is(Kind kind) {
        return this.kind == kind;
    }
}
