package org.rungtone.firmware;

import java.util.Locale;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;

/**
 * How codes are laid out in flash: one {@code uint8_t} (N &lt;= 8) or {@code uint16_t} (N &gt; 8) per
 * sample, or a packed LSB-first bit stream of exactly N bits per sample (see {@link SamplePacking}).
 */
public enum SampleStorage {
    /** One byte or one 16-bit word per sample; fastest to read. */
    UNPACKED,
    /** N bits per sample in a continuous stream; smallest. */
    PACKED;

    /** The option spelling: {@code unpacked} or {@code packed}. */
    public String optionName() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** Flash bytes for {@code samples} codes of {@code bits} bits. */
    public long bytes(long samples, int bits) {
        return this == PACKED ? SamplePacking.packedBytes(samples, bits) : samples * (bits <= 8 ? 1 : 2);
    }

    /** A short description for reports: {@code 6-bit packed} or {@code uint8_t per sample}. */
    public String describe(int bits) {
        return this == PACKED ? bits + "-bit packed" : (bits <= 8 ? "uint8_t" : "uint16_t") + " per sample";
    }

    /**
     * Parses the option spelling.
     *
     * @throws InputError when the text names no layout
     */
    public static SampleStorage parse(String text) {
        for (SampleStorage s : values()) {
            if (s.optionName().equalsIgnoreCase(text == null ? "" : text.trim())) {
                return s;
            }
        }
        throw Setting.STORAGE.error("'%s' is unknown; use unpacked or packed", text);
    }
}
