package org.rungtone.firmware;

import java.util.Locale;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;

/**
 * How the emitted code turns a DAC code into port values.
 *
 * <ul>
 *   <li>{@link #SHIFT}: one mask and one shift per port; possible when, on every port, each pin sits the
 *       same distance from its code bit (for example contiguous ascending pins such as {@code PB0-PB5}).</li>
 *   <li>{@link #TABLE}: a lookup table of 2^N port values per port, read from flash: constant time for any
 *       assignment.</li>
 *   <li>{@link #SCATTER}: masks and shifts, one per group of bits that keep the same distance to their
 *       pins; no table, a few more instructions.</li>
 * </ul>
 * {@link #AUTO} picks SHIFT when possible, else TABLE up to {@value PinMap#AUTO_TABLE_MAX_BITS} bits, else
 * SCATTER.
 */
public enum PinStrategy {
    /** Chosen from the pin map. */
    AUTO,
    /** One mask and shift per port. */
    SHIFT,
    /** Per-port lookup tables of 2^N entries. */
    TABLE,
    /** Mask-and-shift terms per group of equally displaced bits. */
    SCATTER;

    /** The option spelling: {@code auto}, {@code shift}, {@code table}, {@code scatter}. */
    public String optionName() {
        return name().toLowerCase(Locale.ROOT);
    }

    /**
     * Parses the option spelling.
     *
     * @throws InputError when the text names no strategy
     */
    public static PinStrategy parse(String text) {
        for (PinStrategy s : values()) {
            if (s.optionName().equalsIgnoreCase(text == null ? "" : text.trim())) {
                return s;
            }
        }
        throw Setting.PIN_STRATEGY.error("'%s' is unknown; use auto, shift, table or scatter", text);
    }
}
