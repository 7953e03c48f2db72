package org.rungtone.internal;

/**
 * Every setting a user can give, named by its key as a project file spells it ({@code quantize.rate} is
 * {@code rate} in the {@code [quantize]} table). Stages name settings only through these keys; the command
 * line maps a key to its option ({@code --rate}) and a project reader to the file and line where the key was
 * typed. Settings that exist only on the command line get a key in a section of their own ({@code sweep.hold}).
 */
public enum Setting {
    /** The project's name, or one sound's name: the C symbol prefix. */
    NAME("sound.name"),
    /** The output folder. */
    OUT("project.out"),
    /** The folder of the emitted C files, when apart from the output folder. */
    C_OUT("project.c_out"),
    /** Seed of every random process. */
    SEED("project.seed"),
    /** A measured unit profile. */
    UNIT("project.unit"),
    /** Quantize onto the board's real levels. */
    COMPENSATION("project.compensation"),
    /** The source file of a sound. */
    SOURCE("sound.source"),
    /** Which channel of the source, 0 to mix down. */
    CHANNEL("sound.channel"),
    /** Fixed gain. */
    GAIN("sound.gain"),
    /** Peak normalization target. */
    NORMALIZE("sound.normalize"),
    /** Trim threshold. */
    TRIM("sound.trim"),
    /** Fade-in time. */
    FADE_IN("sound.fade_in"),
    /** Fade-out time. */
    FADE_OUT("sound.fade_out"),
    /** Keep the source's mean. */
    KEEP_DC("sound.keep_dc"),
    /** Resampler design. */
    RESAMPLER("sound.resampler"),
    /** Loop points. */
    LOOP("sound.loop"),
    /** DAC bit depth. */
    BITS("quantize.bits"),
    /** Target sample rate. */
    RATE("quantize.rate"),
    /** Dither kind. */
    DITHER("quantize.dither"),
    /** Error-feedback noise shaping. */
    SHAPING("quantize.shaping"),
    /** What full scale maps onto. */
    SPAN("quantize.span"),
    /** Reconstruction filter after the DAC. */
    FILTER("preview.filter"),
    /** Preview WAV sample rate. */
    PREVIEW_RATE("preview.rate"),
    /** Longest preview. */
    PREVIEW_LENGTH("preview.length"),
    /** Reference voltage of the ideal ladder. */
    FULL_SCALE("preview.full_scale"),
    /** The survey's bit depths. */
    SURVEY_BITS("survey.bits_list"),
    /** The survey's sample rates. */
    SURVEY_RATES("survey.rates"),
    /** The survey's least acceptable SINAD. */
    TARGET_SINAD("survey.target_sinad"),
    /** The survey's least acceptable effective number of bits. */
    TARGET_ENOB("survey.target_enob"),
    /** Target family of the player. */
    FAMILY("target.family"),
    /** CPU or timer clock. */
    CPU_CLOCK("target.cpu_clock"),
    /** Timer that paces the player. */
    TIMER("target.timer"),
    /** Pins of the ladder, bit 0 first. */
    PINS("target.pins"),
    /** Port width of the generic target. */
    PORT_WIDTH("target.port_width"),
    /** How codes become port values. */
    PIN_STRATEGY("target.pin_strategy"),
    /** How samples are stored. */
    STORAGE("target.storage"),
    /** Player engine. */
    ENGINE("target.engine"),
    /** Largest tick-rate error. */
    RATE_TOLERANCE("target.rate_tolerance"),
    /** Most flash the samples may take. */
    FLASH_BUDGET("target.flash_budget"),
    /** Attribute that keeps a bare array in flash. */
    FLASH_ATTR("target.flash_attr"),
    /** DDS start frequency. */
    DDS_FREQUENCY("target.dds_frequency"),
    /** DDS phase accumulator width. */
    DDS_PHASE_BITS("target.dds_phase_bits"),
    /** The user's own template folder. */
    TEMPLATES("target.templates"),
    /** The sweep program's step button. */
    BUTTON("sweep.button"),
    /** The sweep program's hold time per code. */
    HOLD("sweep.hold"),
    /** The sweep program is for a sound card's recording: framed by patterns a fit can find. */
    RECORDING("sweep.recording"),
    /** The meter's step for every reading of a measurements file. */
    RESOLUTION("fit.resolution"),
    /** The day a board was measured or recorded. */
    DATE("fit.date"),
    /** The counts of the meter a plan chooses its codes for. */
    METER_COUNTS("plan.meter_counts"),
    /** Check codes a plan measures on top of the basis. */
    VERIFY("plan.verify"),
    /** A plan measures every code. */
    EVERY_CODE("plan.every_code"),
    /** A meter reading of the all-ones code that scales a recording's relative levels to volts. */
    FULL_SCALE_READING("listen.full_scale_reading");

    private final String key;

    Setting(String key) {
        this.key = key;
    }

    /** The key as a project file spells it, section first: {@code quantize.rate}. */
    public String key() {
        return key;
    }

    /** The key's place-holder in a {@link SettingError} message: {@code {quantize.rate}}. */
    public String ref() {
        return "{" + key + "}";
    }

    /**
     * An error about this setting. The message follows the setting's name: {@code RATE.error("must be 1 Hz..384
     * kHz: %s", r)} reads "--rate must be …" on the command line and "FILE:LINE: quantize.rate must be …" from a
     * project file; {@link #ref()} names another setting inside the text.
     */
    public SettingError error(String format, Object... args) {
        return new SettingError(this, ref() + " " + String.format(java.util.Locale.ROOT, format, quoted(args)),
                null);
    }

    /**
     * An error about this setting whose text is free: {@code format} names settings through their
     * {@link #ref()} place-holders, this one included.
     */
    public SettingError problem(String format, Object... args) {
        return new SettingError(this, String.format(java.util.Locale.ROOT, format, quoted(args)), null);
    }

    /** The arguments with a brace in the user's text kept from reading as a place-holder. */
    private static Object[] quoted(Object[] args) {
        Object[] out = args.clone();
        for (int i = 0; i < out.length; i++) {
            if (out[i] instanceof CharSequence || out[i] instanceof java.nio.file.Path) {
                String text = out[i].toString();
                // a place-holder of ours is passed as a whole argument; anything else is the user's text
                if (!text.matches("\\{[a-z_]+\\.[a-z_]+\\}")) {
                    out[i] = text.replace("{", SettingError.OPEN_BRACE);
                }
            }
        }
        return out;
    }

    /** Throws {@link #error} when {@code condition} is false. */
    public void check(boolean condition, String format, Object... args) {
        if (!condition) {
            throw error(format, args);
        }
    }

    /** The setting with this key. */
    public static java.util.Optional<Setting> ofKey(String key) {
        for (Setting s : values()) {
            if (s.key.equals(key)) {
                return java.util.Optional.of(s);
            }
        }
        return java.util.Optional.empty();
    }
}
