package org.rungtone.firmware;

import java.util.Locale;
import org.rungtone.internal.Setting;
import org.rungtone.internal.SettingError;

/**
 * Errors about a setting whose message does not open with the setting's name ("sounds 'a' and 'b' differ in
 * sample rate; resample them to one {@code {quantize.rate}}"). Messages that do open with it use
 * {@link Setting#error}; both name settings only through {@link Setting#ref()}.
 */
final class Refusal {
    private Refusal() {
    }

    /** An error about {@code setting} whose whole text is {@code format} filled with {@code args}. */
    static SettingError of(Setting setting, String format, Object... args) {
        return new SettingError(setting, String.format(Locale.ROOT, format, args), null);
    }

    /** Throws {@link #of} when {@code condition} is false. */
    static void check(Setting setting, boolean condition, String format, Object... args) {
        if (!condition) {
            throw of(setting, format, args);
        }
    }
}
