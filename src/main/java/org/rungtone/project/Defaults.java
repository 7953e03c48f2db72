package org.rungtone.project;

import org.rungtone.analysis.ReconstructionFilter;
import org.rungtone.quantize.Compensation;
import org.rungtone.quantize.Dither;
import org.rungtone.quantize.ErrorFilter;

/**
 * Every setting's default, in one place: the build plan's builder, project builds and the command line's
 * option defaults (checked against these by a test) all take them from here.
 */
public final class Defaults {
    /** Sample rate when neither the user nor a script names one. */
    public static final double RATE_HZ = 16_000;
    /** Dither. */
    public static final Dither DITHER = Dither.TPDF;
    /** Noise shaping. */
    public static final ErrorFilter SHAPING = ErrorFilter.NONE;
    /** Seed of every random process. */
    public static final long SEED = 1;
    /** With a board whose levels are known. */
    public static final Compensation COMPENSATION = Compensation.ON;
    /** Peak normalization when no gain is given, in dBFS: a little headroom for the resampler's ripple. */
    public static final double NORMALIZE_DBFS = -1.0;
    /** Preview WAV rate. */
    public static final double PREVIEW_RATE_HZ = 44_100;
    /** Longest preview: a minute is plenty to listen to; longer sounds are measured whole. */
    public static final double PREVIEW_SECONDS = 60;
    /** Reference voltage of the ideal ladder. */
    public static final double FULL_SCALE_VOLTS = 5.0;

    private Defaults() {
    }

    /** The reconstruction filter after the DAC: none. */
    public static ReconstructionFilter filter() {
        return ReconstructionFilter.none();
    }
}
