package org.rungtone.analysis;

import java.util.Locale;
import org.rungtone.internal.Checks;

/**
 * The analog low-pass after the ladder (or its absence): none, a first-order RC with −3 dB cutoff
 * {@code fc}, {@code H(s) = 1/(1 + s/ωc)}, or a second-order low-pass with natural frequency {@code f0}
 * and quality factor Q, {@code H(s) = ω0²/(s² + (ω0/Q)·s + ω0²)} (−3 dB at f0 only for Q = 1/√2; a
 * unity-gain Sallen-Key stage realises it). DC gain is 1 in every case.
 *
 * @param kind which filter
 * @param cutoffHz fc or f0 in hertz (0 for none)
 * @param q quality factor (second order only; 0 otherwise)
 */
public record ReconstructionFilter(Kind kind, double cutoffHz, double q) {
    /** Filter kinds. */
    public enum Kind {
        /** No filter: the raw zero-order-hold staircase. */
        NONE,
        /** First-order RC low-pass. */
        FIRST_ORDER,
        /** Second-order low-pass with Q. */
        SECOND_ORDER
    }

    /** Checks the parameters. */
    public ReconstructionFilter {
        Checks.checkArgument(kind != null, "filter kind is missing");
        if (kind == Kind.NONE) {
            Checks.checkArgument(cutoffHz == 0 && q == 0, "no filter takes no cutoff or Q");
        } else {
            Checks.checkPositive(cutoffHz, "filter cutoff");
        }
        if (kind == Kind.SECOND_ORDER) {
            Checks.checkPositive(q, "filter Q");
        } else {
            Checks.checkArgument(q == 0, "only a second-order filter takes a Q");
        }
    }

    /** Q of the second-order filter when none is given: 1/sqrt(2), the maximally flat (Butterworth) Q. */
    public static final double DEFAULT_Q = Math.sqrt(0.5);

    /**
     * Parses the filter notation shared by the command line and project files: {@code none}, {@code rc:HZ}
     * or {@code lp2:HZ[:Q]}, e.g. {@code lp2:6k}.
     *
     * @throws org.rungtone.internal.InputError with an example when the text is not a filter
     */
    public static ReconstructionFilter parse(String text) {
        String[] parts = text.trim().toLowerCase(java.util.Locale.ROOT).split(":", -1);
        try {
            if (parts.length == 1 && parts[0].equals("none")) {
                return none();
            }
            if (parts.length == 2 && parts[0].equals("rc")) {
                return firstOrder(org.rungtone.internal.Checks.checkPositive(
                        org.rungtone.internal.Units.parse(parts[1], "Hz"), "filter cutoff"));
            }
            if ((parts.length == 2 || parts.length == 3) && parts[0].equals("lp2")) {
                double q = parts.length == 3 ? org.rungtone.internal.Checks.checkPositive(
                        org.rungtone.internal.Units.parse(parts[2], ""), "filter Q") : DEFAULT_Q;
                return secondOrder(org.rungtone.internal.Checks.checkPositive(
                        org.rungtone.internal.Units.parse(parts[1], "Hz"), "filter cutoff"), q);
            }
        } catch (org.rungtone.internal.InputError e) {
            throw new org.rungtone.internal.InputError("'" + text + "': " + e.getMessage(), e);
        }
        throw new org.rungtone.internal.InputError("'" + text + "' is not a filter; write none, rc:3.4k or"
                + " lp2:3.4k[:0.707]");
    }

    /** No reconstruction filter. */
    public static ReconstructionFilter none() {
        return new ReconstructionFilter(Kind.NONE, 0, 0);
    }

    /** A first-order RC low-pass, −3 dB at {@code cutoffHz}. */
    public static ReconstructionFilter firstOrder(double cutoffHz) {
        return new ReconstructionFilter(Kind.FIRST_ORDER, cutoffHz, 0);
    }

    /** A second-order low-pass with natural frequency {@code cutoffHz} and quality factor {@code q}. */
    public static ReconstructionFilter secondOrder(double cutoffHz, double q) {
        return new ReconstructionFilter(Kind.SECOND_ORDER, cutoffHz, q);
    }

    /** |H(j2πf)|. */
    public double magnitude(double hz) {
        switch (kind) {
            case FIRST_ORDER:
                return 1 / Math.hypot(1, hz / cutoffHz);
            case SECOND_ORDER:
                double u = hz / cutoffHz;
                return 1 / Math.hypot(1 - u * u, u / q);
            default:
                return 1;
        }
    }

    /** 20·log10|H(j2πf)|. */
    public double responseDb(double hz) {
        return 20 * Math.log10(magnitude(hz));
    }

    /**
     * The record's usual text, written out: the generated method builds its method handles on first use, which
     * costs a start-up tens of milliseconds, and the command line turns every option value into text.
     */
    @Override
    public String toString() {
        return "ReconstructionFilter[kind=" + kind + ", cutoffHz=" + cutoffHz + ", q=" + q + "]";
    }

    /** Short description for reports: "none", "RC 3.4 kHz", "2nd order 3.4 kHz Q 0.71". */
    public String describe() {
        switch (kind) {
            case FIRST_ORDER:
                return String.format(Locale.ROOT, "RC %.4g Hz", cutoffHz);
            case SECOND_ORDER:
                return String.format(Locale.ROOT, "2nd order %.4g Hz Q %.3g", cutoffHz, q);
            default:
                return "none";
        }
    }
}
