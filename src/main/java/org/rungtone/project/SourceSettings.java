package org.rungtone.project;

import java.nio.file.Path;
import org.rungtone.internal.Setting;

/**
 * Where one sound comes from.
 *
 * @param file the WAV file or .rung script
 * @param channel 0 to mix all channels down, 1..8 to pick one
 * @param name the sound's name as the user gave it (or the file's stem), before it became a C symbol
 */
public record SourceSettings(Path file, int channel, String name) {
    /** Validates the channel. */
    public SourceSettings {
        Setting.CHANNEL.check(channel >= 0 && channel <= 8, "must be 0 (mix down) or 1..8: %d", channel);
    }
}
