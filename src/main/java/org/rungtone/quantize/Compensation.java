package org.rungtone.quantize;

import java.util.Locale;
import org.rungtone.internal.Setting;

/**
 * With a board whose real levels are known: quantize onto those levels ({@link #ON}) or emit the plain binary
 * codes of the ideal ladder ({@link #OFF}).
 */
public enum Compensation {
    /** Quantize onto the board's real levels. */
    ON,
    /** Plain binary codes. */
    OFF;

    /** True for {@link #ON}. */
    public boolean on() {
        return this == ON;
    }

    /** {@code on} or {@code off}. */
    public String key() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** The setting for a boolean. */
    public static Compensation of(boolean on) {
        return on ? ON : OFF;
    }

    /**
     * Reads on/off (also true/false, yes/no), case-insensitive.
     *
     * @throws org.rungtone.internal.SettingError for anything else
     */
    public static Compensation parse(String text) {
        switch (text.trim().toLowerCase(Locale.ROOT)) {
            case "on":
            case "true":
            case "yes":
                return ON;
            case "off":
            case "false":
            case "no":
                return OFF;
            default:
                throw Setting.COMPENSATION.error("must be on or off: %s", text);
        }
    }
}
