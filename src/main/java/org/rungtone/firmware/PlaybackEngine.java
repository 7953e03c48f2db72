package org.rungtone.firmware;

import java.util.Locale;
import org.rungtone.internal.InputError;
import org.rungtone.internal.Setting;

/** What the emitted player does at every tick. */
public enum PlaybackEngine {
    /** One-shot playback of stored sounds, with start, stop and a done flag. */
    CLIP,
    /** Like {@link #CLIP}, plus looping between each sound's loop points and a release. */
    LOOP,
    /** A direct digital synthesis oscillator over one stored period (see {@link Dds}). */
    DDS,
    /** Steps the ladder through a list of codes, on a timer or a button (see {@link SweepSpec}). */
    SWEEP;

    /** The option spelling: {@code clip}, {@code loop}, {@code dds}, {@code sweep}. */
    public String optionName() {
        return name().toLowerCase(Locale.ROOT);
    }

    /**
     * Parses the option spelling.
     *
     * @throws InputError when the text names no engine
     */
    public static PlaybackEngine parse(String text) {
        for (PlaybackEngine e : values()) {
            if (e.optionName().equalsIgnoreCase(text == null ? "" : text.trim())) {
                return e;
            }
        }
        throw Setting.ENGINE.error("'%s' is unknown; use clip, loop, dds or sweep", text);
    }
}
