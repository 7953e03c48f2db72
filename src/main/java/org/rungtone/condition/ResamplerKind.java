package org.rungtone.condition;

import java.util.Locale;
import org.rungtone.internal.Setting;

/** The resampler designs a user can choose: ours ({@code kaiser}) or TarsosDSP's ({@code tarsos}). */
public enum ResamplerKind {
    /** Kaiser-windowed sinc with the stopband set by the deepest bit depth. */
    KAISER,
    /** TarsosDSP's high-quality resampler. */
    TARSOS;

    /** The resampler of this design for codes of up to {@code maxBits}. */
    public Resampler create(int maxBits) {
        return this == TARSOS ? new TarsosResampler() : KaiserResampler.forBits(maxBits);
    }

    /** The name as users write it. */
    public String key() {
        return name().toLowerCase(Locale.ROOT);
    }

    /**
     * The design named {@code text}, case-insensitive.
     *
     * @throws org.rungtone.internal.SettingError for any other name
     */
    public static ResamplerKind parse(String text) {
        for (ResamplerKind k : values()) {
            if (k.key().equalsIgnoreCase(text.trim())) {
                return k;
            }
        }
        throw Setting.RESAMPLER.error("must be kaiser or tarsos: %s", text);
    }
}
