package org.rungtone.cli;

import java.util.EnumMap;
import java.util.Map;
import org.rungtone.internal.Setting;

/**
 * The command-line option of every setting key, so that an error raised by a stage about {@code quantize.rate}
 * reads {@code --rate} to a user who typed it on the command line.
 */
final class OptionNames {
    private static final Map<Setting, String> NAMES = names();

    private OptionNames() {
    }

    /** The option that sets {@code s} ({@code --rate}), or the source parameter's label. */
    static String of(Setting s) {
        return NAMES.get(s);
    }

    private static Map<Setting, String> names() {
        Map<Setting, String> m = new EnumMap<>(Setting.class);
        for (Setting s : Setting.values()) {
            m.put(s, "--" + s.key().substring(s.key().indexOf('.') + 1).replace('_', '-'));
        }
        // where the option's name is not the key's last part
        m.put(Setting.SOURCE, "SOURCE");
        m.put(Setting.FAMILY, "--target");
        m.put(Setting.PREVIEW_RATE, "--preview-rate");
        m.put(Setting.PREVIEW_LENGTH, "--preview-length");
        m.put(Setting.FLASH_ATTR, "--flash-attr");
        return m;
    }
}
