package org.rungtone.report;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.rungtone.analysis.CodeUse;
import org.rungtone.analysis.ListenerReport;
import org.rungtone.analysis.ToneReport;
import org.rungtone.internal.Units;

/**
 * The wording every report uses for figures whose meaning depends on how they were measured: THD and SFDR
 * that the noise limits, and the two ENOBs. One place, so the text, HTML and plots say the same.
 */
final class FigureText {
    /** Label of ENOB held against a full-scale sine (IEEE Std 1241-2010). */
    static final String ENOB_FULL_SCALE = "ENOB (re full scale)";
    /** Label of ENOB of the signal at its own level. */
    static final String ENOB_SIGNAL = "ENOB (re signal)";
    /** Label of the listener's SNR over the audio band. */
    static final String LISTENER_SNR = "listener SNR (20 kHz band)";
    /** Label of the listener's A-weighted SNR. */
    static final String LISTENER_A_WEIGHTED = "listener SNR (A-weighted)";

    /** What every report says its figures mean. */
    private static final List<String> DEFINITIONS = List.of(
            "quantization only: each case's levels against the conditioned source at the target rate, gain and"
                    + " offset aligned; what the rate itself loses does not show there",
            "ENOB (re full scale) = (SINAD - 1.76)/6.02 with the SINAD a full-scale sine would have (IEEE 1241);"
                    + " ENOB (re signal) uses the sound's own SINAD, lower by its level below full scale",
            "listener SNR: the board's output through the hold and the filter against the source as supplied,"
                    + " 20 Hz to 20 kHz, one gain, delay and phase removed; noise, images and lost treble all count",
            "THD: harmonics 2-10 less the noise in their bins (IEEE 1241); SFDR: against the largest spur 13 dB"
                    + " above the local noise and above the noise's peaks; '<' and '>=' mark limits the noise sets",
            "end codes: samples on the lowest or highest level; with noise shaping the signal is scaled, when"
                    + " needed, so its peak plus the feedback's worst-case excursion, sum|h|*(step/2 + dither peak)"
                    + " + dither peak, stays within them");

    private FigureText() {
    }

    /** THD as a value: "-50.0 dB", or "< -73.5 dB" when no harmonic stands out of the noise. */
    static String thd(ToneReport t) {
        return (t.thdBelowNoise() ? "< " : "") + db(t.thdDb());
    }

    /** SFDR as a value: "50.0 dB", or ">= 58.1 dB" when no spur rises above the noise's peaks. */
    static String sfdr(ToneReport t) {
        return (t.sfdrLimitedByNoise() ? ">= " : "") + db(t.sfdrDb());
    }

    /** THD with what a limit means: "-50.0 dB" or "< -73.5 dB (below the noise: no harmonic stands out)". */
    static String thdExplained(ToneReport t) {
        return thd(t) + (t.thdBelowNoise() ? " (below the noise: no harmonic stands out)" : "");
    }

    /** SFDR with what a limit means: "50.0 dB" or ">= 58.1 dB (limited by the noise: ...)". */
    static String sfdrExplained(ToneReport t) {
        return sfdr(t) + (t.sfdrLimitedByNoise() ? " (limited by the noise: no spur rises above its peaks)" : "");
    }

    /** A harmonic's level in dBc: "-47.0", or "< -80.2" when it does not stand out of the noise. */
    static String harmonic(ToneReport.Harmonic h) {
        return (h.standsOut() ? "" : "< ") + f1(h.levelDbc());
    }

    /** The definitions of the figures, one line each. */
    static List<String> definitions() {
        return DEFINITIONS;
    }

    /** What the listener figures compared: "the preview at 44.1kHz against the source as supplied, 3.00 s". */
    static String listenerScope(ListenerReport l) {
        return String.format(Locale.ROOT, "the board's output as the preview renders it, against the source as"
                + " supplied, both at %s, %s to %s, first %.2f s", Units.format(l.analysisRateHz(), "Hz"),
                Units.format(l.bandLowHz(), "Hz"), Units.format(l.bandTopHz(), "Hz"), l.analysedSeconds());
    }

    /** The headroom noise shaping left: how much the signal was scaled, and why. */
    static String headroom(CodeUse u) {
        String excursion = String.format(Locale.ROOT, "the feedback's worst-case excursion (%.1f LSB)",
                u.feedbackExcursionLsb());
        if (u.headroomGainDb() < 0) {
            return String.format(Locale.ROOT, "signal scaled by %.2f dB so its peak plus %s stays within the end"
                    + " codes", u.headroomGainDb(), excursion);
        }
        if (u.headroomKept()) {
            return "none needed: the peak plus " + excursion + " stays within the end codes";
        }
        return String.format(Locale.ROOT, "none kept: the peak plus %s can pass the end codes; %d samples"
                + " overloaded", excursion, u.overloadSamples());
    }

    /** Samples on the end codes and their share: "1234 (1.234 %)", with {@code gap} before the bracket. */
    static String endCodes(CodeUse u, String gap) {
        return u.endCodeSamples() + gap + String.format(Locale.ROOT, "(%.3f %%)", 100 * u.endCodeFraction());
    }

    /** Flash used as a share of the budget: "97.5 %" (one decimal in every report). */
    static String budgetShare(long usedBytes, long budgetBytes) {
        return String.format(Locale.ROOT, "%.1f %%", 100.0 * usedBytes / budgetBytes);
    }

    /** A sound's warnings as every report lists them: the build's own, then the preview's ringing. */
    static List<String> soundWarnings(BuildSummary s) {
        List<String> w = new ArrayList<>(s.warnings());
        if (s.preview().peak() > 1) {
            w.add(String.format(Locale.ROOT, "the preview's filter rings %.1f %% past full scale;"
                    + " the preview WAV clips there", 100 * (s.preview().peak() - 1)));
        }
        return w;
    }

    static String f1(double v) {
        return Double.isNaN(v) ? "n/a" : Double.isInfinite(v) ? (v > 0 ? "inf" : "-inf")
                : String.format(Locale.ROOT, "%.1f", v);
    }

    static String f2(double v) {
        return Double.isNaN(v) ? "n/a" : Double.isInfinite(v) ? (v > 0 ? "inf" : "-inf")
                : String.format(Locale.ROOT, "%.2f", v);
    }

    private static String db(double v) {
        return f1(v) + " dB";
    }
}
