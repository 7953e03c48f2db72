package org.rungtone.firmware;

import java.util.Locale;
import java.util.Optional;
import org.rungtone.codec.TreadFormat;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;

/**
 * How codes are laid out in flash: one {@code uint8_t} (N &lt;= 8) or {@code uint16_t} (N &gt; 8) per
 * sample, a packed LSB-first bit stream of exactly N bits per sample (see {@link SamplePacking}), or a Tread
 * stream of 2, 3 or 4 bits per sample that the player decodes to N-bit codes in its tick
 * ({@link TreadFormat}, {@code docs/tread.md}).
 */
public enum SampleStorage {
    /** One byte or one 16-bit word per sample; fastest to read. */
    UNPACKED(null),
    /** N bits per sample in a continuous stream; the smallest exact layout. */
    PACKED(null),
    /** Tread, 2 bits per sample. */
    TREAD2(TreadFormat.TREAD2),
    /** Tread, 3 bits per sample. */
    TREAD3(TreadFormat.TREAD3),
    /** Tread, 4 bits per sample. */
    TREAD4(TreadFormat.TREAD4);

    private final TreadFormat codec;

    SampleStorage(TreadFormat codec) {
        this.codec = codec;
    }

    /** The option spelling: {@code unpacked}, {@code packed}, {@code tread2}, {@code tread3}, {@code tread4}. */
    public String optionName() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** The Tread format, for the compressed stores. */
    public Optional<TreadFormat> codec() {
        return Optional.ofNullable(codec);
    }

    /** Flash bytes of the sample array for {@code samples} codes of {@code bits} bits (a Tread stream alone). */
    public long bytes(long samples, int bits) {
        if (codec != null) {
            return codec.streamBytes(samples);
        }
        return this == PACKED ? SamplePacking.packedBytes(samples, bits) : samples * (bits <= 8 ? 1 : 2);
    }

    /**
     * A short description for reports: {@code 6-bit packed}, {@code uint8_t per sample} or {@code tread3 (3 bits
     * per sample, decoded to 6-bit codes)}.
     */
    public String describe(int bits) {
        if (codec != null) {
            return optionName() + " (" + codec.codeBits() + " bits per sample, decoded to " + bits + "-bit codes)";
        }
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
        throw Setting.STORAGE.error("'%s' is unknown; use unpacked, packed, tread2, tread3 or tread4", text);
    }
}
