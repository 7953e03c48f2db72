package org.rungtone.analysis;

import java.util.Locale;
import org.rungtone.internal.Checks;

/**
 * The quality a survey setting must reach: a SINAD in dB or an ENOB in bits (as defined in
 * {@link AudioMetrics}).
 *
 * @param kind which figure
 * @param value the least acceptable value
 */
public record SurveyTarget(Kind kind, double value) {
    /** The figure a target applies to. */
    public enum Kind {
        /** Full-band SINAD in dB. */
        SINAD_DB,
        /** Effective number of bits. */
        ENOB_BITS
    }

    /** Checks the value. */
    public SurveyTarget {
        Checks.checkArgument(kind != null, "target kind is missing");
        Checks.checkInput(Double.isFinite(value), "the target must be a finite number: %s", value);
    }

    /** A SINAD target in dB. */
    public static SurveyTarget sinadDb(double db) {
        return new SurveyTarget(Kind.SINAD_DB, db);
    }

    /** An ENOB target in bits. */
    public static SurveyTarget enobBits(double bits) {
        return new SurveyTarget(Kind.ENOB_BITS, bits);
    }

    /** True when the figures reach the target. */
    public boolean isMet(double sinadDb, double enobBits) {
        return (kind == Kind.SINAD_DB ? sinadDb : enobBits) >= value;
    }

    /** For reports: "SINAD >= 40 dB", "ENOB >= 7.5 bits". */
    public String describe() {
        return kind == Kind.SINAD_DB ? String.format(Locale.ROOT, "SINAD >= %.4g dB", value)
                : String.format(Locale.ROOT, "ENOB >= %.4g bits", value);
    }
}
