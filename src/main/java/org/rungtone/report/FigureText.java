package org.rungtone.report;

import java.util.Locale;
import org.rungtone.analysis.ToneReport;

/**
 * The wording every report uses for figures whose meaning depends on how they were measured: THD and SFDR
 * that the noise limits, and the two ENOBs. One place, so the text, HTML and plots say the same.
 */
final class FigureText {
    /** Label of ENOB held against a full-scale sine (IEEE Std 1241-2010). */
    static final String ENOB_FULL_SCALE = "ENOB (re full scale)";
    /** Label of ENOB of the signal at its own level. */
    static final String ENOB_SIGNAL = "ENOB (re signal)";

    private FigureText() {
    }

    /** THD as a value: "-50.0 dB", or "< -73.5 dB" when no harmonic stands out of the noise. */
    static String thd(ToneReport t) {
        return (t.thdBelowNoise() ? "< " : "") + db(t.thdDb());
    }

    /** SFDR as a value: "50.0 dB", or ">= 58.1 dB" when no spur stands out of the noise. */
    static String sfdr(ToneReport t) {
        return (t.sfdrLimitedByNoise() ? ">= " : "") + db(t.sfdrDb());
    }

    /** THD with what a limit means: "-50.0 dB" or "< -73.5 dB (below the noise: no harmonic stands out)". */
    static String thdExplained(ToneReport t) {
        return thd(t) + (t.thdBelowNoise() ? " (below the noise: no harmonic stands out)" : "");
    }

    /** SFDR with what a limit means: "50.0 dB" or ">= 58.1 dB (limited by the noise: no spur stands out)". */
    static String sfdrExplained(ToneReport t) {
        return sfdr(t) + (t.sfdrLimitedByNoise() ? " (limited by the noise: no spur stands out)" : "");
    }

    /** A harmonic's level in dBc: "-47.0", or "< -80.2" when it does not stand out of the noise. */
    static String harmonic(ToneReport.Harmonic h) {
        return (h.standsOut() ? "" : "< ") + f1(h.levelDbc());
    }

    static String f1(double v) {
        return Double.isInfinite(v) ? (v > 0 ? "inf" : "-inf") : String.format(Locale.ROOT, "%.1f", v);
    }

    static String f2(double v) {
        return Double.isInfinite(v) ? (v > 0 ? "inf" : "-inf") : String.format(Locale.ROOT, "%.2f", v);
    }

    private static String db(double v) {
        return f1(v) + " dB";
    }
}
