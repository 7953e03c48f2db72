package org.rungtone.report;

import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;

/**
 * One effective setting of a project build: its value, where the value came from, and how the text report
 * shows it ("6  (board)"). The JSON report gives the value and the origin as fields of their own.
 *
 * @param value the value: a number, a string, a boolean or a path
 * @param origin where the value came from
 * @param text the value as the text report shows it
 * @param showsOrigin true when the text report adds the origin in brackets
 * @param inText false for a setting only the JSON report lists (the text shows it inside another's text)
 */
public record ProjectSetting(Object value, Origin origin, String text, boolean showsOrigin, boolean inText) {
    /** Where a setting's value came from. */
    public enum Origin {
        /** An option on the command line. */
        COMMAND_LINE("command line"),
        /** The project file. */
        PROJECT_FILE("project file"),
        /** Rungtone's default. */
        DEFAULT("default"),
        /** The board: the ladder description or the unit profile. */
        BOARD("board");

        private final String words;

        Origin(String words) {
            this.words = words;
        }

        /** As the text report writes it: "command line". */
        public String words() {
            return words;
        }

        /** As the JSON report writes it: "command_line". */
        public String key() {
            return name().toLowerCase(Locale.ROOT);
        }

        /** The command line's value over the project file's over the default. */
        public static Origin of(boolean commandLine, boolean projectFile) {
            return commandLine ? COMMAND_LINE : projectFile ? PROJECT_FILE : DEFAULT;
        }
    }

    /** A setting the text report shows as "TEXT  (origin)". */
    public static ProjectSetting shown(Object value, String text, Origin origin) {
        return new ProjectSetting(value, origin, text, true, true);
    }

    /** A setting the text report shows as its text alone. */
    public static ProjectSetting plain(Object value, String text, Origin origin) {
        return new ProjectSetting(value, origin, text, false, true);
    }

    /** A setting only the JSON report lists. */
    public static ProjectSetting jsonOnly(Object value, Origin origin) {
        return new ProjectSetting(value, origin, String.valueOf(value), false, false);
    }

    /** The setting as the text report shows it. */
    public String shownText() {
        return showsOrigin ? text + "  (" + origin.words() + ")" : text;
    }

    /** The settings the text report shows, key to text, in order. */
    public static Map<String, String> texts(Map<String, ProjectSetting> settings) {
        Map<String, String> m = new LinkedHashMap<>();
        settings.forEach((k, v) -> {
            if (v.inText()) {
                m.put(k, v.shownText());
            }
        });
        return m;
    }
}
