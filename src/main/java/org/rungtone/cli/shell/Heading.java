package org.rungtone.cli.shell;

/** The headings options are listed under in a command's help, in the order they are shown. */
public enum Heading {
    /** The source and which of its channels. */
    INPUT("Input"),
    /** Resampling, level, trimming and fades. */
    CONDITIONING("Conditioning"),
    /** The ladder's description, a measured unit profile, linearity and design. */
    LADDER("Ladder"),
    /** Simulated boards drawn from the parts' tolerance. */
    MONTE_CARLO("Monte Carlo"),
    /** Bit depth, dither, noise shaping, onto which levels. */
    QUANTIZING("Quantizing"),
    /** What a survey's choice must reach and fit. */
    CHOICE("Choice"),
    /** The player or sweep program: target, pins, timer, storage, engine, flash. */
    FIRMWARE("Firmware"),
    /** Which codes to measure and how the meter reads. */
    MEASURING("Measuring"),
    /** Where results go and how they are printed; options without a heading of their own. */
    OUTPUT("Output");

    private final String title;

    Heading(String title) {
        this.title = title;
    }

    /** The heading as help prints it, without the colon. */
    public String title() {
        return title;
    }
}
